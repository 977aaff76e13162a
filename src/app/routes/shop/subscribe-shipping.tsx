import { useQuery, type QueryClient } from '@tanstack/react-query';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { roastersRotationName } from '@shared/domain/vocabulary';
import { PageTitle } from '@/components/seo/page-title';
import { buttonStyles } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { getAddressesQueryOptions, useAddresses } from '@/features/addresses/api/get-addresses';
import { requireUser } from '@/features/auth/utils/require-user';
import { getLotQueryOptions } from '@/features/lots/api/get-lot';
import { useSubscriptionPreview } from '@/features/subscriptions/api/get-subscription-preview';
import { SubscriptionCheckoutForm } from '@/features/subscriptions/components/subscription-checkout-form';
import { SubscriptionChoiceSummary } from '@/features/subscriptions/components/subscription-choice-summary';
import { SubscriptionPricePreview } from '@/features/subscriptions/components/subscription-price-preview';
import { completeBuildFromSearch, searchFromBuilder } from '@/features/subscriptions/utils/builder-search';
import type { SubscriptionBuild } from '@/features/subscriptions/utils/subscription-form';

/** Subscribing needs an account: a visitor signs in (or creates one) and comes back here, choices intact in the URL. */
export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    void queryClient.prefetchQuery(getAddressesQueryOptions());
    return null;
  };

function Shipping({ build }: { build: SubscriptionBuild }) {
  const addressesQuery = useAddresses();
  const lotQuery = useQuery({ ...getLotQueryOptions(build.lotCode ?? ''), enabled: build.lotCode !== null });
  const { grind: _grind, ...previewChoice } = build;
  const preview = useSubscriptionPreview(previewChoice);
  // The saved address checkout starts from: the one marked default, which the server lists first.
  const initialAddress = addressesQuery.data?.items[0];
  const coffee = build.lotCode === null ? roastersRotationName : (lotQuery.data?.name ?? build.lotCode);

  return (
    <div className="grid gap-10 lg:grid-cols-2">
      <section aria-labelledby="subscription-summary">
        <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="subscription-summary" className="text-h2">
            Your subscription
          </h2>
          <Link to={paths.subscribe.getHref(searchFromBuilder(build))} className="font-semibold text-leaf underline">
            Change your choices
          </Link>
        </div>
        <div className="grid gap-6 rounded-card border border-rule bg-sheet p-5">
          <SubscriptionChoiceSummary build={build} coffee={coffee} />
          <SubscriptionPricePreview
            preview={preview.data}
            updating={preview.isFetching}
            error={preview.error}
            onRetry={() => void preview.refetch()}
            cadenceWeeks={build.cadenceWeeks}
          />
        </div>
      </section>
      <section aria-labelledby="subscription-address">
        <h2 id="subscription-address" className="mb-3 text-h2">
          Where it ships
        </h2>
        {addressesQuery.isPending ? (
          <Skeleton className="h-96" />
        ) : (
          <SubscriptionCheckoutForm build={build} initialAddress={initialAddress} addressBookEmpty={!initialAddress} />
        )}
      </section>
    </div>
  );
}

export default function SubscribeShippingRoute() {
  const [search] = useSearchParams();
  const build = completeBuildFromSearch(search);
  return (
    <>
      <PageTitle title="Roasted to Order · Shipping" />
      <PageHeader eyebrow="Roasted to Order" title="Where your coffee ships" />
      {build ? (
        <Shipping build={build} />
      ) : (
        <EmptyState
          title="Your choices are incomplete"
          action={
            <Link to={paths.subscribe.getHref(search)} className={buttonStyles('primary')}>
              Back to Roasted to Order
            </Link>
          }
        >
          This address does not carry a complete subscription. Build it again; it takes a minute.
        </EmptyState>
      )}
    </>
  );
}
