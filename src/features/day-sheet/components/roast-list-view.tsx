import { Download, Printer, TriangleAlert } from 'lucide-react';
import { Fragment, useState } from 'react';
import { roastLevelLabels } from '@shared/domain/vocabulary';
import type { RoastListLine, RoastListResponse } from '@shared/schemas/roastery';
import { Button, buttonStyles } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { roastListPath, roastListPdfPath } from '../api/get-roast-list';
import { formatExactGrams, formatLossPct } from '../utils/roast-day-format';
import { RecordBatchForm } from './record-batch-form';

const cell = 'border-b border-rule px-3 py-2 text-left align-top print:border print:border-black';
const headCell = `${cell} text-small font-semibold`;
const numberCell = `${cell} whitespace-nowrap text-right tabular-nums`;

/** "2 × 4,200 g" when the loads are equal, else each load. */
function describeLoads(batches: RoastListLine['batches']): string {
  if (batches.length === 0) return '—';
  const first = batches[0]?.greenGrams ?? 0;
  if (batches.every((batch) => batch.greenGrams === first)) return `${batches.length} × ${formatExactGrams(first)}`;
  return batches.map((batch) => formatExactGrams(batch.greenGrams)).join(' + ');
}

const lossSourceLabels = { level: 'level default', lot: 'this lot’s batches' } as const;

function LineRows({ line, date }: { line: RoastListLine; date: string }) {
  const [recording, setRecording] = useState(false);
  const formRowId = `record-${line.lotCode}-${line.roastLevel}`;
  const nextLoad = line.toRoast.batches[0]?.greenGrams;
  const done = line.toRoast.roastedGrams === 0;
  return (
    <Fragment>
      <tr>
        <th scope="row" className={`${cell} font-semibold`}>
          {line.lotName}
          <span className="block text-small font-normal text-ink-muted print:text-black">{line.lotCode}</span>
        </th>
        <td className={cell}>{roastLevelLabels[line.roastLevel]}</td>
        <td className={numberCell}>{line.bags}</td>
        <td className={numberCell}>{formatExactGrams(line.roastedGrams)}</td>
        <td className={numberCell}>
          {formatLossPct(line.lossPct)}
          <span className="block text-small text-ink-muted print:text-black">{lossSourceLabels[line.lossSource]}</span>
        </td>
        <td className={`${numberCell} font-semibold`}>{formatExactGrams(line.greenGrams)}</td>
        <td className={cell}>
          {describeLoads(line.batches)}
          {line.floorProposal ? (
            <span className="block text-small text-ink-muted print:text-black">
              At the floor: {formatExactGrams(line.floorProposal.batchGreenGrams)} a batch, {formatExactGrams(line.floorProposal.extraGreenGrams)} more green
            </span>
          ) : null}
        </td>
        <td className={cell}>
          {line.recorded.batches} of {line.batches.length}
          {line.recorded.batches > 0 ? (
            <span className="block text-small text-ink-muted print:text-black">
              {formatExactGrams(line.recorded.greenGrams)} in, {formatExactGrams(line.recorded.roastedGrams)} out
            </span>
          ) : null}
        </td>
        <td className={cell}>
          {done ? 'Done' : describeLoads(line.toRoast.batches)}
          {done ? null : (
            <span className="block text-small text-ink-muted print:text-black">{formatExactGrams(line.toRoast.roastedGrams)} roasted to go</span>
          )}
        </td>
        <td className={`${cell} print:hidden`}>
          <Button variant="secondary" className="whitespace-nowrap" aria-expanded={recording} aria-controls={formRowId} onClick={() => setRecording((open) => !open)}>
            {recording ? 'Close' : 'Record batch'}
            <span className="sr-only">
              {' '}
              of {line.lotName}, {roastLevelLabels[line.roastLevel]}
            </span>
          </Button>
        </td>
      </tr>
      <tr id={formRowId} hidden={!recording} className="print:hidden">
        <td colSpan={10} className="border-b border-rule bg-paper px-3 py-4">
          {recording ? (
            <RecordBatchForm line={{ roastDate: date, lotCode: line.lotCode, lotName: line.lotName, roastLevel: line.roastLevel }} suggestedGreenGrams={nextLoad} />
          ) : null}
        </td>
      </tr>
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

/** The Roast List of one day: what to roast, in which batches, and the green to pull for it. */
export function RoastListView({ roastList }: { roastList: RoastListResponse }) {
  const { date } = roastList;
  return (
    <div>
      <div className="mb-6 flex flex-wrap gap-2 print:hidden">
        <Button variant="secondary" onClick={() => window.print()}>
          <Printer aria-hidden="true" className="size-4" />
          Print the Roast List
        </Button>
        <a href={roastListPath(date, 'csv')} download className={buttonStyles('secondary')}>
          <Download aria-hidden="true" className="size-4" />
          Roast List (CSV)
        </a>
        <a href={roastListPdfPath(date, 'letter')} download className={buttonStyles('secondary')}>
          <Download aria-hidden="true" className="size-4" />
          Roast List (PDF, Letter)
        </a>
        <a href={roastListPdfPath(date, 'a4')} download className={buttonStyles('secondary')}>
          <Download aria-hidden="true" className="size-4" />
          Roast List (PDF, A4)
        </a>
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
          <div className="overflow-x-auto rounded-card border border-rule bg-sheet print:overflow-visible print:rounded-none print:border-0">
            <table className="w-full border-collapse">
              <thead>
                <tr>
                  <th scope="col" className={headCell}>Lot</th>
                  <th scope="col" className={headCell}>Level</th>
                  <th scope="col" className={`${headCell} text-right`}>Bags</th>
                  <th scope="col" className={`${headCell} text-right`}>Roasted</th>
                  <th scope="col" className={`${headCell} text-right`}>Loss</th>
                  <th scope="col" className={`${headCell} text-right`}>Green</th>
                  <th scope="col" className={headCell}>Batches</th>
                  <th scope="col" className={headCell}>Recorded</th>
                  <th scope="col" className={headCell}>Still to roast</th>
                  <th scope="col" className={`${headCell} print:hidden`}>
                    <span className="sr-only">Actions</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {roastList.lines.map((line) => (
                  <LineRows key={`${line.lotCode}-${line.roastLevel}`} line={line} date={date} />
                ))}
              </tbody>
            </table>
          </div>
        </section>
      )}

      {roastList.lines.length > 0 ? (
        <section aria-labelledby="pull-list" className="print-section mb-8">
          <h2 id="pull-list" className="mb-3 text-h3">
            Pull list
          </h2>
          {roastList.pull.length === 0 ? (
            <p className="text-ink-muted print:text-black">Everything on this list is roasted: no green left to pull.</p>
          ) : (
            <div className="overflow-x-auto rounded-card border border-rule bg-sheet print:overflow-visible print:rounded-none print:border-0">
              <table className="w-full border-collapse">
                <thead>
                  <tr>
                    <th scope="col" className={headCell}>Lot</th>
                    <th scope="col" className={`${headCell} text-right`}>Green to pull</th>
                    <th scope="col" className={`${headCell} text-right`}>In stock</th>
                    <th scope="col" className={`${headCell} text-right`}>Short by</th>
                  </tr>
                </thead>
                <tbody>
                  {roastList.pull.map((pull) => (
                    <tr key={pull.lotCode}>
                      <th scope="row" className={`${cell} font-semibold`}>
                        {pull.lotName}
                        <span className="block text-small font-normal text-ink-muted print:text-black">{pull.lotCode}</span>
                      </th>
                      <td className={numberCell}>{formatExactGrams(pull.greenGrams)}</td>
                      <td className={numberCell}>{formatExactGrams(pull.stockGrams)}</td>
                      <td className={`${numberCell} ${pull.shortfallGrams > 0 ? 'font-semibold text-alert print:text-black' : ''}`}>
                        {pull.shortfallGrams > 0 ? formatExactGrams(pull.shortfallGrams) : 'None'}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
        </section>
      ) : null}
    </div>
  );
}
