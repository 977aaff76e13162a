import type { ReactNode } from 'react';
import { roastLevelLabels } from '@shared/domain/vocabulary';
import type { LedgerResponse, LedgerTable } from '@shared/schemas/ledger';
import { LazyWeeklyChart } from '@/components/charts/lazy-weekly-chart';
import { Badge } from '@/components/ui/badge';
import { DownloadLink } from '@/components/ui/download-link';
import { Table, TableBody, TableCell, TableFrame, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';
import { formatDayShort } from '@/lib/dates';
import { formatGrams, formatPercent } from '@/lib/format';
import { useShopMoney } from '@/lib/shop-currency';
import { ledgerCsvHref } from '../api/get-ledger';

function LedgerSection({ id, title, table, weeks, children }: { id: string; title: string; table: LedgerTable; weeks: number; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="grid gap-4">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <h2 id={id} className="text-h2">
          {title}
        </h2>
        <DownloadLink href={ledgerCsvHref(table, weeks)}>{title} CSV</DownloadLink>
      </div>
      {children}
    </section>
  );
}

const kilos = (grams: number) => formatGrams(grams);

/** The Ledger's four tables, each with its chart (loaded lazily) and its CSV. */
export function LedgerView({ ledger }: { ledger: LedgerResponse }) {
  const { money } = useShopMoney();
  const { weeks } = ledger;
  return (
    <div className="grid gap-10">
      <LedgerSection id="ledger-sales" title="Sales" table="sales" weeks={weeks}>
        <LazyWeeklyChart
          caption="Paid each week, by kind"
          kind="bar"
          stacked
          data={ledger.sales}
          xKey="weekStart"
          series={[
            { key: 'greenCents', label: 'Green coffee', color: 'var(--color-leaf)' },
            { key: 'roastedCents', label: 'Roasted, one-off', color: 'var(--color-ember)' },
            { key: 'subscriptionCents', label: 'Subscriptions', color: 'var(--color-focus)' },
          ]}
          formatValue={money}
          formatX={formatDayShort}
        />
        <TableFrame>
          <Table>
            <caption className="sr-only">Sales by week</caption>
            <TableHead>
              <tr>
                <TableHeader>Week of</TableHeader>
                <TableHeader align="right">Green coffee</TableHeader>
                <TableHeader align="right">Roasted, one-off</TableHeader>
                <TableHeader align="right">Subscriptions</TableHeader>
                <TableHeader align="right">Total</TableHeader>
                <TableHeader align="right">Refunds</TableHeader>
                <TableHeader align="right">Orders</TableHeader>
              </tr>
            </TableHead>
            <TableBody>
              {ledger.sales.map((week) => (
                <tr key={week.weekStart}>
                  <TableRowHeader>{formatDayShort(week.weekStart)}</TableRowHeader>
                  <TableCell align="right">{money(week.greenCents)}</TableCell>
                  <TableCell align="right">{money(week.roastedCents)}</TableCell>
                  <TableCell align="right">{money(week.subscriptionCents)}</TableCell>
                  <TableCell align="right" className="font-semibold">
                    {money(week.totalCents)}
                  </TableCell>
                  <TableCell align="right">{week.refundsCents > 0 ? `−${money(week.refundsCents)}` : money(0)}</TableCell>
                  <TableCell align="right">{week.orders}</TableCell>
                </tr>
              ))}
            </TableBody>
          </Table>
        </TableFrame>
      </LedgerSection>

      <LedgerSection id="ledger-subscriptions" title="Subscriptions" table="subscriptions" weeks={weeks}>
        <LazyWeeklyChart
          caption="Recurring revenue per month, at each week's end"
          kind="line"
          data={ledger.subscriptions}
          xKey="weekStart"
          series={[{ key: 'monthlyRecurringCents', label: 'Recurring revenue per month', color: 'var(--color-leaf)' }]}
          formatValue={money}
          formatX={formatDayShort}
        />
        <TableFrame>
          <Table>
            <caption className="sr-only">Subscriptions by week</caption>
            <TableHead>
              <tr>
                <TableHeader>Week of</TableHeader>
                <TableHeader align="right">Active</TableHeader>
                <TableHeader align="right">Started</TableHeader>
                <TableHeader align="right">Paused</TableHeader>
                <TableHeader align="right">Cancelled</TableHeader>
                <TableHeader align="right">Recurring revenue per month</TableHeader>
              </tr>
            </TableHead>
            <TableBody>
              {ledger.subscriptions.map((week) => (
                <tr key={week.weekStart}>
                  <TableRowHeader>{formatDayShort(week.weekStart)}</TableRowHeader>
                  <TableCell align="right">{week.active}</TableCell>
                  <TableCell align="right">{week.started}</TableCell>
                  <TableCell align="right">{week.paused}</TableCell>
                  <TableCell align="right">{week.cancelled}</TableCell>
                  <TableCell align="right">{money(week.monthlyRecurringCents)}</TableCell>
                </tr>
              ))}
            </TableBody>
          </Table>
        </TableFrame>
      </LedgerSection>

      <LedgerSection id="ledger-green" title="Green coffee" table="green" weeks={weeks}>
        <LazyWeeklyChart
          caption="Green roasted and sold each week"
          kind="bar"
          data={ledger.green}
          xKey="weekStart"
          series={[
            { key: 'roastedGreenGrams', label: 'Roasted', color: 'var(--color-ember)' },
            { key: 'soldGreenGrams', label: 'Sold green', color: 'var(--color-leaf)' },
          ]}
          formatValue={kilos}
          formatX={formatDayShort}
        />
        <TableFrame>
          <Table>
            <caption className="sr-only">Green coffee by week</caption>
            <TableHead>
              <tr>
                <TableHeader>Week of</TableHeader>
                <TableHeader align="right">Roasted (green in)</TableHeader>
                <TableHeader align="right">Sold green</TableHeader>
              </tr>
            </TableHead>
            <TableBody>
              {ledger.green.map((week) => (
                <tr key={week.weekStart}>
                  <TableRowHeader>{formatDayShort(week.weekStart)}</TableRowHeader>
                  <TableCell align="right">{kilos(week.roastedGreenGrams)}</TableCell>
                  <TableCell align="right">{kilos(week.soldGreenGrams)}</TableCell>
                </tr>
              ))}
            </TableBody>
          </Table>
        </TableFrame>
      </LedgerSection>

      <LedgerSection id="ledger-loss" title="Roast loss by lot" table="loss" weeks={weeks}>
        {ledger.loss.length === 0 ? (
          <p className="text-ink-muted">No batches were recorded in these weeks.</p>
        ) : (
          <TableFrame>
            <Table>
              <caption className="sr-only">Roast loss by lot and level against the loss model</caption>
              <TableHead>
                <tr>
                  <TableHeader>Lot</TableHeader>
                  <TableHeader>Level</TableHeader>
                  <TableHeader align="right">Batches</TableHeader>
                  <TableHeader align="right">Green in</TableHeader>
                  <TableHeader align="right">Roasted out</TableHeader>
                  <TableHeader align="right">Loss</TableHeader>
                  <TableHeader>Loss model</TableHeader>
                </tr>
              </TableHead>
              <TableBody>
                {ledger.loss.map((row) => (
                  <tr key={`${row.lotCode} ${row.roastLevel}`}>
                    <TableRowHeader>
                      {row.name}
                      <span className="block text-caption text-ink-muted">{row.lotCode}</span>
                    </TableRowHeader>
                    <TableCell>{roastLevelLabels[row.roastLevel]}</TableCell>
                    <TableCell align="right">{row.batches}</TableCell>
                    <TableCell align="right">{kilos(row.greenGramsIn)}</TableCell>
                    <TableCell align="right">{kilos(row.roastedGramsOut)}</TableCell>
                    <TableCell align="right">{formatPercent(row.lossPct)}</TableCell>
                    <TableCell>
                      {formatPercent(row.expected.minPct)}–{formatPercent(row.expected.maxPct)}{' '}
                      {row.position === 'within' ? <Badge tone="ok">Within</Badge> : <Badge tone="alert">{row.position === 'above' ? 'Above' : 'Below'}</Badge>}
                    </TableCell>
                  </tr>
                ))}
              </TableBody>
            </Table>
          </TableFrame>
        )}
      </LedgerSection>
    </div>
  );
}
