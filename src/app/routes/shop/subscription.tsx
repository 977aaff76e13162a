import type { QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { NotFoundMessage } from '@/components/errors/not-found-message';
import { PageTitle } from '@/components/seo/page-title';
import { buttonStyles } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { requireUser } from '@/features/auth/utils/require-user';
import { getSubscriptionQueryOptions, useSubscription } from '@/features/subscriptions/api/get-subscription';
import { UnpaidSubscriptionActions } from '@/features/subscriptions/components/unpaid-subscription-actions';
import { ActivationStatusPanel } from '@/features/subscriptions/components/activation-status-panel';
import { SubscriptionSchedule } from '@/features/subscriptions/components/subscription-schedule';
import { SubscriptionSummary } from '@/features/subscriptions/components/subscription-summary';
import { ApiError } from '@/lib/api-client';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    if (params.id) void queryClient.prefetchQuery(getSubscriptionQueryOptions(params.id));
    return null;
  };

export default function SubscriptionRoute() {
  const { id = '' } = useParams();
  const [search] = useSearchParams();
  const returningFromPayment = search.get('checkout') === 'complete';
  const subscriptionQuery = useSubscription(id, { awaitActivation: returningFromPayment });
  const subscription = subscriptionQuery.data;
  const navigate = useNavigate();

  if (subscription) {
    return (
      <>
        <PageTitle title="Your subscription" />
        <PageHeader eyebrow="Roasted to Order" title={subscription.coffee} />
        {returningFromPayment ? (
          <div className="mb-6">
            <ActivationStatusPanel subscription={subscription} />
          </div>
        ) : (
          <div className="mb-6">
            <UnpaidSubscriptionActions subscription={subscription} onDiscarded={() => void navigate(paths.account.deliveries.getHref(), { replace: true })} />
          </div>
        )}
        <div className="grid gap-8">
          <SubscriptionSummary subscription={subscription} />
          {subscription.status !== 'incomplete' ? (
            <section aria-labelledby="schedule-heading">
              <h2 id="schedule-heading" className="mb-3 text-h2">
                Your deliveries
              </h2>
              <SubscriptionSchedule subscription={subscription} />
              <Link to={paths.account.deliveries.getHref()} className={buttonStyles('primary', 'mt-5')}>
                Skip, pause or change in Deliveries
              </Link>
            </section>
          ) : null}
        </div>
      </>
    );
  }

  if (subscriptionQuery.isError) {
    if (subscriptionQuery.error instanceof ApiError && subscriptionQuery.error.status === 404) {
      return (
        <>
          <PageTitle title="Subscription not found" />
          <NotFoundMessage title="Subscription not found">There is no subscription at this address in your account.</NotFoundMessage>
        </>
      );
    }
    return (
      <>
        <PageTitle title="Your subscription" />
        <ErrorState title="This subscription could not load" error={subscriptionQuery.error} onRetry={() => void subscriptionQuery.refetch()} />
      </>
    );
  }

  return (
    <>
      <PageTitle title="Your subscription" />
      <p role="status" className="sr-only">
        Loading the subscription…
      </p>
      <Skeleton className="mb-4 h-10 w-1/2" />
      <Skeleton className="h-40" />
    </>
  );
}
