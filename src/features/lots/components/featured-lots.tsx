import type { LotSummary } from '@shared/schemas/lots';
import { ErrorState } from '@/components/ui/error-state';
import { useLots } from '../api/get-lots';
import { LotGrid, LotGridSkeleton } from './lot-grid';

const FEATURED_COUNT = 3;

/** Lots in stock come first; the catalog's own order is kept within each group. */
function pickFeatured(lots: LotSummary[]): LotSummary[] {
  const inStock = lots.filter((lot) => lot.stockGrams > 0);
  const outOfStock = lots.filter((lot) => lot.stockGrams <= 0);
  return [...inStock, ...outOfStock].slice(0, FEATURED_COUNT);
}

export function FeaturedLots() {
  const lotsQuery = useLots();

  if (lotsQuery.data === undefined) {
    if (lotsQuery.isError) {
      return <ErrorState title="Lots could not load" error={lotsQuery.error} onRetry={() => void lotsQuery.refetch()} />;
    }
    return <LotGridSkeleton count={FEATURED_COUNT} label="Loading featured lots…" />;
  }

  const featured = pickFeatured(lotsQuery.data.items);
  if (featured.length === 0) {
    return <p className="text-ink-muted">No green lots are listed right now; new lots are added as they arrive.</p>;
  }
  return <LotGrid lots={featured} headingLevel="h3" />;
}
