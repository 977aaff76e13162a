import { ArrowRight } from 'lucide-react';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { TodayResponse } from '@shared/schemas/today';
import { Badge } from '@/components/ui/badge';
import { buttonStyles } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { formatDayLongNoYear, formatDayShort } from '@/lib/dates';
import { formatGrams } from '@/lib/format';

const count = (n: number, one: string, many: string) => `${n.toLocaleString('en-US')} ${n === 1 ? one : many}`;

function Card({ id, title, children, action }: { id: string; title: string; children: ReactNode; action?: ReactNode }) {
  return (
    <section aria-labelledby={id} className="grid content-start gap-3 rounded-card border border-rule bg-sheet p-5">
      <h2 id={id} className="text-h3">
        {title}
      </h2>
      {children}
      {action ? <div className="mt-auto pt-1">{action}</div> : null}
    </section>
  );
}

function ActionLink({ to, children }: { to: string; children: ReactNode }) {
  return (
    <Link to={to} className="inline-flex items-center gap-1 font-semibold text-leaf underline">
      {children}
      <ArrowRight aria-hidden="true" className="size-4" />
    </Link>
  );
}

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div>
      <dt className="text-small text-ink-muted">{label}</dt>
      <dd className="text-h3 font-semibold">{value}</dd>
    </div>
  );
}

function NextRoastDay({ day }: { day: NonNullable<TodayResponse['nextRoastDay']> }) {
  const title = day.isToday ? 'Roasting today' : `Next roast day: ${formatDayLongNoYear(day.date)}`;
  return (
    <Card
      id="today-roast"
      title={title}
      action={
        <Link to={paths.roastery.daySheet.getHref(day.date)} className={buttonStyles('primary')}>
          Open the Roast List
          <ArrowRight aria-hidden="true" className="size-4" />
        </Link>
      }
    >
      {day.bags === 0 ? (
        <p className="text-ink-muted">Nothing is booked to roast yet.</p>
      ) : (
        <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
          <Figure label="Bags" value={day.bags.toLocaleString('en-US')} />
          <Figure label="Roasted still to roast" value={formatGrams(day.roastedGrams)} />
          <Figure label="Green to pull" value={formatGrams(day.greenGrams)} />
          <Figure label="Batches" value={day.batches.toLocaleString('en-US')} />
        </dl>
      )}
      {day.shortfalls.length > 0 ? (
        <ul className="grid gap-1">
          {day.shortfalls.map((shortfall) => (
            <li key={shortfall.lotCode}>
              <Badge tone="alert">Short</Badge>{' '}
              <Link to={paths.roastery.lot.getHref(shortfall.lotCode)} className="font-semibold text-leaf underline">
                {shortfall.lotCode}
              </Link>
              : needs {formatGrams(shortfall.greenGrams)}, {formatGrams(shortfall.stockGrams)} in stock, {formatGrams(shortfall.shortfallGrams)} short
            </li>
          ))}
        </ul>
      ) : null}
      {day.warnings > day.shortfalls.length ? (
        <p className="text-small text-ink-muted">{count(day.warnings, 'warning', 'warnings')} on the Roast List.</p>
      ) : null}
    </Card>
  );
}

/** Today in the Roastery: each part names what needs doing and links to the place that does it. */
export function TodayOverview({ today }: { today: TodayResponse }) {
  const { nextRoastDay, parcels, stuck, failedMessages, reorder } = today;
  const ordersWith = (status: string) => paths.roastery.orders.getHref(new URLSearchParams({ status }));
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      {nextRoastDay ? (
        <NextRoastDay day={nextRoastDay} />
      ) : (
        <Card id="today-roast" title="No roast day ahead" action={<ActionLink to={paths.roastery.calendar.getHref()}>Open the Roast Calendar</ActionLink>}>
          <p>No roast day is open in the next four months.</p>
        </Card>
      )}

      <Card
        id="today-parcels"
        title="Pack and ship today"
        action={<ActionLink to={paths.roastery.daySheet.getHref(today.today, 'pack')}>Open the Pack List</ActionLink>}
      >
        <dl className="grid grid-cols-2 gap-3">
          <Figure label="To pack" value={parcels.toPack.toLocaleString('en-US')} />
          <Figure label="Packed, to ship" value={parcels.toShip.toLocaleString('en-US')} />
        </dl>
      </Card>

      <Card id="today-stuck" title="Orders stuck">
        {stuck.held === 0 && stuck.awaitingPayment === 0 ? (
          <p className="text-ink-muted">None on hold or waiting long for payment.</p>
        ) : (
          <ul className="grid gap-2">
            {stuck.held > 0 ? (
              <li>
                <ActionLink to={ordersWith('held')}>{count(stuck.held, 'order on hold', 'orders on hold')} (renewal not paid)</ActionLink>
              </li>
            ) : null}
            {stuck.awaitingPayment > 0 ? (
              <li>
                <ActionLink to={ordersWith('pending_payment')}>
                  {count(stuck.awaitingPayment, 'order', 'orders')} awaiting payment for over {stuck.awaitingPaymentHours} hours
                </ActionLink>
              </li>
            ) : null}
          </ul>
        )}
      </Card>

      <Card id="today-mail" title="E-mail that failed">
        {failedMessages.count === 0 ? (
          <p className="text-ink-muted">Every message went out or is on its way.</p>
        ) : (
          <>
            <p>{count(failedMessages.count, 'message', 'messages')} could not be sent after every retry.</p>
            <ul className="grid gap-1 text-small">
              {failedMessages.items.map((message) => (
                <li key={message.id}>
                  <span className="font-semibold">{message.template}</span> to {message.to}, {formatDayShort(message.createdAt.slice(0, 10))}
                  {message.orderId ? (
                    <>
                      {' · '}
                      <Link to={paths.roastery.order.getHref(message.orderId)} className="font-semibold text-leaf underline">
                        Open the order
                      </Link>
                    </>
                  ) : null}
                </li>
              ))}
            </ul>
          </>
        )}
      </Card>

      <Card id="today-reorder" title="Green coffee to reorder" action={<ActionLink to={paths.roastery.greenStock.getHref()}>Open Green Stock</ActionLink>}>
        {reorder.length === 0 ? (
          <p className="text-ink-muted">No lot is at its reorder point or due for reordering.</p>
        ) : (
          <ul className="grid gap-1">
            {reorder.map((lot) => (
              <li key={lot.lotCode}>
                <Link to={paths.roastery.lot.getHref(lot.lotCode)} className="font-semibold text-leaf underline">
                  {lot.name}
                </Link>{' '}
                {formatGrams(lot.stockGrams)} on hand
                {lot.reorderBy ? `; reorder by ${formatDayShort(lot.reorderBy)}` : ''}
                {lot.runOutDate ? `, runs out ${formatDayShort(lot.runOutDate)}` : ''}
              </li>
            ))}
          </ul>
        )}
      </Card>
    </div>
  );
}
