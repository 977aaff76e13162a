import { Link } from 'react-router-dom';
import { roastLevelLabels } from '@shared/domain/vocabulary';
import type { Batch } from '@shared/schemas/roastery';
import { Badge } from '@/components/ui/badge';
import { paths } from '@/config/paths';
import { formatTime } from '@/lib/dates';
import { formatExactGrams, formatLossPct, formatMinutesSeconds } from '../utils/roast-day-format';

const cell = 'border-b border-rule px-3 py-2 text-left align-top print:border print:border-black';
const numberCell = `${cell} whitespace-nowrap text-right tabular-nums`;

/**
 * The batches recorded for the day, each with its loss, its flag and a way to trace it. Times read
 * in `timeZone`, the shop's, when known.
 */
export function DayBatches({ batches, timeZone }: { batches: Batch[]; timeZone?: string }) {
  if (batches.length === 0) return <p className="text-ink-muted">No batches recorded for this day yet.</p>;
  return (
    <div className="overflow-x-auto rounded-card border border-rule bg-sheet print:overflow-visible print:rounded-none print:border-0">
      <table className="w-full border-collapse">
        <caption className="sr-only">Batches recorded for the day</caption>
        <thead>
          <tr>
            {['Recorded', 'Lot', 'Level', 'Green in', 'Roasted out', 'Loss', 'Times', 'Operator'].map((heading) => (
              <th key={heading} scope="col" className={`${cell} text-small font-semibold`}>
                {heading}
              </th>
            ))}
            <th scope="col" className={`${cell} print:hidden`}>
              <span className="sr-only">Trace</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {batches.map((batch) => (
            <tr key={batch.id}>
              <td className={cell}>{formatTime(batch.createdAt, timeZone)}</td>
              <th scope="row" className={`${cell} font-semibold`}>
                {batch.lotName}
                <span className="block text-small font-normal text-ink-muted print:text-black">{batch.lotCode}</span>
              </th>
              <td className={cell}>{roastLevelLabels[batch.roastLevel]}</td>
              <td className={numberCell}>{formatExactGrams(batch.greenGramsIn)}</td>
              <td className={numberCell}>{formatExactGrams(batch.roastedGramsOut)}</td>
              <td className={numberCell}>
                {formatLossPct(batch.lossPct)}
                <span className="block">
                  {batch.withinExpected ? <Badge tone="ok">Within expected</Badge> : <Badge tone="alert">Outside expected</Badge>}
                </span>
              </td>
              <td className={cell}>
                {batch.totalSeconds === null ? '—' : `${formatMinutesSeconds(batch.totalSeconds)} total`}
                {batch.firstCrackSeconds === null ? null : (
                  <span className="block text-small">first crack {formatMinutesSeconds(batch.firstCrackSeconds)}</span>
                )}
                {batch.developmentTimeRatio === null ? null : (
                  <span className="block text-small">DTR {formatLossPct(batch.developmentTimeRatio)}</span>
                )}
              </td>
              <td className={cell}>
                {batch.operatorName ?? '—'}
                {batch.notes ? <span className="block text-small text-ink-muted print:text-black">{batch.notes}</span> : null}
              </td>
              <td className={`${cell} print:hidden`}>
                <Link to={paths.roastery.batch.getHref(batch.id)} className="font-semibold text-leaf underline">
                  Trace<span className="sr-only"> the {formatExactGrams(batch.greenGramsIn)} batch of {batch.lotName}</span>
                </Link>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
