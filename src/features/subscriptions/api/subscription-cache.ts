import type { QueryClient } from '@tanstack/react-query';
import type { Subscription } from '@shared/schemas/subscriptions';
import { getSubscriptionQueryOptions } from './get-subscription';
import { getSubscriptionDeliveriesQueryOptions } from './get-subscription-deliveries';
import { getSubscriptionsQueryOptions } from './get-subscriptions';

/**
 * After a change the server answers with the subscription as it now is: show that at once, and
 * fetch its schedule again, since a change can move every delivery after the locked ones.
 */
export async function showChangedSubscription(queryClient: QueryClient, changed: Subscription): Promise<void> {
  queryClient.setQueryData(getSubscriptionQueryOptions(changed.id).queryKey, changed);
  queryClient.setQueryData(getSubscriptionsQueryOptions().queryKey, (list) =>
    list ? { items: list.items.map((each) => (each.id === changed.id ? changed : each)) } : list,
  );
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: getSubscriptionDeliveriesQueryOptions(changed.id).queryKey }),
    queryClient.invalidateQueries({ queryKey: getSubscriptionsQueryOptions().queryKey }),
  ]);
}
