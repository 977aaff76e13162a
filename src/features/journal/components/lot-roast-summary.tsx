import { roastLevelLabels } from '@shared/domain/vocabulary';
import type { LotRoastSummaryResponse } from '@shared/schemas/journal-summary';
import { formatPercent } from '@/lib/format';
import { useLotRoastSummary, type SummaryAudience } from '../api/get-lot-roast-summary';

type Summary = NonNullable<LotRoastSummaryResponse['summary']>;

function Figures({ summary }: { summary: Summary }) {
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-1">
      <dt className="text-ink-muted">Roasts logged</dt>
      <dd className="font-semibold">
        {summary.roasts}, by {summary.customers} home roasters
      </dd>
      <dt className="text-ink-muted">Median weight loss</dt>
      <dd className="font-semibold">{formatPercent(summary.medianLossPct)}</dd>
      <dt className="text-ink-muted">Median development time</dt>
      <dd className="font-semibold">{summary.medianDevelopmentSeconds === null ? 'Too few first cracks recorded' : `${summary.medianDevelopmentSeconds} s`}</dd>
      <dt className="text-ink-muted">Levels reached</dt>
      <dd className="font-semibold">{summary.levels.map((row) => `${roastLevelLabels[row.level]} ${row.roasts}`).join(' · ')}</dd>
    </dl>
  );
}

/**
 * "How home roasters roast it": the anonymous figures from the Roast Journal, or nothing at all
 * below the minimum roasts and customers.
 */
export function LotRoastSummary({ code, audience }: { code: string; audience: SummaryAudience }) {
  const query = useLotRoastSummary(code, audience);
  const data = query.data;
  if (!data) return null;
  const { summary } = data;
  if (!summary) {
    return audience === 'staff' ? (
      <p className="text-ink-muted">
        Home roasters&rsquo; figures show from {data.minimum.roasts} Roast Journal entries by {data.minimum.customers} customers, so no single customer can be
        read off.
      </p>
    ) : null;
  }
  return (
    <section aria-labelledby={`home-roasts-${audience}`} className="rounded-card border border-rule bg-sheet p-5">
      <h2 id={`home-roasts-${audience}`} className="text-h3">
        How home roasters roast it
      </h2>
      <p className="mt-1 text-small text-ink-muted">From customers&rsquo; Roast Journals, anonymous.</p>
      <div className="mt-3">
        <Figures summary={summary} />
      </div>
      {summary.disagreement ? (
        <p className="mt-3 rounded-card bg-caution-wash p-3" role={audience === 'staff' ? 'status' : undefined}>
          {summary.disagreement.roasts} roasts by {summary.disagreement.customers} home roasters ended at another level than the suggested{' '}
          {roastLevelLabels[data.suggestedLevel].toLowerCase()}, mostly {summary.disagreement.mostly}.
          {audience === 'staff' ? ' Worth a look at the suggested level.' : ''}
        </p>
      ) : null}
    </section>
  );
}
