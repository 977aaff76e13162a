import { Link } from 'react-router-dom';
import { orderReference } from '@shared/domain/order-reference';
import { Button, buttonStyles } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { useShopMoney } from '@/lib/shop-currency';
import { formatDay, formatInstant } from '@/lib/dates';
import { useOrders } from '../api/get-orders';
import { OrderStatusBadge } from './order-status-badge';

/** The signed-in customer's orders, newest first, with their status. */
export function OrderList({ page, onPageChange }: { page: number; onPageChange: (page: number) => void }) {
  const { money } = useShopMoney();
  const ordersQuery = useOrders(page);

  if (ordersQuery.isError) {
    return <ErrorState title="Your orders could not load" error={ordersQuery.error} onRetry={() => void ordersQuery.refetch()} />;
  }
  if (!ordersQuery.data) {
    return (
      <div className="grid gap-3">
        <p role="status" className="sr-only">
          Loading your orders…
        </p>
        <Skeleton className="h-20" />
        <Skeleton className="h-20" />
      </div>
    );
  }

  const { items, total, pageSize } = ordersQuery.data;
  if (items.length === 0) {
    return (
      <EmptyState
        title="No orders yet"
        action={
          <Link to={paths.lots.getHref()} className={buttonStyles('primary')}>
            Browse Green Lots
          </Link>
        }
      >
        Orders you place show here, with where each one is.
      </EmptyState>
    );
  }

  const pages = Math.max(1, Math.ceil(total / pageSize));
  return (
    <>
      <ul aria-label="Your orders" className="divide-y divide-rule rounded-card border border-rule bg-sheet">
        {items.map((order) => (
          <li key={order.id} className="flex flex-wrap items-center justify-between gap-x-6 gap-y-1 p-4">
            <div>
              <Link to={paths.order.getHref(order.id)} className="font-semibold text-leaf underline">
                Order {orderReference(order.id)} of {formatInstant(order.placedAt)}
              </Link>
              <p className="text-small text-ink-muted">
                {order.kind === 'green' ? 'Green coffee' : 'Roasted coffee'} · {order.bagCount} {order.bagCount === 1 ? 'bag' : 'bags'}
                {order.shipDate ? ` · ships ${formatDay(order.shipDate)}` : ''}
              </p>
            </div>
            <div className="flex items-center gap-3">
              {order.kind === 'green' && order.status === 'pending_payment' ? (
                <Link to={paths.order.getHref(order.id)} className="font-semibold text-leaf underline">
                  Pay now or discard
                </Link>
              ) : null}
              <OrderStatusBadge status={order.status} />
              <span className="font-semibold">{money(order.totalCents)}</span>
            </div>
          </li>
        ))}
      </ul>
      {pages > 1 ? (
        <nav aria-label="Pages of orders" className="mt-4 flex items-center gap-3">
          <Button variant="secondary" disabled={page <= 1} onClick={() => onPageChange(page - 1)}>
            Newer
          </Button>
          <span className="text-small">
            Page {page} of {pages}
          </span>
          <Button variant="secondary" disabled={page >= pages} onClick={() => onPageChange(page + 1)}>
            Older
          </Button>
        </nav>
      ) : null}
    </>
  );
}
