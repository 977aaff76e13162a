import clsx from 'clsx';
import { Printer, TriangleAlert } from 'lucide-react';
import { Fragment, useRef, useState } from 'react';
import { roastLevelLabels } from '@shared/domain/vocabulary';
import type { BatchCreated, RoastListLine, RoastListResponse } from '@shared/schemas/roastery';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { Table, TableBody, TableCell, TableFrame, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';
import { DownloadLink } from '@/components/ui/download-link';
import { roastListPath, roastListPdfPath } from '../api/get-roast-list';
import { formatExactGrams, formatLossPct } from '../utils/roast-day-format';
import { RecordBatchForm, ServerAnswer } from './record-batch-form';

/** "2 × 4,200 g" when the loads are equal, else each load. */
function describeLoads(batches: RoastListLine['batches']): string {
  if (batches.length === 0) return '—';
  const first = batches[0]?.greenGrams ?? 0;
  if (batches.every((batch) => batch.greenGrams === first)) return `${batches.length} × ${formatExactGrams(first)}`;
  return batches.map((batch) => formatExactGrams(batch.greenGrams)).join(' + ');
}

const lossSourceLabels = { level: 'level default', lot: 'this lot’s batches' } as const;

function LineRows({ line, date, today }: { line: RoastListLine; date: string; today?: string }) {
  const [recording, setRecording] = useState(false);
  const [saved, setSaved] = useState<BatchCreated>();
  const toggleRef = useRef<HTMLButtonElement>(null);
  const formRowId = `record-${line.lotCode}-${line.roastLevel}`;
  const nextLoad = line.toRoast.batches[0]?.greenGrams;
  const done = line.toRoast.roastedGrams === 0;
  return (
    <Fragment>
      <tr>
        <TableRowHeader className="font-semibold">
          {line.lotName}
          <span className="block text-small font-normal text-ink-muted print:text-black">{line.lotCode}</span>
        </TableRowHeader>
        <TableCell>{roastLevelLabels[line.roastLevel]}</TableCell>
        <TableCell align="right" className="whitespace-nowrap">
          {line.bags}
        </TableCell>
        <TableCell align="right" className="whitespace-nowrap">
          {formatExactGrams(line.roastedGrams)}
        </TableCell>
        <TableCell align="right" className="whitespace-nowrap">
          {formatLossPct(line.lossPct)}
          <span className="block text-small text-ink-muted print:text-black">{lossSourceLabels[line.lossSource]}</span>
        </TableCell>
        <TableCell align="right" className="whitespace-nowrap font-semibold">
          {formatExactGrams(line.greenGrams)}
        </TableCell>
        <TableCell>
          {describeLoads(line.batches)}
          {line.floorProposal ? (
            <span className="block text-small text-ink-muted print:text-black">
              At the floor: {formatExactGrams(line.floorProposal.batchGreenGrams)} a batch, {formatExactGrams(line.floorProposal.extraGreenGrams)} more green
            </span>
          ) : null}
        </TableCell>
        <TableCell>
          {line.recorded.batches} of {line.batches.length}
          {line.recorded.batches > 0 ? (
            <span className="block text-small text-ink-muted print:text-black">
              {formatExactGrams(line.recorded.greenGrams)} in, {formatExactGrams(line.recorded.roastedGrams)} out
            </span>
          ) : null}
        </TableCell>
        <TableCell>
          {done ? 'Done' : describeLoads(line.toRoast.batches)}
          {done ? null : <span className="block text-small text-ink-muted print:text-black">{formatExactGrams(line.toRoast.roastedGrams)} roasted to go</span>}
        </TableCell>
        <TableCell className="hidden text-small print:table-cell print:px-1">
          <span className="block">in ___</span>
          <span className="mt-2 block">out ___</span>
        </TableCell>
        <TableCell className="print:hidden">
          <Button
            ref={toggleRef}
            variant="secondary"
            className="whitespace-nowrap"
            aria-expanded={recording}
            aria-controls={formRowId}
            onClick={() => {
              setSaved(undefined);
              setRecording((open) => !open);
            }}
          >
            {recording ? 'Close' : 'Record batch'}
            <span className="sr-only">
              {' '}
              of {line.lotName}, {roastLevelLabels[line.roastLevel]}
            </span>
          </Button>
        </TableCell>
      </tr>
      <tr id={formRowId} hidden={!recording} className="print:hidden">
        <TableCell colSpan={10} className="bg-paper py-4">
          {recording ? (
            <RecordBatchForm
              line={{ roastDate: date, lotCode: line.lotCode, lotName: line.lotName, roastLevel: line.roastLevel }}
              suggestedGreenGrams={nextLoad}
              today={today}
              onRecorded={(batch) => {
                // Closed at once, so the same numbers are never one click from a second entry.
                setRecording(false);
                setSaved(batch);
                toggleRef.current?.focus();
              }}
            />
          ) : null}
        </TableCell>
      </tr>
      {saved ? (
        <tr className="print:hidden">
          <TableCell colSpan={10} className="bg-paper py-3">
            <ServerAnswer batch={saved} level={line.roastLevel} />
          </TableCell>
        </tr>
      ) : null}
    </Fragment>
  );
}

function Totals({ roastList }: { roastList: RoastListResponse }) {
  const { totals } = roastList;
  const facts = [
    ['Roasted coffee planned', formatExactGrams(totals.roastedGrams)],
    ['Green still to pull', formatExactGrams(totals.toRoast.greenGrams)],
    ['Batches still to roast', totals.toRoast.batches === totals.batches ? String(totals.batches) : `${totals.toRoast.batches} of ${totals.batches} planned`],
    ['Day capacity', roastList.day.open ? `${formatExactGrams(roastList.day.capacityGrams)} green` : 'Closed'],
  ] as const;
  return (
    <dl className="mb-6 grid grid-cols-2 gap-3 lg:grid-cols-4">
      {facts.map(([label, value]) => (
        <div key={label} className="rounded-card border border-rule bg-sheet p-4 print:border-black print:p-2">
          <dt className="text-small text-ink-muted print:text-black">{label}</dt>
          <dd className="font-heading text-h3 tabular-nums">{value}</dd>
        </div>
      ))}
    </dl>
  );
}

function Warnings({ warnings }: { warnings: RoastListResponse['warnings'] }) {
  if (warnings.length === 0) return null;
  return (
    <section aria-labelledby="roast-list-warnings" className="mb-6 rounded-card border border-caution/40 bg-caution-wash p-4 print:border-black">
      <h2 id="roast-list-warnings" className="flex items-center gap-2 text-h3 text-caution print:text-black">
        <TriangleAlert aria-hidden="true" className="size-5" />
        Warnings
      </h2>
      <ul className="mt-2 list-disc space-y-1 pl-5">
        {warnings.map((warning) => (
          <li key={`${warning.code}-${warning.lotCode ?? ''}-${warning.roastLevel ?? ''}`}>{warning.message}</li>
        ))}
      </ul>
    </section>
  );
}

/** Green already roasted today per lot: what its recorded batches took out of stock. */
function roastedGreenByLot(lines: RoastListLine[]): Map<string, number> {
  const byLot = new Map<string, number>();
  for (const line of lines) byLot.set(line.lotCode, (byLot.get(line.lotCode) ?? 0) + line.recorded.greenGrams);
  return byLot;
}

/**
 * The Roast List of one day: what to roast, in which batches, and the green still to pull for it.
 * `today` is the shop's: recording a batch for a later day asks first.
 */
export function RoastListView({ roastList, today }: { roastList: RoastListResponse; today?: string }) {
  const { date } = roastList;
  const roastedGreen = roastedGreenByLot(roastList.lines);
  return (
    <div>
      <div className="mb-6 flex flex-wrap gap-2 print:hidden">
        <Button variant="secondary" onClick={() => window.print()}>
          <Printer aria-hidden="true" className="size-4" />
          Print the Roast List
        </Button>
        <DownloadLink href={roastListPath(date, 'csv')}>Roast List (CSV)</DownloadLink>
        <DownloadLink href={roastListPdfPath(date, 'letter')}>Roast List (PDF, Letter)</DownloadLink>
        <DownloadLink href={roastListPdfPath(date, 'a4')}>Roast List (PDF, A4)</DownloadLink>
      </div>

      <Totals roastList={roastList} />
      <Warnings warnings={roastList.warnings} />

      {roastList.lines.length === 0 ? (
        <EmptyState title="Nothing to roast">No paid orders are planned for this day yet.</EmptyState>
      ) : (
        <section aria-labelledby="roast-lines" className="mb-8">
          <h2 id="roast-lines" className="mb-3 text-h3">
            By lot and roast level
          </h2>
          <TableFrame className="print:overflow-visible print:rounded-none print:border-0">
            <Table variant="sheet">
              <TableHead>
                <tr>
                  <TableHeader>Lot</TableHeader>
                  <TableHeader>Level</TableHeader>
                  <TableHeader align="right">Bags</TableHeader>
                  <TableHeader align="right">Roasted</TableHeader>
                  <TableHeader align="right">Loss</TableHeader>
                  <TableHeader align="right">Green</TableHeader>
                  <TableHeader>Batches</TableHeader>
                  <TableHeader>Recorded</TableHeader>
                  <TableHeader>Still to roast</TableHeader>
                  <TableHeader className="hidden print:table-cell print:px-1">
                    Actual<span className="sr-only"> weights, written in by hand</span>
                  </TableHeader>
                  <TableHeader className="print:hidden">
                    <span className="sr-only">Actions</span>
                  </TableHeader>
                </tr>
              </TableHead>
              <TableBody>
                {roastList.lines.map((line) => (
                  <LineRows key={`${line.lotCode}-${line.roastLevel}`} line={line} date={date} today={today} />
                ))}
              </TableBody>
            </Table>
          </TableFrame>
        </section>
      )}

      {roastList.lines.length > 0 ? (
        <section aria-labelledby="pull-list" className="print-section mb-8">
          <h2 id="pull-list" className="mb-1 text-h3">
            Pull list
          </h2>
          <p className="mb-3 text-small text-ink-muted print:text-black">
            The green still to pull for the batches not yet recorded; it updates as each batch is saved.
          </p>
          {roastList.pull.length === 0 ? (
            <p className="text-ink-muted print:text-black">Everything on this list is roasted: no green left to pull.</p>
          ) : (
            <TableFrame className="print:overflow-visible print:rounded-none print:border-0">
              <Table variant="sheet">
                <TableHead>
                  <tr>
                    <TableHeader>Lot</TableHeader>
                    <TableHeader align="right">Still to pull</TableHeader>
                    <TableHeader align="right">Already roasted</TableHeader>
                    <TableHeader align="right">In stock</TableHeader>
                    <TableHeader align="right">Short by</TableHeader>
                  </tr>
                </TableHead>
                <TableBody>
                  {roastList.pull.map((pull) => (
                    <tr key={pull.lotCode}>
                      <TableRowHeader className="font-semibold">
                        {pull.lotName}
                        <span className="block text-small font-normal text-ink-muted print:text-black">{pull.lotCode}</span>
                      </TableRowHeader>
                      <TableCell align="right" className="whitespace-nowrap">
                        {formatExactGrams(pull.greenGrams)}
                      </TableCell>
                      <TableCell align="right" className="whitespace-nowrap">
                        {formatExactGrams(roastedGreen.get(pull.lotCode) ?? 0)}
                      </TableCell>
                      <TableCell align="right" className="whitespace-nowrap">
                        {formatExactGrams(pull.stockGrams)}
                      </TableCell>
                      <TableCell align="right" className={clsx('whitespace-nowrap', pull.shortfallGrams > 0 && 'font-semibold text-alert print:text-black')}>
                        {pull.shortfallGrams > 0 ? formatExactGrams(pull.shortfallGrams) : 'None'}
                      </TableCell>
                    </tr>
                  ))}
                </TableBody>
              </Table>
            </TableFrame>
          )}
        </section>
      ) : null}
    </div>
  );
}
