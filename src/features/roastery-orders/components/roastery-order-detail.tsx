import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { bagSizeDeclarations } from '@shared/domain/units';
import { grindLabels, roastLevelLabels, roastersRotationName } from '@shared/domain/vocabulary';
import { formatMoney } from '@shared/domain/money';
import type { OrderDetail, OrderItem } from '@shared/schemas/orders';
import { AddressDisplay } from '@/components/address/address-display';
import { paths } from '@/config/paths';
import { formatGrams } from '@/lib/format';
import { formatDay } from '@/lib/dates';
import { useShopClock } from '@/lib/shop-clock';
import { Table, TableBody, TableCell, TableFrame, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';
import { orderKindLabels, paymentState } from '../utils/order-labels';
import { StaffOrderStatus } from './staff-order-status';

function Panel({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="rounded-card border border-rule bg-sheet p-4 sm:p-5">
      <h2 id={id} className="text-h3">
        {title}
      </h2>
      <div className="mt-2">{children}</div>
    </section>
  );
}

function Facts({ facts }: { facts: { term: string; value: ReactNode }[] }) {
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
      {facts.map((fact) => (
        <div key={fact.term} className="contents">
          <dt className="text-ink-muted">{fact.term}</dt>
          <dd>{fact.value}</dd>
        </div>
      ))}
    </dl>
  );
}

function PaymentLine({ order }: { order: OrderDetail }) {
  const clock = useShopClock();
  switch (paymentState(order)) {
    case 'unpaid':
      return <>Not paid yet: the customer has not finished the payment page.</>;
    case 'cancelled-unpaid':
      return <>Never paid; cancelled {order.cancelledAt ? clock.dateTime(order.cancelledAt) : ''}. Nothing was charged.</>;
    case 'refunded':
      return <>Refunded in full ({formatMoney(order.refundedCents, order.currency)}).</>;
    case 'partly-refunded':
      return (
        <>
          Paid {formatMoney(order.totalCents, order.currency)}, {formatMoney(order.refundedCents, order.currency)} refunded.
        </>
      );
    case 'paid':
      return <>Paid {order.paidAt ? clock.dateTime(order.paidAt) : ''}.</>;
  }
}

function lineDetails(item: OrderItem): string {
  const { amount, unit } = bagSizeDeclarations[item.size];
  const parts = [`${amount} ${unit} bag, filled to ${formatGrams(item.fillGrams)}`];
  if (item.roastLevel) parts.push(roastLevelLabels[item.roastLevel]);
  if (item.grind) parts.push(grindLabels[item.grind]);
  if (item.brewMethod) parts.push(`for ${item.brewMethod}`);
  return parts.join(' · ');
}

const dayOrUnset = (day: string | null) => (day ? formatDay(day) : <span className="text-ink-muted">Not set</span>);

/**
 * One order as the team needs it: who, where to, what, money, dates and shipping. `actions` is the
 * order's own work (shipping it, tracing its bags), shown in its own section.
 */
export function RoasteryOrderDetail({ order, actions }: { order: OrderDetail; actions: ReactNode }) {
  const clock = useShopClock();
  const address = order.shippingAddress;
  return (
    <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
      <div className="grid content-start gap-6">
        <div className="flex flex-wrap items-center gap-3">
          <StaffOrderStatus status={order.status} />
          <span className="text-small text-ink-muted">
            {orderKindLabels[order.kind]} · placed {clock.dateTime(order.placedAt)}
          </span>
        </div>

        {/* Focusable so a keyboard can scroll the table sideways on a narrow screen. */}
        <TableFrame role="region" aria-labelledby="order-bags-caption" tabIndex={0}>
          <Table className="min-w-[36rem]">
            <caption id="order-bags-caption" className="px-3 pt-3 text-left font-heading text-h3 font-semibold">
              Bags
            </caption>
            <TableHead>
              <tr className="border-b border-rule">
                <TableHeader>Coffee</TableHeader>
                <TableHeader align="right">Quantity</TableHeader>
                <TableHeader align="right">Each</TableHeader>
                <TableHeader align="right">Line total</TableHeader>
              </tr>
            </TableHead>
            <TableBody>
              {order.items.map((item) => (
                <tr key={item.id}>
                  <TableRowHeader>
                    <span className="font-semibold">{item.lotName ?? roastersRotationName}</span>
                    {item.lotCode ? (
                      <>
                        {' · '}
                        <Link to={paths.roastery.lot.getHref(item.lotCode)} className="text-leaf underline">
                          {item.lotCode}
                        </Link>
                      </>
                    ) : null}
                    <span className="block text-caption text-ink-muted">{lineDetails(item)}</span>
                  </TableRowHeader>
                  <TableCell align="right">{item.quantity}</TableCell>
                  <TableCell align="right">{formatMoney(item.unitPriceCents, order.currency)}</TableCell>
                  <TableCell align="right">{formatMoney(item.lineTotalCents, order.currency)}</TableCell>
                </tr>
              ))}
            </TableBody>
            <tfoot className="border-t border-rule-strong">
              <tr>
                <TableRowHeader colSpan={3} align="right" className="pt-3">
                  Bags
                </TableRowHeader>
                <TableCell align="right" className="pt-3">
                  {formatMoney(order.subtotalCents, order.currency)}
                </TableCell>
              </tr>
              {order.discountCents > 0 ? (
                <tr>
                  <TableRowHeader colSpan={3} align="right" className="pt-1">
                    {order.discountLabel ?? 'Discount'}
                  </TableRowHeader>
                  <TableCell align="right" className="pt-1">
                    −{formatMoney(order.discountCents, order.currency)}
                  </TableCell>
                </tr>
              ) : null}
              <tr>
                <TableRowHeader colSpan={3} align="right" className="pt-1">
                  Shipping
                </TableRowHeader>
                <TableCell align="right" className="pt-1">
                  {formatMoney(order.shippingCents, order.currency)}
                </TableCell>
              </tr>
              <tr>
                <TableRowHeader colSpan={3} align="right" className="font-semibold">
                  Total ({order.currency.toUpperCase()})
                </TableRowHeader>
                <TableCell align="right" className="font-semibold">
                  {formatMoney(order.totalCents, order.currency)}
                </TableCell>
              </tr>
              {order.refundedCents > 0 ? (
                <tr>
                  <TableRowHeader colSpan={3} align="right" className="pb-3">
                    Refunded
                  </TableRowHeader>
                  <TableCell align="right" className="pb-3">
                    −{formatMoney(order.refundedCents, order.currency)}
                  </TableCell>
                </tr>
              ) : null}
            </tfoot>
          </Table>
        </TableFrame>

        <section aria-labelledby="order-actions" className="rounded-card border border-rule-strong bg-leaf-wash p-4 sm:p-5">
          <h2 id="order-actions" className="text-h3">
            Shipping and tracing
          </h2>
          <div className="mt-2">{actions}</div>
        </section>
      </div>

      <div className="grid content-start gap-6">
        <Panel id="order-customer" title="Customer">
          <p className="font-semibold">{order.customer.name}</p>
          <p className="break-all">
            <a href={`mailto:${order.customer.email}`} className="text-leaf underline">
              {order.customer.email}
            </a>
          </p>
        </Panel>
        <Panel id="order-ship-to" title="Ships to">
          <AddressDisplay address={address} />
        </Panel>
        <Panel id="order-payment" title="Payment">
          <p>
            <PaymentLine order={order} />
          </p>
        </Panel>
        <Panel id="order-dates" title="Dates">
          <Facts
            facts={[
              { term: 'Roast date', value: dayOrUnset(order.roastDate) },
              { term: 'Ship date', value: dayOrUnset(order.shipDate) },
              { term: 'Ready-from date', value: dayOrUnset(order.readyFrom) },
              { term: 'Best-before date', value: dayOrUnset(order.bestBefore) },
            ]}
          />
        </Panel>
        {order.carrier || order.trackingNumber || order.shippedAt ? (
          <Panel id="order-tracking" title="Carrier and tracking">
            <Facts
              facts={[
                ...(order.shippedAt ? [{ term: 'Shipped', value: clock.dateTime(order.shippedAt) }] : []),
                ...(order.carrier ? [{ term: 'Carrier', value: order.carrier }] : []),
                ...(order.trackingNumber ? [{ term: 'Tracking number', value: <span className="break-all">{order.trackingNumber}</span> }] : []),
              ]}
            />
          </Panel>
        ) : null}
      </div>
    </div>
  );
}
