import type { QueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { useNavigate, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { NotFoundMessage } from '@/components/errors/not-found-message';
import { PageTitle } from '@/components/seo/page-title';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { requireUser } from '@/features/auth/utils/require-user';
import { useCart } from '@/features/cart/hooks/use-cart';
import { getOrderQueryOptions, useOrder } from '@/features/orders/api/get-order';
import { OrderDetailView } from '@/features/orders/components/order-detail-view';
import { PaymentStatusPanel } from '@/features/orders/components/payment-status-panel';
import { UnpaidOrderActions } from '@/features/orders/components/unpaid-order-actions';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { orderReference } from '@shared/domain/order-reference';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    if (params.id) void queryClient.prefetchQuery(getOrderQueryOptions(params.id));
    return null;
  };

export default function OrderRoute() {
  const { id = '' } = useParams();
  const [search] = useSearchParams();
  const returningFromPayment = search.get('checkout') === 'complete';
  const orderQuery = useOrder(id, { awaitPayment: returningFromPayment });
  const order = orderQuery.data;
  const { remove } = useCart();
  const navigate = useNavigate();

  // Once the payment is confirmed, the bags bought are no longer in the cart.
  const paidItems = returningFromPayment && order && order.paidAt !== null ? order.items : null;
  useEffect(() => {
    for (const item of paidItems ?? []) if (item.lotCode) remove({ lotCode: item.lotCode, size: item.size });
  }, [paidItems, remove]);

  if (order) {
    return (
      <>
        <PageTitle title="Your order" />
        <PageHeader title="Your order" lead={`Order ${orderReference(order.id)}: quote it when you write to us about this order.`} />
        {returningFromPayment ? (
          <div className="mb-6">
            <PaymentStatusPanel order={order} onCheckAgain={() => void orderQuery.refetch()} />
          </div>
        ) : (
          <div className="mb-6">
            <UnpaidOrderActions order={order} onDiscarded={() => void navigate(paths.account.orders.getHref(), { replace: true })} />
          </div>
        )}
        <OrderDetailView order={order} />
      </>
    );
  }

  if (orderQuery.isError) {
    if (orderQuery.error instanceof ApiError && orderQuery.error.status === 404) {
      return (
        <>
          <PageTitle title="Order not found" />
          <NotFoundMessage title="Order not found">There is no order at this address in your account.</NotFoundMessage>
        </>
      );
    }
    return (
      <>
        <PageTitle title="Your order" />
        <ErrorState title="This order could not load" error={orderQuery.error} onRetry={() => void orderQuery.refetch()} />
      </>
    );
  }

  return (
    <>
      <PageTitle title="Your order" />
      <p role="status" className="sr-only">
        Loading the order…
      </p>
      <Skeleton className="mb-4 h-10 w-1/2" />
      <Skeleton className="h-40" />
    </>
  );
}
