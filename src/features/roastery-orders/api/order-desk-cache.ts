import type { QueryClient } from '@tanstack/react-query';
import type { OrderDetail } from '@shared/schemas/orders';
import { getRoasteryOrderQueryOptions } from './get-roastery-order';
import { getRoasteryOrdersQueryRoot } from './get-roastery-orders';

/** After a staff action the server answers with the order as it now is: show it, and let lists read again. */
export async function showChangedOrder(queryClient: QueryClient, changed: OrderDetail): Promise<void> {
  queryClient.setQueryData(getRoasteryOrderQueryOptions(changed.id).queryKey, changed);
  await queryClient.invalidateQueries({ queryKey: getRoasteryOrdersQueryRoot });
}
