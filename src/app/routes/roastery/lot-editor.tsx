import type { QueryClient } from '@tanstack/react-query';
import { ArrowLeft } from 'lucide-react';
import { useEffect, useRef, type ReactNode } from 'react';
import { Link, useLocation, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { NotFoundMessage } from '@/components/errors/not-found-message';
import { PageTitle } from '@/components/seo/page-title';
import { ErrorState } from '@/components/ui/error-state';
import { FormAlert } from '@/components/ui/form-alert';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { requireUser } from '@/features/auth/utils/require-user';
import { roasteryRoles } from '@/features/auth/utils/roles';
import { getEditableLotQueryOptions, useEditableLot } from '@/features/green-stock/api/get-editable-lot';
import { getGreenStockQueryOptions, useGreenStock } from '@/features/green-stock/api/get-green-stock';
import { getStockMovementsQueryOptions } from '@/features/green-stock/api/stock';
import { LotFilesPanel } from '@/features/green-stock/components/lot-files-panel';
import { LotDescriptorsForm } from '@/features/green-stock/components/lot-forms';
import { LotStockSettings } from '@/features/green-stock/components/lot-stock-settings';
import { StockAdjustmentForm } from '@/features/green-stock/components/stock-adjustment-form';
import { StockHistoryTable } from '@/features/green-stock/components/stock-history-table';
import { LotRoastSummary } from '@/features/journal/components/lot-roast-summary';
import type { GreenStockItem } from '@shared/schemas/green-stock';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    const user = await requireUser(queryClient, request);
    if (params.code && roasteryRoles.includes(user.role)) {
      void queryClient.prefetchQuery(getGreenStockQueryOptions());
      void queryClient.prefetchQuery(getEditableLotQueryOptions(params.code));
      void queryClient.prefetchQuery(getStockMovementsQueryOptions(params.code));
    }
    return null;
  };

/** Set by the new-lot page when it sends the person here. */
export type LotEditorState = { created?: boolean };

function BackToGreenStock() {
  return (
    <p className="mb-4">
      <Link to={paths.roastery.greenStock.getHref()} className="inline-flex min-h-11 items-center gap-1.5 font-semibold text-leaf underline">
        <ArrowLeft aria-hidden="true" className="size-4" />
        All of Green Stock
      </Link>
    </p>
  );
}

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="grid gap-4">
      <h2 id={id} className="text-h2">
        {title}
      </h2>
      {children}
    </section>
  );
}

function CreatedNotice() {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => ref.current?.focus(), []);
  return (
    <div ref={ref} tabIndex={-1} className="mb-6 outline-none">
      <FormAlert tone="status">Lot added with no stock. Record its arrival below to put it in stock.</FormAlert>
    </div>
  );
}

/** The lot's descriptors, photos and spec sheet, once the API has given them. */
function LotContent({ code, item }: { code: string; item: GreenStockItem }) {
  const lotQuery = useEditableLot(code);
  if (lotQuery.data) {
    return (
      <>
        <Section id="lot-files" title="Photos and spec sheet">
          <LotFilesPanel lot={lotQuery.data} />
        </Section>
        <Section id="lot-descriptors" title="Descriptors">
          <LotDescriptorsForm lot={lotQuery.data} settings={{ reorderPointGrams: item.reorderPointGrams, isListed: item.isListed }} />
        </Section>
      </>
    );
  }
  if (lotQuery.isError) {
    return <ErrorState title="The lot’s descriptors could not load" error={lotQuery.error} onRetry={() => void lotQuery.refetch()} />;
  }
  return (
    <div>
      <p role="status" className="sr-only">
        Loading the lot’s descriptors…
      </p>
      <Skeleton className="h-96 rounded-card" />
    </div>
  );
}

export default function LotEditorRoute() {
  const { code = '' } = useParams();
  const created = (useLocation().state as LotEditorState | null)?.created === true;
  const stockQuery = useGreenStock();
  const item = stockQuery.data?.items.find((each) => each.code === code);

  if (stockQuery.isError) {
    return (
      <>
        <PageTitle title="Lot · Green Stock · Roastery" />
        <BackToGreenStock />
        <ErrorState title="This lot could not load" error={stockQuery.error} onRetry={() => void stockQuery.refetch()} />
      </>
    );
  }
  if (!stockQuery.data) {
    return (
      <>
        <PageTitle title="Lot · Green Stock · Roastery" />
        <p role="status" className="sr-only">
          Loading the lot…
        </p>
        <Skeleton className="mb-4 h-10 w-1/2" />
        <Skeleton className="h-64" />
      </>
    );
  }
  if (!item) {
    return (
      <>
        <PageTitle title="Lot not found · Roastery" />
        <BackToGreenStock />
        <NotFoundMessage title="Lot not found">There is no lot with the code {code}.</NotFoundMessage>
      </>
    );
  }

  return (
    <>
      <PageTitle title={`${item.name} · Green Stock · Roastery`} />
      <BackToGreenStock />
      <PageHeader eyebrow={`Green Stock · ${item.code}`} title={item.name} />
      {created ? <CreatedNotice /> : null}
      {/* Keyed by lot, so moving to another lot starts its forms afresh. */}
      <div key={item.code} className="grid gap-12">
        <LotRoastSummary code={item.code} audience="staff" />
        <Section id="lot-stock" title="Stock">
          <LotStockSettings item={item} windowDays={stockQuery.data.windowDays} />
          <div className="rounded-card border border-rule bg-sheet p-4 sm:p-5">
            <h3 className="mb-3 text-h3">Record a stock change</h3>
            <StockAdjustmentForm code={item.code} />
          </div>
        </Section>
        <Section id="lot-history" title="Stock history">
          <StockHistoryTable code={item.code} />
        </Section>
        <LotContent code={item.code} item={item} />
      </div>
    </>
  );
}
