import type { QueryClient } from '@tanstack/react-query';
import { useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { ledgerQuerySchema } from '@shared/schemas/ledger';
import { PageTitle } from '@/components/seo/page-title';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { Skeleton } from '@/components/ui/skeleton';
import { RequireRole } from '@/features/auth/components/require-role';
import { requireUser } from '@/features/auth/utils/require-user';
import { ownerRoles } from '@/features/auth/utils/roles';
import { getLedgerQueryOptions, useLedger } from '@/features/ledger/api/get-ledger';
import { LedgerView } from '@/features/ledger/components/ledger-view';
import { getPlanningQueryOptions, usePlanning } from '@/features/planning/api/get-planning';
import { GreenPlanning } from '@/features/planning/components/green-planning';
import { formatDay } from '@/lib/dates';

const weekChoices = [4, 12, 26, 52] as const;

function weeksOf(search: URLSearchParams): number {
  const parsed = ledgerQuerySchema.safeParse({ weeks: search.get('weeks') ?? undefined });
  return parsed.success ? parsed.data.weeks : 12;
}

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    // Only the owner's browser asks for the Ledger; anyone else is shown why the page is closed.
    const user = await requireUser(queryClient, request);
    if (ownerRoles.includes(user.role)) {
      void queryClient.prefetchQuery(getLedgerQueryOptions(weeksOf(new URL(request.url).searchParams)));
      void queryClient.prefetchQuery(getPlanningQueryOptions());
    }
    return null;
  };

function Loading({ what }: { what: string }) {
  return (
    <div>
      <p role="status" className="sr-only">
        Loading {what}…
      </p>
      <Skeleton className="h-72 rounded-card" />
    </div>
  );
}

function Ledger({ weeks }: { weeks: number }) {
  const ledgerQuery = useLedger(weeks);
  if (ledgerQuery.isError) return <ErrorState title="The Ledger could not load" error={ledgerQuery.error} onRetry={() => void ledgerQuery.refetch()} />;
  if (!ledgerQuery.data) return <Loading what="the Ledger" />;
  const { from, to } = ledgerQuery.data;
  return (
    <>
      <p className="mb-6 text-small text-ink-muted">
        {formatDay(from)} to {formatDay(to)}, week by week (Monday to Sunday). Sales are order totals with shipping, in the week they were paid; refunds in the
        week they were made.
      </p>
      <LedgerView ledger={ledgerQuery.data} />
    </>
  );
}

function Planning() {
  const planningQuery = usePlanning();
  if (planningQuery.isError) {
    return <ErrorState title="Green planning could not load" error={planningQuery.error} onRetry={() => void planningQuery.refetch()} />;
  }
  if (!planningQuery.data) return <Loading what="green planning" />;
  return <GreenPlanning plan={planningQuery.data} />;
}

export default function LedgerRoute() {
  const [search, setSearch] = useSearchParams();
  const weeks = weeksOf(search);
  return (
    <RequireRole
      allowed={ownerRoles}
      notAllowed={{ title: 'The Ledger is for the owner', reason: 'Only the shop’s owner sees its sales, refunds and revenue.' }}
    >
      <PageTitle title="Ledger · Roastery" />
      <div className="flex flex-wrap items-start justify-between gap-4">
        <PageHeader
          eyebrow="Roastery"
          title="Ledger"
          lead="Sales, refunds, subscriptions, green coffee and roast loss by week, and the green coffee the coming weeks need."
        />
        <label className="grid gap-1 text-small font-semibold">
          Weeks shown
          <select
            className="min-h-11 rounded-control border border-rule-strong bg-sheet px-3"
            value={weeks}
            onChange={(event) => setSearch(new URLSearchParams({ weeks: event.target.value }), { replace: true })}
          >
            {weekChoices.map((choice) => (
              <option key={choice} value={choice}>
                Last {choice} weeks
              </option>
            ))}
          </select>
        </label>
      </div>
      <div className="grid gap-10">
        <Ledger weeks={weeks} />
        <Planning />
      </div>
    </RequireRole>
  );
}
