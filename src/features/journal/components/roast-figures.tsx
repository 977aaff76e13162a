import { formatClock } from '@shared/domain/journal';
import { roastLevelLabels } from '@shared/domain/vocabulary';
import type { JournalEntry } from '@shared/schemas/journal';
import { formatGrams, formatPercent } from '@/lib/format';

/** What Restday works out from one roast, and how it compares with the lot's suggestion. */
export function RoastFigures({ entry }: { entry: JournalEntry }) {
  const figures = [
    { term: 'Weight loss', value: `${formatPercent(entry.lossPct)} (${formatGrams(entry.greenGrams)} → ${formatGrams(entry.roastedGrams)})` },
    { term: 'Development time', value: entry.developmentSeconds === undefined ? 'No first crack recorded' : `${entry.developmentSeconds} s` },
    { term: 'Development time ratio', value: entry.developmentTimeRatio === undefined ? '—' : formatPercent(entry.developmentTimeRatio) },
    { term: 'Level the loss points to', value: roastLevelLabels[entry.estimatedLevel] },
    { term: 'Roast time', value: formatClock(entry.endSeconds) },
  ];
  return (
    <div>
      <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-1">
        {figures.map(({ term, value }) => (
          <div key={term} className="contents">
            <dt className="text-ink-muted">{term}</dt>
            <dd className="font-semibold">{value}</dd>
          </div>
        ))}
      </dl>
      <p className="mt-3 max-w-prose">{entry.comparison.message}</p>
    </div>
  );
}
