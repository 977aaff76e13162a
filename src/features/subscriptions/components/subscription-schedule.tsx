import type { Subscription } from '@shared/schemas/subscriptions';
import { ErrorState } from '@/components/ui/error-state';
import { Skeleton } from '@/components/ui/skeleton';
import { useSubscriptionDeliveries } from '../api/get-subscription-deliveries';
import { DeliverySchedule, type DeliveryActions } from './delivery-schedule';

/** A subscription's coming deliveries, loaded once it has started. */
export function SubscriptionSchedule({ subscription, actions }: { subscription: Subscription; actions?: DeliveryActions }) {
  const deliveriesQuery = useSubscriptionDeliveries(subscription.id, { enabled: subscription.status !== 'incomplete' });
  if (subscription.status === 'incomplete') return null;
  if (deliveriesQuery.isError) {
    return <ErrorState title="The schedule could not load" error={deliveriesQuery.error} onRetry={() => void deliveriesQuery.refetch()} />;
  }
  if (!deliveriesQuery.data) {
    return (
      <>
        <p role="status" className="sr-only">
          Loading the schedule…
        </p>
        <Skeleton className="h-40" />
      </>
    );
  }
  if (deliveriesQuery.data.items.length === 0) {
    return <p className="text-ink-muted">No deliveries are coming up.</p>;
  }
  return <DeliverySchedule deliveries={deliveriesQuery.data.items} caption={`Upcoming deliveries of ${subscription.coffee}`} actions={actions} />;
}
