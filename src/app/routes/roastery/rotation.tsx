import type { QueryClient } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { addDays } from '@shared/domain/shop-time';
import { PageTitle } from '@/components/seo/page-title';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { getLotsQueryOptions, useLots } from '@/features/lots/api/get-lots';
import { getRotationQueryOptions, useRotation } from '@/features/rotation/api/get-rotation';
import { RotationDayForm } from '@/features/rotation/components/rotation-day-form';

/** Four weeks at a time. */
const SPAN_DAYS = 28;

/** Today as the browser sees it; the server answers for whole shop days around it. */
function today(): string {
  const now = new Date();
  return `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
}

function rangeOf(search: URLSearchParams) {
  const weeksAhead = Math.max(0, Math.min(12, Number(search.get('weeks') ?? 0) || 0));
  const from = addDays(today(), weeksAhead * 7);
  return { from, to: addDays(from, SPAN_DAYS - 1), weeksAhead };
}

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request }: { request: Request }) => {
    const { from, to } = rangeOf(new URL(request.url).searchParams);
    void queryClient.prefetchQuery(getRotationQueryOptions({ from, to }));
    void queryClient.prefetchQuery(getLotsQueryOptions());
    return null;
  };

export default function RotationRoute() {
  const [search, setSearch] = useSearchParams();
  const { from, to, weeksAhead } = rangeOf(search);
  const range = { from, to };
  const rotationQuery = useRotation(range);
  const lots = (useLots().data?.items ?? []).filter((lot) => lot.stockGrams > 0);

  let body;
  if (rotationQuery.isError) {
    body = <ErrorState title="The Roaster’s Rotation could not load" error={rotationQuery.error} onRetry={() => void rotationQuery.refetch()} />;
  } else if (!rotationQuery.data) {
    body = (
      <>
        <p role="status" className="sr-only">
          Loading roast days…
        </p>
        <Skeleton className="h-72 rounded-card" />
      </>
    );
  } else if (rotationQuery.data.days.length === 0) {
    body = <EmptyState title="No open roast days in these weeks">Open roast days in the Roast Calendar to plan the rotation.</EmptyState>;
  } else {
    body = (
      <ol aria-label="Roast days" className="grid gap-4">
        {rotationQuery.data.days.map((day) => (
          <RotationDayForm key={day.roastDate} day={day} lots={lots} range={range} />
        ))}
      </ol>
    );
  }

  return (
    <>
      <PageTitle title="Roaster’s Rotation · Roastery" />
      <PageHeader
        eyebrow="Roastery"
        title="Roaster’s Rotation"
        lead="Pick the lot each roast day’s Rotation subscribers get. They see it in their Deliveries once it is picked."
      />
      <nav aria-label="Weeks" className="mb-4 flex flex-wrap items-center gap-3">
        <Button variant="secondary" disabled={weeksAhead === 0} onClick={() => setSearch(weeksAhead <= 4 ? {} : { weeks: String(weeksAhead - 4) })}>
          Earlier weeks
        </Button>
        <Button variant="secondary" disabled={weeksAhead >= 12} onClick={() => setSearch({ weeks: String(weeksAhead + 4) })}>
          Later weeks
        </Button>
      </nav>
      {body}
    </>
  );
}
