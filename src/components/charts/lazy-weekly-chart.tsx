import { lazy, Suspense } from 'react';
import { Skeleton } from '@/components/ui/skeleton';
import type { WeeklyChartProps } from './weekly-chart';

const WeeklyChart = lazy(() => import('./weekly-chart'));

/** A weekly chart in a figure with its caption; the charting code loads on first use, never with the storefront. */
export function LazyWeeklyChart({ caption, ...props }: WeeklyChartProps & { caption: string }) {
  return (
    <figure className="rounded-card border border-rule bg-sheet p-4">
      <figcaption className="mb-2 text-small font-semibold">{caption}</figcaption>
      {/* The figures are in the table that follows; the picture itself is not read out. */}
      <div aria-hidden="true">
        <Suspense fallback={<Skeleton className="h-[260px] rounded-card" />}>
          <WeeklyChart {...props} />
        </Suspense>
      </div>
    </figure>
  );
}
