import { formatClock } from '@shared/domain/journal';
import { homeRoastDeviceLabels, roastLevelLabels } from '@shared/domain/vocabulary';
import type { JournalEntry } from '@shared/schemas/journal';
import { Button } from '@/components/ui/button';
import { formatDay } from '@/lib/dates';
import { formatPercent } from '@/lib/format';

type JournalListProps = {
  entries: JournalEntry[];
  selectedId?: string | undefined;
  onShow: (entry: JournalEntry) => void;
  onEdit: (entry: JournalEntry) => void;
  onDelete: (entry: JournalEntry) => void;
};

/** The customer's roasts, newest first, each with its headline figures. */
export function JournalList({ entries, selectedId, onShow, onEdit, onDelete }: JournalListProps) {
  return (
    <ul aria-label="Your roasts" className="divide-y divide-rule rounded-card border border-rule bg-sheet">
      {entries.map((entry) => {
        const title = `${entry.lotName}, ${formatDay(entry.roastedOn)}`;
        return (
          <li key={entry.id} aria-current={entry.id === selectedId ? 'true' : undefined} className="flex flex-wrap items-center justify-between gap-3 p-4">
            <div>
              <p className="font-semibold">{title}</p>
              <p className="text-small text-ink-muted">
                {homeRoastDeviceLabels[entry.device]} · {formatClock(entry.endSeconds)} · loss {formatPercent(entry.lossPct)}
                {entry.developmentSeconds !== undefined ? ` · development ${entry.developmentSeconds} s` : ''} ·{' '}
                {roastLevelLabels[entry.levelReached ?? entry.estimatedLevel]}
              </p>
            </div>
            <div className="flex flex-wrap gap-2">
              <Button variant="secondary" onClick={() => onShow(entry)} aria-label={`Show ${title}`}>
                Show
              </Button>
              <Button variant="secondary" onClick={() => onEdit(entry)} aria-label={`Change ${title}`}>
                Change
              </Button>
              <Button variant="secondary" onClick={() => onDelete(entry)} aria-label={`Delete ${title}`}>
                Delete
              </Button>
            </div>
          </li>
        );
      })}
    </ul>
  );
}
