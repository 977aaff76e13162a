import type { QueryClient } from '@tanstack/react-query';
import { ArrowRight } from 'lucide-react';
import type { ReactNode } from 'react';
import { Link, redirect, type LoaderFunctionArgs } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { CautionPanel } from '@/components/ui/caution-panel';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { requireUser } from '@/features/auth/utils/require-user';
import { roasteryRoles, staffRoles } from '@/features/auth/utils/roles';
import { getLotsQueryOptions, useLots } from '@/features/lots/api/get-lots';
import { GreenStockSnapshot } from '@/features/lots/components/green-stock-snapshot';
import { getTodayQueryOptions, useToday } from '@/features/today/api/get-today';
import { TodayOverview } from '@/features/today/components/today-overview';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    const user = await requireUser(queryClient, request);
    // A packer's Roastery starts at the day's Pack List; Today is the roasting staff's overview.
    if (!staffRoles.includes(user.role)) {
      if (roasteryRoles.includes(user.role)) throw redirect(paths.roastery.daySheetToday.getHref());
      return null;
    }
    void queryClient.prefetchQuery(getTodayQueryOptions());
    void queryClient.prefetchQuery(getLotsQueryOptions());
    return null;
  };

function Today() {
  const todayQuery = useToday();
  if (todayQuery.isError) return <ErrorState title="Today could not load" error={todayQuery.error} onRetry={() => void todayQuery.refetch()} />;
  if (!todayQuery.data) {
    return (
      <div className="grid gap-4 lg:grid-cols-2">
        <p role="status" className="sr-only">
          Loading today…
        </p>
        {[0, 1, 2, 3].map((index) => (
          <Skeleton key={index} className="h-40 rounded-card" />
        ))}
      </div>
    );
  }
  return <TodayOverview today={todayQuery.data} />;
}

function Source({ children }: { children: ReactNode }) {
  return <cite className="text-small not-italic text-ink-muted">({children})</cite>;
}

function StockSnapshot() {
  const lotsQuery = useLots();
  if (lotsQuery.data) return <GreenStockSnapshot lots={lotsQuery.data.items} />;
  if (lotsQuery.isError) {
    return <ErrorState title="Green stock could not load" error={lotsQuery.error} onRetry={() => void lotsQuery.refetch()} />;
  }
  return (
    <div className="grid grid-cols-2 gap-3 lg:grid-cols-4">
      <p role="status" className="sr-only">
        Loading green stock…
      </p>
      {[0, 1, 2, 3].map((index) => (
        <Skeleton key={index} className="h-24 rounded-card" />
      ))}
    </div>
  );
}

export default function RoasteryOverviewRoute() {
  return (
    <>
      <PageTitle title="Today · Roastery" />
      <PageHeader
        eyebrow="Roastery"
        title="Today"
        lead="What the next roast day needs, what goes out today, and what is stuck, each with the place to act on it."
      />

      <div className="mb-10">
        <Today />
      </div>

      <section aria-labelledby="green-stock" className="mb-10">
        <div className="mb-4 flex flex-wrap items-end justify-between gap-2">
          <h2 id="green-stock" className="text-h2">
            Green stock today
          </h2>
          <Link to={paths.roastery.greenStock.getHref()} className="inline-flex items-center gap-1 font-semibold text-leaf underline">
            Open Green Stock
            <ArrowRight aria-hidden="true" className="size-4" />
          </Link>
        </div>
        <StockSnapshot />
      </section>

      <div className="max-w-prose">
        <CautionPanel title="Before a roast day">
          <ul className="list-disc space-y-2 pl-5">
            <li>
              <strong>Chaff fires.</strong> Chaff collects in the roaster&rsquo;s chaff collector and ducting and can catch fire: empty and clean them on the
              schedule your roaster&rsquo;s maker and installer set.
            </li>
            <li>
              <strong>Carbon monoxide and smoke.</strong> The roaster gives off smoke and carbon monoxide, and so does roasted coffee in storage: 35–150+ ppm
              has been measured near large totes of roasted beans.{' '}
              <Source>Fire Engineering, Determining the Source of Carbon Monoxide Levels at a Roasted Coffee Facility</Source>
            </li>
            <li>
              <strong>Grinding and packing.</strong> Diacetyl and 2,3-pentanedione rise as coffee is ground and packed; recommended limits are 5 ppb diacetyl
              and 9.3 ppb 2,3-pentanedione over an 8-hour shift. <Source>NIOSH, flavorings-related lung disease, exposure limits</Source>
            </li>
            <li>
              <strong>Air and gas rules are local.</strong> Roaster exhaust, afterburners and gas appliances fall under local air-quality and building codes;
              one air district, for example, requires a permit for a drum roaster over 18 lb per batch.{' '}
              <Source>Sacramento Metropolitan AQMD, Coffee Bean Roasting Operations</Source>
            </li>
          </ul>
          <p className="mt-4 text-small text-ink-muted">
            This is a reminder, not legal or engineering advice: installation, venting and gas work are for your local codes and licensed installers to decide.
          </p>
        </CautionPanel>
      </div>
    </>
  );
}
