import { ChevronLeft, ChevronRight } from 'lucide-react';
import { Link } from 'react-router-dom';
import { buttonStyles } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { useRoasteryOrders } from '../api/get-roastery-orders';
import { hasActiveFilters, roasteryOrderFilterProblems, roasteryOrderFiltersToSearchParams, type RoasteryOrderFilters } from '../utils/order-filters';
import { RoasteryOrderTable } from './roastery-order-table';

const pageLink = (filters: RoasteryOrderFilters, page: number) => paths.roastery.orders.getHref(roasteryOrderFiltersToSearchParams({ ...filters, page }));

/** The orders matching the URL's filters, one page at a time, with its loading, empty and error states. */
export function RoasteryOrderList({ filters }: { filters: RoasteryOrderFilters }) {
  const refused = Object.keys(roasteryOrderFilterProblems(filters)).length > 0;
  const ordersQuery = useRoasteryOrders(filters, { enabled: !refused });

  if (refused) {
    return <EmptyState title="Check the dates">The first day placed must not be after the last. Fix the dates above to see orders.</EmptyState>;
  }
  if (ordersQuery.isError) {
    return <ErrorState title="Orders could not load" error={ordersQuery.error} onRetry={() => void ordersQuery.refetch()} />;
  }
  if (!ordersQuery.data) {
    return (
      <div>
        <p role="status" className="sr-only">
          Loading orders…
        </p>
        <Skeleton className="h-96 rounded-card" />
      </div>
    );
  }

  const { items, total, page, pageSize } = ordersQuery.data;
  const pages = Math.max(1, Math.ceil(total / pageSize));
  if (items.length === 0) {
    const filtered = hasActiveFilters(filters);
    return (
      <EmptyState
        title={total > 0 ? 'No orders on this page' : filtered ? 'No orders match these filters' : 'No orders yet'}
        action={
          filtered || page > 1 ? (
            <Link to={paths.roastery.orders.getHref()} className={buttonStyles('secondary')}>
              Show every order
            </Link>
          ) : undefined
        }
      >
        {filtered ? 'Try another status or a wider range of days.' : 'Orders appear here as soon as a customer checks out.'}
      </EmptyState>
    );
  }

  const first = (page - 1) * pageSize + 1;
  return (
    <div aria-busy={ordersQuery.isPlaceholderData}>
      <p role="status" className="mb-3 text-small text-ink-muted">
        {ordersQuery.isPlaceholderData ? 'Updating…' : `Orders ${first}–${first + items.length - 1} of ${total}`}
      </p>
      <RoasteryOrderTable orders={items} sort={filters.sort} />
      {pages > 1 ? (
        <nav aria-label="Pages of orders" className="mt-4 flex flex-wrap items-center gap-3">
          {page > 1 ? (
            <Link to={pageLink(filters, page - 1)} className={buttonStyles('secondary')}>
              <ChevronLeft aria-hidden="true" className="size-4" />
              Previous page
            </Link>
          ) : null}
          <span className="text-small">
            Page {page} of {pages}
          </span>
          {page < pages ? (
            <Link to={pageLink(filters, page + 1)} className={buttonStyles('secondary')}>
              Next page
              <ChevronRight aria-hidden="true" className="size-4" />
            </Link>
          ) : null}
        </nav>
      ) : null}
    </div>
  );
}
