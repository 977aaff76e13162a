import type { QueryClient } from '@tanstack/react-query';
import { deliveryGreenGrams } from '@shared/domain/delivery-plan';
import { defaultShopSettings } from '@shared/schemas/settings';
import { ArrowLeft } from 'lucide-react';
import { lazy, Suspense, useState, useSyncExternalStore } from 'react';
import { Link, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import type { GreenBagSize, HomeRoastDevice, RoastLevel } from '@shared/domain/vocabulary';
import type { LotDetail } from '@shared/schemas/lots';
import { NotFoundMessage } from '@/components/errors/not-found-message';
import { HomeRoastingCautions } from '@/components/safety/home-roasting-cautions';
import { PageTitle } from '@/components/seo/page-title';
import { ErrorState } from '@/components/ui/error-state';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { useCart } from '@/features/cart/hooks/use-cart';
import { useLot, getLotQueryOptions } from '@/features/lots/api/get-lot';
import { HomeRoastGuide } from '@/features/lots/components/home-roast-guide';
import { LotDetails } from '@/features/lots/components/lot-details';
import { LotPurchasePanel } from '@/features/lots/components/lot-purchase-panel';
import { WeightUnitToggle } from '@/features/lots/components/weight-unit-toggle';
import { isPriceUnit } from '@/features/lots/utils/price-per-unit';
import type { WeightUnit } from '@/features/lots/utils/weight-unit';
import { ApiError } from '@/lib/api-client';

// Below the fold and shown only from enough roasts: its code loads after the page's own.
const LotRoastSummary = lazy(() => import('@/features/journal/components/lot-roast-summary').then((module) => ({ default: module.LotRoastSummary })));

const noSubscription = () => () => {};
/**
 * False on the server and while the browser takes the drawn page over, true after: the server
 * draws the page in one pass and cannot wait for a part that loads lazily.
 */
const useInBrowser = () =>
  useSyncExternalStore(
    noSubscription,
    () => true,
    () => false,
  );

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) => {
    if (params.code) void queryClient.prefetchQuery(getLotQueryOptions(params.code));
    return null;
  };

function LotPageSkeleton() {
  return (
    <div className="grid gap-8 lg:grid-cols-2">
      <p role="status" className="sr-only">
        Loading the lot…
      </p>
      <Skeleton className="aspect-[4/3] rounded-card" />
      <div className="flex flex-col gap-3">
        <Skeleton className="h-4 w-1/3" />
        <Skeleton className="h-10 w-3/4" />
        <Skeleton className="h-8 w-1/2" />
        <Skeleton className="h-24" />
      </div>
    </div>
  );
}

/** The lot, its size picker and its Home Roast Guide, which follow the same bag size and weight unit. */
function LotPage({ lot }: { lot: LotDetail }) {
  const cart = useCart();
  const [size, setSize] = useState<GreenBagSize>('1lb');
  const priceUnitParam = useSearchParams()[0].get('priceUnit');
  const priceUnit = isPriceUnit(priceUnitParam) ? priceUnitParam : 'kg';
  // A visitor who reads prices per lb reads weights in US units too.
  const [unit, setUnit] = useState<WeightUnit>(priceUnit === 'lb' ? 'oz' : 'g');
  const [device, setDevice] = useState<HomeRoastDevice>('popper');
  const [level, setLevel] = useState<RoastLevel>(lot.suggestedLevel);

  const addToCart = (chosen: GreenBagSize, quantity: number) =>
    cart.add({
      lotCode: lot.code,
      lotName: lot.name,
      size: chosen,
      quantity,
      pricePerKgCents: lot.pricePerKgCents,
      priceBreaks: lot.priceBreaks,
    });

  return (
    <>
      <LotDetails
        lot={lot}
        priceUnit={priceUnit}
        weightUnit={unit}
        purchase={
          <>
            <div className="mb-3">
              <WeightUnitToggle unit={unit} onChange={setUnit} />
            </div>
            <LotPurchasePanel lot={lot} size={size} onSizeChange={setSize} unit={unit} onAddToCart={addToCart} />
          </>
        }
      />
      <HomeRoastGuide lotCode={lot.code} size={size} unit={unit} device={device} onDeviceChange={setDevice} level={level} onLevelChange={setLevel} />
    </>
  );
}

/** Whether the lot holds the green for one delivery of its smallest bag (the server checks the real choice at checkout). */
function canRoastForSubscription(lot: { stockGrams: number; suggestedLevel: RoastLevel }) {
  return lot.stockGrams >= deliveryGreenGrams({ roastLevel: lot.suggestedLevel, bagSize: '12oz', bagsPerDelivery: 1 }, defaultShopSettings);
}

export default function LotRoute() {
  const { code = '' } = useParams();
  const lotQuery = useLot(code);
  const inBrowser = useInBrowser();

  const backLink = (
    <Link to={paths.lots.getHref()} className="mb-6 inline-flex min-h-11 items-center gap-1.5 font-semibold text-leaf underline">
      <ArrowLeft aria-hidden="true" className="size-4" />
      All Green Lots
    </Link>
  );

  if (lotQuery.data) {
    return (
      <>
        <PageTitle title={`${lotQuery.data.name} · Green Lots`} />
        {backLink}
        <LotPage key={lotQuery.data.code} lot={lotQuery.data} />
        {canRoastForSubscription(lotQuery.data) ? (
          <p className="mt-8">
            <Link to={paths.subscribe.getHref(new URLSearchParams({ lot: lotQuery.data.code }))} className="font-semibold text-leaf underline">
              Subscribe to this lot, roasted to order
            </Link>
          </p>
        ) : (
          <p className="mt-8">
            This lot is sold out, so we cannot roast it for a subscription.{' '}
            <Link to={paths.subscribe.getHref()} className="font-semibold text-leaf underline">
              Subscribe to the Roaster’s Rotation instead
            </Link>
            , a lot our roaster picks for each roast day.
          </p>
        )}
        <div className="mt-10 max-w-prose">
          {inBrowser ? (
            <Suspense fallback={null}>
              <LotRoastSummary code={lotQuery.data.code} audience="public" />
            </Suspense>
          ) : null}
        </div>
        <div className="mt-10 max-w-prose">
          <HomeRoastingCautions />
          <p className="mt-3">
            <Link to={paths.roastingBasics.getHref()} className="font-semibold text-leaf underline">
              How a roast goes, step by step
            </Link>
          </p>
        </div>
      </>
    );
  }

  if (lotQuery.isError) {
    if (lotQuery.error instanceof ApiError && lotQuery.error.status === 404) {
      return (
        <>
          <PageTitle title="Lot not found" />
          <NotFoundMessage title="Lot not found">No green lot has the code {code}. It may have sold out and been taken off the list.</NotFoundMessage>
        </>
      );
    }
    return (
      <>
        <PageTitle title="Green Lots" />
        {backLink}
        <ErrorState title="This lot could not load" error={lotQuery.error} onRetry={() => void lotQuery.refetch()} />
      </>
    );
  }

  return (
    <>
      <PageTitle title="Green Lots" />
      {backLink}
      <LotPageSkeleton />
    </>
  );
}
