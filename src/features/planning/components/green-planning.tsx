import { Link } from 'react-router-dom';
import type { PlanningResponse } from '@shared/schemas/planning';
import { LazyWeeklyChart } from '@/components/charts/lazy-weekly-chart';
import { Badge } from '@/components/ui/badge';
import { DownloadLink } from '@/components/ui/download-link';
import { Table, TableBody, TableCell, TableFrame, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';
import { paths } from '@/config/paths';
import { formatDayShort, formatDayWithWeekday } from '@/lib/dates';
import { formatGrams } from '@/lib/format';
import { planningCsvHref } from '../api/get-planning';

/** Theme colours for one line per lot, in turn. */
const lotColors = [
  'var(--color-leaf)',
  'var(--color-ember)',
  'var(--color-focus)',
  'var(--color-caution)',
  'var(--color-ink)',
  'var(--color-alert)',
  'var(--color-ok)',
  'var(--color-rule-strong)',
];

function ReorderStatus({ lot }: { lot: PlanningResponse['lots'][number] }) {
  if (lot.reorderNow) return <Badge tone="alert">Reorder now</Badge>;
  if (lot.reorderAlert) return <Badge tone="alert">At reorder point</Badge>;
  if (lot.reorderBy) return <Badge tone="neutral">Reorder by {formatDayShort(lot.reorderBy)}</Badge>;
  return <Badge tone="ok">Lasts the plan</Badge>;
}

/**
 * Green planning: what each lot needs week by week (roasting through the loss model and overage,
 * plus green sales at their recent pace), the week it runs out and the last day to reorder.
 */
export function GreenPlanning({ plan, headingLevel = 'h2' }: { plan: PlanningResponse; headingLevel?: 'h2' | 'h3' }) {
  const Heading = headingLevel;
  const lots = plan.lots.filter((lot) => lot.stockGrams > 0 || lot.needGrams > 0);
  const chartLots = lots.filter((lot) => lot.needGrams > 0).slice(0, lotColors.length);
  const chartData = (plan.lots[0]?.weeks ?? []).map((week, index) => ({
    start: week.start,
    ...Object.fromEntries(chartLots.map((lot) => [lot.lotCode, Math.max(0, lot.weeks[index]?.stockAfterGrams ?? 0)])),
  }));
  const unpicked = plan.unpickedRotationGreenGrams.reduce((sum, grams) => sum + grams, 0);
  return (
    <section aria-labelledby="green-planning" className="grid gap-4">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <Heading id="green-planning" className={headingLevel === 'h2' ? 'text-h2' : 'text-h3'}>
          Green planning, next {plan.weeks} weeks
        </Heading>
        <DownloadLink href={planningCsvHref(plan.weeks)}>Planning CSV</DownloadLink>
      </div>
      <p className="max-w-prose text-small text-ink-muted">
        Needs come from paid orders still to roast, every subscription&rsquo;s upcoming deliveries (skips, pauses and closed roast days included) through the
        loss model and the overage, and green sales at the pace of the last {plan.salesWindowDays} days. The reorder-by day is the run-out day less the
        lot&rsquo;s supplier lead time.
      </p>
      {chartLots.length > 0 ? (
        <LazyWeeklyChart
          caption="Green left at the end of each week, by lot"
          kind="line"
          data={chartData}
          xKey="start"
          series={chartLots.map((lot, index) => ({ key: lot.lotCode, label: lot.lotCode, color: lotColors[index]! }))}
          formatValue={formatGrams}
          formatX={formatDayShort}
        />
      ) : null}
      <TableFrame>
        <Table>
          <caption className="sr-only">Green planning by lot</caption>
          <TableHead>
            <tr>
              <TableHeader>Lot</TableHeader>
              <TableHeader align="right">On hand</TableHeader>
              {(plan.lots[0]?.weeks ?? []).map((week) => (
                <TableHeader key={week.start} align="right">
                  <span className="sr-only">Needed in the week of </span>
                  {formatDayShort(week.start)}
                </TableHeader>
              ))}
              <TableHeader>Runs out</TableHeader>
              <TableHeader align="right">Lead time</TableHeader>
              <TableHeader>Reorder</TableHeader>
            </tr>
          </TableHead>
          <TableBody>
            {lots.map((lot) => (
              <tr key={lot.lotCode}>
                <TableRowHeader>
                  <Link to={paths.roastery.lot.getHref(lot.lotCode)} className="font-semibold text-leaf underline">
                    {lot.name}
                  </Link>
                  <span className="block text-caption text-ink-muted">{lot.lotCode}</span>
                </TableRowHeader>
                <TableCell align="right">{formatGrams(lot.stockGrams)}</TableCell>
                {lot.weeks.map((week) => (
                  <TableCell key={week.start} align="right" className={week.stockAfterGrams < 0 ? 'font-semibold text-alert' : undefined}>
                    {week.needGrams > 0 ? formatGrams(week.needGrams) : '–'}
                  </TableCell>
                ))}
                <TableCell>{lot.runOutDate ? formatDayWithWeekday(lot.runOutDate) : 'Not within the plan'}</TableCell>
                <TableCell align="right">{lot.leadTimeDays} days</TableCell>
                <TableCell>
                  <ReorderStatus lot={lot} />
                </TableCell>
              </tr>
            ))}
          </TableBody>
        </Table>
      </TableFrame>
      {unpicked > 0 ? (
        <p className="text-small text-ink-muted">
          Roaster&rsquo;s Rotation days with no lot picked yet need {formatGrams(unpicked)} of green more over these weeks; pick their lots on{' '}
          <Link to={paths.roastery.rotation.getHref()} className="font-semibold text-leaf underline">
            Rotation
          </Link>
          .
        </p>
      ) : null}
    </section>
  );
}
