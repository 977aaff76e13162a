import { useQueries, type QueryClient } from '@tanstack/react-query';
import { Link, type LoaderFunctionArgs } from 'react-router-dom';
import { roastLevels, type RoastLevel } from '@shared/domain/vocabulary';
import { PageTitle } from '@/components/seo/page-title';
import { buttonStyles } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { requireUser } from '@/features/auth/utils/require-user';
import { getLotQueryOptions } from '@/features/lots/api/get-lot';
import { getSubscriptionsQueryOptions, useSubscriptions } from '@/features/subscriptions/api/get-subscriptions';
import { SubscriptionPanel } from '@/features/subscriptions/components/subscription-panel';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    void queryClient.prefetchQuery(getSubscriptionsQueryOptions());
    return null;
  };

/** The levels each subscribed lot may be roasted to; the Roaster's Rotation takes any. */
function useAllowedLevels(lotCodes: readonly string[]): (lotCode: string | null) => readonly RoastLevel[] {
  const lots = useQueries({ queries: lotCodes.map((code) => getLotQueryOptions(code)) });
  return (lotCode) => {
    if (lotCode === null) return roastLevels;
    return lots.find((query) => query.data?.code === lotCode)?.data?.allowedLevels ?? roastLevels;
  };
}

function SubscriptionList() {
  const subscriptionsQuery = useSubscriptions();
  const items = subscriptionsQuery.data?.items ?? [];
  const allowedLevelsFor = useAllowedLevels([...new Set(items.flatMap((each) => (each.lotCode ? [each.lotCode] : [])))]);

  if (subscriptionsQuery.isError) {
    return <ErrorState title="Your subscriptions could not load" error={subscriptionsQuery.error} onRetry={() => void subscriptionsQuery.refetch()} />;
  }
  if (!subscriptionsQuery.data) {
    return (
      <div className="grid gap-4">
        <p role="status" className="sr-only">
          Loading your deliveries…
        </p>
        <Skeleton className="h-72 rounded-card" />
      </div>
    );
  }
  if (items.length === 0) {
    return (
      <EmptyState
        title="No subscriptions yet"
        action={
          <Link to={paths.subscribe.getHref()} className={buttonStyles('primary')}>
            Build a Roasted to Order subscription
          </Link>
        }
      >
        Once you subscribe, every delivery shows here with its roast, ship, ready-from and best-before dates.
      </EmptyState>
    );
  }
  return (
    <div className="grid gap-6">
      {items.map((subscription) => (
        <SubscriptionPanel key={subscription.id} subscription={subscription} allowedLevels={allowedLevelsFor(subscription.lotCode)} />
      ))}
    </div>
  );
}

export default function DeliveriesRoute() {
  return (
    <>
      <PageTitle title="Deliveries" />
      <PageHeader
        title="Deliveries"
        lead="Each subscription and its coming deliveries: when it roasts, ships, is ready to brew and is best before. Skip, pause or change anything before a delivery’s cutoff."
      />
      <SubscriptionList />
    </>
  );
}
