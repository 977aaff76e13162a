import type { QueryClient } from '@tanstack/react-query';
import { ChevronLeft, ChevronRight } from 'lucide-react';
import { useState } from 'react';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import type { CalendarDay } from '@shared/schemas/roastery';
import { PageTitle } from '@/components/seo/page-title';
import { buttonStyles } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { getRoastCalendarQueryOptions, useRoastCalendar } from '@/features/roast-calendar/api/get-roast-calendar';
import { RoastCalendarMonth } from '@/features/roast-calendar/components/roast-calendar-month';
import { RoastDayEditor } from '@/features/roast-calendar/components/roast-day-editor';
import { addMonths, monthOf, monthRange, parseMonth } from '@/features/roast-calendar/utils/calendar-month';
import { getShopSettingsQueryOptions, useShopSettings } from '@/features/shop-settings/api/get-shop-settings';
import { shopToday } from '@/features/shop-settings/utils/shop-today';
import { formatMonth } from '@/lib/dates';

function monthFrom(search: URLSearchParams, today: string): string {
  return parseMonth(search.get('month')) ?? monthOf(today);
}

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) => {
    const month = monthFrom(new URL(request.url).searchParams, shopToday(queryClient.getQueryData(getShopSettingsQueryOptions().queryKey)));
    void queryClient.prefetchQuery(getRoastCalendarQueryOptions(monthRange(month)));
    void queryClient.prefetchQuery(getShopSettingsQueryOptions());
    return null;
  };

export default function RoastCalendarRoute() {
  const [search] = useSearchParams();
  const today = shopToday(useShopSettings().data);
  const month = monthFrom(search, today);
  const calendar = useRoastCalendar(monthRange(month));
  const [selectedDate, setSelectedDate] = useState<string>();
  const selected: CalendarDay | undefined = calendar.data?.days.find((day) => day.date === selectedDate);

  return (
    <>
      <PageTitle title={`Roast Calendar ${formatMonth(month)} · Roastery`} />
      <PageHeader
        eyebrow="Roastery"
        title="Roast Calendar"
        lead="Which days the roaster runs, how much green each day can take and how much is already planned. Close a day for a holiday or maintenance and its orders move to the next open roast day."
      />
      <div className="mb-4 flex flex-wrap items-center gap-3">
        <h2 className="text-h2" aria-live="polite">
          {formatMonth(month)}
        </h2>
        <nav aria-label="Months" className="ml-auto flex gap-2">
          <Link to={paths.roastery.calendar.getHref(addMonths(month, -1))} className={buttonStyles('secondary')}>
            <ChevronLeft aria-hidden="true" className="size-4" />
            {formatMonth(addMonths(month, -1))}
          </Link>
          <Link to={paths.roastery.calendar.getHref(addMonths(month, 1))} className={buttonStyles('secondary')}>
            {formatMonth(addMonths(month, 1))}
            <ChevronRight aria-hidden="true" className="size-4" />
          </Link>
        </nav>
      </div>

      {selected ? (
        <div className="mb-6">
          <RoastDayEditor key={selected.date} day={selected} onDone={() => setSelectedDate(undefined)} />
        </div>
      ) : null}

      {calendar.isError ? (
        <ErrorState title="The Roast Calendar could not load" error={calendar.error} onRetry={() => void calendar.refetch()} />
      ) : calendar.data ? (
        <RoastCalendarMonth month={month} days={calendar.data.days} today={today} selected={selectedDate} onChangeDay={(day) => setSelectedDate(day.date)} />
      ) : (
        <div>
          <p role="status" className="sr-only">
            Loading the Roast Calendar…
          </p>
          <Skeleton className="h-96 rounded-card" />
        </div>
      )}
    </>
  );
}
