import type { QueryClient } from '@tanstack/react-query';
import { ArrowLeft } from 'lucide-react';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { orderReference } from '@shared/domain/order-reference';
import { NotFoundMessage } from '@/components/errors/not-found-message';
import { PageTitle } from '@/components/seo/page-title';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { requireUser } from '@/features/auth/utils/require-user';
import { roasteryRoles, staffRoles } from '@/features/auth/utils/roles';
import { getRoasteryOrderQueryOptions, useRoasteryOrder } from '@/features/roastery-orders/api/get-roastery-order';
import { OrderDesk } from '@/features/roastery-orders/components/order-desk';
import { RoasteryOrderDetail } from '@/features/roastery-orders/components/roastery-order-detail';
import { useCurrentUser } from '@/features/auth/api/get-current-user';
import { ApiError } from '@/lib/api-client';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    const user = await requireUser(queryClient, request);
    if (params.id && roasteryRoles.includes(user.role)) void queryClient.prefetchQuery(getRoasteryOrderQueryOptions(params.id));
    return null;
  };

function BackToOrders() {
  return (
    <p className="mb-4">
      <Link to={paths.roastery.orders.getHref()} className="inline-flex min-h-11 items-center gap-1.5 font-semibold text-leaf underline">
        <ArrowLeft aria-hidden="true" className="size-4" />
        All orders
      </Link>
    </p>
  );
}

export default function RoasteryOrderRoute() {
  const { id = '' } = useParams();
  const orderQuery = useRoasteryOrder(id);
  const order = orderQuery.data;
  const role = useCurrentUser().data?.role;
  const canRefund = role === 'owner';
  // A packer reads the order and packs it from the Pack List; the desk's changes and the trace are staff work.
  const actsOnOrders = role !== undefined && staffRoles.includes(role);

  if (order) {
    const title = `Order ${orderReference(order.id)}`;
    return (
      <>
        <PageTitle title={`${title} · Roastery`} />
        <BackToOrders />
        <PageHeader eyebrow="Roastery" title={title} lead={`${order.customer.name}’s order, in full.`} />
        <RoasteryOrderDetail
          order={order}
          actions={
            <>
              <p className="text-ink-muted">
                {order.shippedAt
                  ? 'This order has left the roastery.'
                  : 'Bags are packed, labelled and marked shipped from the Pack List of the day they ship.'}
              </p>
              <ul className="mt-3 flex flex-wrap gap-x-6 gap-y-2">
                {order.shipDate ? (
                  <li>
                    <Link
                      to={paths.roastery.daySheet.getHref(order.shipDate, 'pack')}
                      className="inline-flex min-h-11 items-center font-semibold text-leaf underline"
                    >
                      Open the Pack List for {order.shipDate}
                    </Link>
                  </li>
                ) : null}
                {actsOnOrders ? (
                  <li>
                    <Link to={paths.roastery.orderTrace.getHref(order.id)} className="inline-flex min-h-11 items-center font-semibold text-leaf underline">
                      Trace this order
                    </Link>
                  </li>
                ) : null}
              </ul>
            </>
          }
        />
        {actsOnOrders ? (
          <section aria-labelledby="order-desk" className="mt-8 max-w-2xl rounded-card border border-rule bg-sheet p-4 sm:p-5">
            <h2 id="order-desk" className="mb-4 text-h2">
              Act on this order
            </h2>
            <OrderDesk key={order.id} order={order} canRefund={canRefund} />
          </section>
        ) : null}
      </>
    );
  }

  if (orderQuery.isError) {
    if (orderQuery.error instanceof ApiError && orderQuery.error.status === 404) {
      return (
        <>
          <PageTitle title="Order not found · Roastery" />
          <BackToOrders />
          <NotFoundMessage title="Order not found">There is no order at this address. It may have been typed wrong.</NotFoundMessage>
        </>
      );
    }
    return (
      <>
        <PageTitle title="Order · Roastery" />
        <BackToOrders />
        <ErrorState title="This order could not load" error={orderQuery.error} onRetry={() => void orderQuery.refetch()} />
      </>
    );
  }

  return (
    <>
      <PageTitle title="Order · Roastery" />
      <p role="status" className="sr-only">
        Loading the order…
      </p>
      <Skeleton className="mb-4 h-10 w-1/2" />
      <Skeleton className="h-64" />
    </>
  );
}
