import { Bar, BarChart, CartesianGrid, ReferenceLine, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis } from 'recharts';
import { formatClock, roastPhases, type RoastPhaseSpan } from '@shared/domain/journal';
import type { JournalEntry } from '@shared/schemas/journal';
import { Table, TableBody, TableCell, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';
import { formatPercent } from '@/lib/format';

const phaseNames: Record<RoastPhaseSpan['phase'], string> = { drying: 'Drying', browning: 'Browning', development: 'Development' };
// The house's warm palette, light to dark, as the beans go.
const phaseColours: Record<RoastPhaseSpan['phase'], string> = { drying: '#c9b458', browning: '#b0763a', development: '#6b3f22' };

/** One roast's phases on its time axis, first crack marked; the same as a table below for screen readers. */
export function RoastPhaseChart({ entry }: { entry: JournalEntry }) {
  const spans = roastPhases(entry);
  const row = Object.fromEntries(spans.map((span) => [span.phase, span.endSeconds - span.startSeconds]));
  return (
    <figure>
      <figcaption className="text-h3">Phases of this roast</figcaption>
      <div aria-hidden="true" className="mt-2 h-28">
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={[row]} layout="vertical" margin={{ top: 16, right: 24, bottom: 4, left: 8 }}>
            <XAxis type="number" domain={[0, entry.endSeconds]} tickFormatter={(seconds: number) => formatClock(seconds)} />
            <YAxis type="category" hide />
            {spans.map((span) => (
              <Bar
                key={span.phase}
                dataKey={span.phase}
                stackId="roast"
                fill={phaseColours[span.phase]}
                name={phaseNames[span.phase]}
                isAnimationActive={false}
              />
            ))}
            {entry.firstCrackSeconds !== undefined ? (
              <ReferenceLine x={entry.firstCrackSeconds} stroke="#1f1a17" strokeDasharray="4 3" label={{ value: 'First crack', position: 'top' }} />
            ) : null}
          </BarChart>
        </ResponsiveContainer>
      </div>
      <Table className="mt-2">
        <TableHead>
          <tr>
            <TableHeader>Phase</TableHeader>
            <TableHeader>From</TableHeader>
            <TableHeader>To</TableHeader>
            <TableHeader align="right">Length</TableHeader>
          </tr>
        </TableHead>
        <TableBody>
          {spans.map((span) => (
            <tr key={span.phase}>
              <TableRowHeader>
                <span aria-hidden="true" className="mr-2 inline-block size-3 rounded-sm" style={{ backgroundColor: phaseColours[span.phase] }} />
                {phaseNames[span.phase]}
              </TableRowHeader>
              <TableCell>{formatClock(span.startSeconds)}</TableCell>
              <TableCell>
                {span.endSeconds === entry.firstCrackSeconds ? `${formatClock(span.endSeconds)} (first crack)` : formatClock(span.endSeconds)}
              </TableCell>
              <TableCell align="right">{span.endSeconds - span.startSeconds} s</TableCell>
            </tr>
          ))}
        </TableBody>
      </Table>
    </figure>
  );
}

/** The customer's roasts of one lot side by side: weight loss against development time. */
export function LotRoastsChart({ entries, selectedId }: { entries: JournalEntry[]; selectedId?: string | undefined }) {
  const points = entries
    .filter((entry) => entry.developmentSeconds !== undefined)
    .map((entry) => ({ id: entry.id, roastedOn: entry.roastedOn, developmentSeconds: entry.developmentSeconds!, lossPct: entry.lossPct }));
  if (points.length === 0) return null;
  const selected = points.filter((point) => point.id === selectedId);
  const others = points.filter((point) => point.id !== selectedId);
  return (
    <figure>
      <figcaption className="text-h3">Your roasts of this lot</figcaption>
      <div aria-hidden="true" className="mt-2 h-64">
        <ResponsiveContainer width="100%" height="100%">
          <ScatterChart margin={{ top: 8, right: 24, bottom: 24, left: 8 }}>
            <CartesianGrid strokeDasharray="3 3" />
            <XAxis
              type="number"
              dataKey="developmentSeconds"
              name="Development"
              unit=" s"
              label={{ value: 'Development time (s)', position: 'insideBottom', offset: -12 }}
            />
            <YAxis type="number" dataKey="lossPct" name="Loss" unit="%" domain={['dataMin - 1', 'dataMax + 1']} />
            <Tooltip />
            <Scatter data={others} fill="#b0763a" isAnimationActive={false} />
            <Scatter data={selected} fill="#6b3f22" shape="diamond" isAnimationActive={false} />
          </ScatterChart>
        </ResponsiveContainer>
      </div>
      <Table className="mt-2">
        <TableHead>
          <tr>
            <TableHeader>Roasted on</TableHeader>
            <TableHeader align="right">Development</TableHeader>
            <TableHeader align="right">Weight loss</TableHeader>
          </tr>
        </TableHead>
        <TableBody>
          {points.map((point) => (
            <tr key={point.id} aria-current={point.id === selectedId ? 'true' : undefined}>
              <TableRowHeader>
                {point.roastedOn}
                {point.id === selectedId ? ' (this roast)' : ''}
              </TableRowHeader>
              <TableCell align="right">{point.developmentSeconds} s</TableCell>
              <TableCell align="right">{formatPercent(point.lossPct)}</TableCell>
            </tr>
          ))}
        </TableBody>
      </Table>
    </figure>
  );
}
