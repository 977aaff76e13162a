import type { QueryClient } from '@tanstack/react-query';
import { PageTitle } from '@/components/seo/page-title';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { getLotsQueryOptions, useLots } from '@/features/lots/api/get-lots';
import { LotStockTable } from '@/features/lots/components/lot-stock-table';

export const clientLoader = (queryClient: QueryClient) => () => {
  void queryClient.prefetchQuery(getLotsQueryOptions());
  return null;
};

function StockTable() {
  const lotsQuery = useLots();
  if (lotsQuery.data) {
    if (lotsQuery.data.items.length === 0) return <EmptyState title="No lots yet">Lots appear here once they are listed.</EmptyState>;
    return <LotStockTable lots={lotsQuery.data.items} />;
  }
  if (lotsQuery.isError) {
    return <ErrorState title="Green stock could not load" error={lotsQuery.error} onRetry={() => void lotsQuery.refetch()} />;
  }
  return (
    <div>
      <p role="status" className="sr-only">
        Loading green stock…
      </p>
      <Skeleton className="h-72 rounded-card" />
    </div>
  );
}

export default function GreenStockRoute() {
  return (
    <>
      <PageTitle title="Green Stock · Roastery" />
      <PageHeader
        eyebrow="Roastery"
        title="Green Stock"
        lead="Green coffee on hand for every listed lot, the lowest first. Editing lots, stock adjustments with their reasons, reorder points and days of cover are the next things to arrive here."
      />
      <StockTable />
    </>
  );
}
