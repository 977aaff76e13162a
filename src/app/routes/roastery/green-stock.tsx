import type { QueryClient } from '@tanstack/react-query';
import { Plus } from 'lucide-react';
import { Link, type LoaderFunctionArgs } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { buttonStyles } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { requireUser } from '@/features/auth/utils/require-user';
import { staffRoles } from '@/features/auth/utils/roles';
import { getGreenStockQueryOptions, useGreenStock } from '@/features/green-stock/api/get-green-stock';
import { GreenStockFigures, GreenStockTable } from '@/features/green-stock/components/green-stock-table';
import { getPlanningQueryOptions, usePlanning } from '@/features/planning/api/get-planning';
import { GreenPlanning } from '@/features/planning/components/green-planning';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    const user = await requireUser(queryClient, request);
    if (staffRoles.includes(user.role)) {
      void queryClient.prefetchQuery(getGreenStockQueryOptions());
      void queryClient.prefetchQuery(getPlanningQueryOptions());
    }
    return null;
  };

function NewLotLink() {
  return (
    <Link to={paths.roastery.newLot.getHref()} className={buttonStyles('primary')}>
      <Plus aria-hidden="true" className="size-4" />
      New lot
    </Link>
  );
}

function Planning() {
  const planningQuery = usePlanning();
  if (planningQuery.isError) {
    return <ErrorState title="Green planning could not load" error={planningQuery.error} onRetry={() => void planningQuery.refetch()} />;
  }
  if (!planningQuery.data) {
    return (
      <div>
        <p role="status" className="sr-only">
          Loading green planning…
        </p>
        <Skeleton className="h-72 rounded-card" />
      </div>
    );
  }
  return <GreenPlanning plan={planningQuery.data} />;
}

function GreenStock() {
  const stockQuery = useGreenStock();
  if (stockQuery.isError) {
    return <ErrorState title="Green Stock could not load" error={stockQuery.error} onRetry={() => void stockQuery.refetch()} />;
  }
  if (!stockQuery.data) {
    return (
      <div className="grid gap-6">
        <p role="status" className="sr-only">
          Loading green stock…
        </p>
        <Skeleton className="h-24 rounded-card" />
        <Skeleton className="h-72 rounded-card" />
      </div>
    );
  }
  const { items, windowDays } = stockQuery.data;
  if (items.length === 0) {
    return (
      <EmptyState title="No lots yet" action={<NewLotLink />}>
        Add the first lot, then record its arrival to put it in stock.
      </EmptyState>
    );
  }
  return (
    <div className="grid gap-6">
      <GreenStockFigures items={items} />
      <p className="text-small text-ink-muted">
        Days of cover: grams on hand at the pace of the last {windowDays} days’ sales and roasts. Samples, losses and counts are not use.
      </p>
      <GreenStockTable items={items} windowDays={windowDays} />
      <Planning />
    </div>
  );
}

export default function GreenStockRoute() {
  return (
    <>
      <PageTitle title="Green Stock · Roastery" />
      <div className="flex flex-wrap items-start justify-between gap-4">
        <PageHeader
          eyebrow="Roastery"
          title="Green Stock"
          lead="Every lot, listed or not: what is on hand, how long it lasts, and what to reorder. Open a lot to record stock, edit it or add photos."
        />
        <NewLotLink />
      </div>
      <GreenStock />
    </>
  );
}
