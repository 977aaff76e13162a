import { Link } from 'react-router-dom';
import { roastLevelLabels } from '@shared/domain/vocabulary';
import type { Batch } from '@shared/schemas/roastery';
import { Badge } from '@/components/ui/badge';
import { paths } from '@/config/paths';
import { useShopClock } from '@/lib/shop-clock';
import { Table, TableBody, TableCell, TableFrame, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';
import { formatExactGrams, formatLossPct, formatMinutesSeconds } from '../utils/roast-day-format';

/** The batches recorded for the day, each with its loss, its flag and a way to trace it; times on the shop's clock. */
export function DayBatches({ batches }: { batches: Batch[] }) {
  const clock = useShopClock();
  if (batches.length === 0) return <p className="text-ink-muted">No batches recorded for this day yet.</p>;
  return (
    <TableFrame className="print:overflow-visible print:rounded-none print:border-0">
      <Table variant="sheet">
        <caption className="sr-only">Batches recorded for the day</caption>
        <TableHead>
          <tr>
            {['Recorded', 'Lot', 'Level', 'Green in', 'Roasted out', 'Loss', 'Times', 'Operator'].map((heading) => (
              <TableHeader key={heading}>{heading}</TableHeader>
            ))}
            <TableHeader className="print:hidden">
              <span className="sr-only">Trace</span>
            </TableHeader>
          </tr>
        </TableHead>
        <TableBody>
          {batches.map((batch) => (
            <tr key={batch.id}>
              <TableCell>{clock.time(batch.createdAt)}</TableCell>
              <TableRowHeader className="font-semibold">
                {batch.lotName}
                <span className="block text-small font-normal text-ink-muted print:text-black">{batch.lotCode}</span>
              </TableRowHeader>
              <TableCell>{roastLevelLabels[batch.roastLevel]}</TableCell>
              <TableCell align="right" className="whitespace-nowrap">
                {formatExactGrams(batch.greenGramsIn)}
              </TableCell>
              <TableCell align="right" className="whitespace-nowrap">
                {formatExactGrams(batch.roastedGramsOut)}
              </TableCell>
              <TableCell align="right" className="whitespace-nowrap">
                {formatLossPct(batch.lossPct)}
                <span className="block">{batch.withinExpected ? <Badge tone="ok">Within expected</Badge> : <Badge tone="alert">Outside expected</Badge>}</span>
              </TableCell>
              <TableCell>
                {batch.totalSeconds === null ? '—' : `${formatMinutesSeconds(batch.totalSeconds)} total`}
                {batch.firstCrackSeconds === null ? null : (
                  <span className="block text-small">first crack {formatMinutesSeconds(batch.firstCrackSeconds)}</span>
                )}
                {batch.developmentTimeRatio === null ? null : <span className="block text-small">DTR {formatLossPct(batch.developmentTimeRatio)}</span>}
              </TableCell>
              <TableCell>
                {batch.operatorName ?? '—'}
                {batch.notes ? <span className="block text-small text-ink-muted print:text-black">{batch.notes}</span> : null}
              </TableCell>
              <TableCell className="print:hidden">
                <Link to={paths.roastery.batch.getHref(batch.id)} className="font-semibold text-leaf underline">
                  Trace
                  <span className="sr-only">
                    {' '}
                    the {formatExactGrams(batch.greenGramsIn)} batch of {batch.lotName}
                  </span>
                </Link>
              </TableCell>
            </tr>
          ))}
        </TableBody>
      </Table>
    </TableFrame>
  );
}
