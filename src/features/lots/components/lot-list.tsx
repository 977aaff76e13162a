import clsx from 'clsx';
import { Link } from 'react-router-dom';
import { buttonStyles } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { paths } from '@/config/paths';
import { useLots } from '../api/get-lots';
import { hasActiveFilters, type LotFilters } from '../utils/lot-filters';
import type { PriceUnit } from '../utils/price-per-unit';
import { LotGrid, LotGridSkeleton } from './lot-grid';

/** The Green Lots results for the given filters, with their loading, empty and error states. */
export function LotList({ filters, priceUnit }: { filters: LotFilters; priceUnit?: PriceUnit }) {
  const lotsQuery = useLots(filters);

  if (lotsQuery.data === undefined) {
    if (lotsQuery.isError) {
      return <ErrorState title="Green Lots could not load" error={lotsQuery.error} onRetry={() => void lotsQuery.refetch()} />;
    }
    return <LotGridSkeleton count={6} label="Loading green lots…" />;
  }

  const lots = lotsQuery.data.items;

  if (lots.length === 0) {
    return hasActiveFilters(filters) ? (
      <EmptyState
        title="No lots match these filters"
        action={
          <Link to={paths.lots.getHref()} className={buttonStyles('secondary')}>
            Reset filters
          </Link>
        }
      >
        Try fewer filters, or another search word.
      </EmptyState>
    ) : (
      <EmptyState title="No green lots are listed right now">New lots are added as they arrive; please look again soon.</EmptyState>
    );
  }

  return (
    <div className={clsx('transition-opacity', lotsQuery.isPlaceholderData && 'opacity-60')} aria-busy={lotsQuery.isPlaceholderData}>
      <p role="status" className="mb-4 text-small text-ink-muted">
        {lots.length === 1 ? '1 lot' : `${lots.length} lots`}
      </p>
      <LotGrid lots={lots} priceUnit={priceUnit} />
    </div>
  );
}
