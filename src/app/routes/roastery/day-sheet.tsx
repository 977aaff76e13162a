import type { QueryClient } from '@tanstack/react-query';
import { useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { isIsoDate } from '@shared/domain/shop-time';
import { NotFoundMessage } from '@/components/errors/not-found-message';
import { PageTitle } from '@/components/seo/page-title';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { useCurrentUser } from '@/features/auth/api/get-current-user';
import { requireUser } from '@/features/auth/utils/require-user';
import { roasteryRoles, staffRoles } from '@/features/auth/utils/roles';
import { getDayBatchesQueryOptions, useDayBatches } from '@/features/day-sheet/api/get-day-batches';
import { getRoastListQueryOptions, useRoastList } from '@/features/day-sheet/api/get-roast-list';
import { DateSwitcher } from '@/features/day-sheet/components/date-switcher';
import { DayBatches } from '@/features/day-sheet/components/day-batches';
import { DaySheetTabs, type DaySheetTab } from '@/features/day-sheet/components/day-sheet-tabs';
import { RoastDayCautions } from '@/features/day-sheet/components/roast-day-cautions';
import { RoastListView } from '@/features/day-sheet/components/roast-list-view';
import { getPackListQueryOptions, usePackList } from '@/features/packing/api/get-pack-list';
import { PackListView } from '@/features/packing/components/pack-list-view';
import { useShopSettings } from '@/features/shop-settings/api/get-shop-settings';
import { shopToday } from '@/features/shop-settings/utils/shop-today';
import { formatDayLong } from '@/lib/dates';

function tabOf(search: URLSearchParams): DaySheetTab {
  return search.get('tab') === 'pack' ? 'pack' : 'roast';
}

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ params, request }: LoaderFunctionArgs) => {
    const date = params.date;
    if (!date || !isIsoDate(date)) return null;
    const user = await requireUser(queryClient, request);
    if (!roasteryRoles.includes(user.role)) return null;
    void queryClient.prefetchQuery(getPackListQueryOptions(date));
    if (!staffRoles.includes(user.role)) return null;
    // Both lists, whichever tab opens: each tab shows its count.
    void queryClient.prefetchQuery(getRoastListQueryOptions(date));
    if (tabOf(new URL(request.url).searchParams) === 'roast') void queryClient.prefetchQuery(getDayBatchesQueryOptions(date));
    return null;
  };

function Loading({ what }: { what: string }) {
  return (
    <div>
      <p role="status" className="sr-only">
        Loading the {what}…
      </p>
      <Skeleton className="h-64 rounded-card" />
    </div>
  );
}

function RoastListPanel({ date }: { date: string }) {
  const roastList = useRoastList(date);
  const batches = useDayBatches(date);
  const settings = useShopSettings().data;
  if (roastList.isError) return <ErrorState title="The Roast List could not load" error={roastList.error} onRetry={() => void roastList.refetch()} />;
  if (!roastList.data) return <Loading what="Roast List" />;
  return (
    <>
      <RoastListView roastList={roastList.data} today={shopToday(settings)} />
      <section aria-labelledby="day-batches" className="print-section">
        <h2 id="day-batches" className="mb-3 text-h3">
          Batches recorded
        </h2>
        {batches.isError ? (
          <ErrorState title="The day’s batches could not load" error={batches.error} onRetry={() => void batches.refetch()} />
        ) : batches.data ? (
          <DayBatches batches={batches.data.items} />
        ) : (
          <Loading what="batches" />
        )}
      </section>
    </>
  );
}

function PackListPanel({ date, canTrace }: { date: string; canTrace: boolean }) {
  const packList = usePackList(date);
  const settings = useShopSettings().data;
  if (packList.isError) return <ErrorState title="The Pack List could not load" error={packList.error} onRetry={() => void packList.refetch()} />;
  if (!packList.data) return <Loading what="Pack List" />;
  return (
    <PackListView
      packList={packList.data}
      canTrace={canTrace}
      labelsNeedAddress={settings !== undefined && settings.placeOfBusiness === null}
      carrierNames={settings?.carriers.map((carrier) => carrier.name)}
    />
  );
}

/** Bags on the Roast List and orders on the Pack List, once each has loaded. */
function useTabCounts(date: string): Partial<Record<DaySheetTab, number>> {
  const roastList = useRoastList(date).data;
  const packList = usePackList(date).data;
  return {
    ...(roastList ? { roast: roastList.lines.reduce((sum, line) => sum + line.bags, 0) } : {}),
    ...(packList ? { pack: packList.orders.length } : {}),
  };
}

/** A packer's Day Sheet: the Pack List alone, since the Roast List is the roasting staff's. */
function PackOnlySheet({ date }: { date: string }) {
  return (
    <>
      <PageTitle title={`Pack List ${date} · Roastery`} />
      <PageHeader eyebrow="Roastery · Day Sheet" title={formatDayLong(date)} lead="The bags to pack, label and ship." />
      <div className="mb-6">
        <DateSwitcher key={date} date={date} tab="pack" />
      </div>
      <section aria-labelledby="pack-list-heading">
        <h2 id="pack-list-heading" className="mb-3 text-h2">
          Pack List
        </h2>
        <PackListPanel date={date} canTrace={false} />
      </section>
    </>
  );
}

function DaySheet({ date }: { date: string }) {
  const [search, setSearch] = useSearchParams();
  const counts = useTabCounts(date);
  const tab = tabOf(search);
  const dayName = formatDayLong(date);

  return (
    <>
      <PageTitle title={`Day Sheet ${date} · Roastery`} />
      <PageHeader
        eyebrow="Roastery · Day Sheet"
        title={dayName}
        lead="What to roast and pull, the batches as they come off the roaster, and the bags to pack and ship."
      />
      <RoastDayCautions />
      <div className="mb-6">
        <DateSwitcher key={date} date={date} tab={tab} />
      </div>
      <DaySheetTabs
        selected={tab}
        onSelect={(next) => setSearch(next === 'pack' ? { tab: 'pack' } : {}, { replace: true })}
        panels={{ roast: <RoastListPanel date={date} />, pack: <PackListPanel date={date} canTrace /> }}
        counts={counts}
      />
    </>
  );
}

export default function DaySheetRoute() {
  const { date = '' } = useParams();
  const role = useCurrentUser().data?.role;
  if (!isIsoDate(date)) return <NotFoundMessage />;
  if (!role) return null;
  return staffRoles.includes(role) ? <DaySheet date={date} /> : <PackOnlySheet date={date} />;
}
