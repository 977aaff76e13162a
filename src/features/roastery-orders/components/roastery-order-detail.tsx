import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { bagSizeDeclarations } from '@shared/domain/units';
import { grindLabels, roastLevelLabels, roastersRotationName } from '@shared/domain/vocabulary';
import { formatMoney } from '@shared/domain/money';
import type { OrderDetail, OrderItem } from '@shared/schemas/orders';
import { AddressDisplay } from '@/components/address/address-display';
import { paths } from '@/config/paths';
import { formatGrams } from '@/lib/format';
import { formatDay, formatInstant } from '@/lib/dates';
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
  switch (paymentState(order)) {
    case 'unpaid':
      return <>Not paid yet: the customer has not finished the payment page.</>;
    case 'cancelled-unpaid':
      return <>Never paid; cancelled {order.cancelledAt ? formatInstant(order.cancelledAt) : ''}. Nothing was charged.</>;
    case 'refunded':
      return <>Refunded in full ({formatMoney(order.refundedCents, order.currency)}).</>;
    case 'partly-refunded':
      return (
        <>
          Paid {formatMoney(order.totalCents, order.currency)}, {formatMoney(order.refundedCents, order.currency)} refunded.
        </>
      );
    case 'paid':
      return <>Paid {order.paidAt ? formatInstant(order.paidAt) : ''}.</>;
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
  const address = order.shippingAddress;
  return (
    <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
      <div className="grid content-start gap-6">
        <div className="flex flex-wrap items-center gap-3">
          <StaffOrderStatus status={order.status} />
          <span className="text-small text-ink-muted">
            {orderKindLabels[order.kind]} · placed {formatInstant(order.placedAt)}
          </span>
        </div>

        {/* Focusable so a keyboard can scroll the table sideways on a narrow screen. */}
        <div role="region" aria-labelledby="order-bags-caption" tabIndex={0} className="overflow-x-auto rounded-card border border-rule bg-sheet">
          <table className="w-full min-w-[36rem] border-collapse text-left text-small">
            <caption id="order-bags-caption" className="px-4 pt-3 text-left font-heading text-h3 font-semibold">
              Bags
            </caption>
            <thead>
              <tr className="border-b border-rule">
                <th scope="col" className="px-4 py-2 font-semibold">
                  Coffee
                </th>
                <th scope="col" className="px-4 py-2 text-right font-semibold">
                  Quantity
                </th>
                <th scope="col" className="px-4 py-2 text-right font-semibold">
                  Each
                </th>
                <th scope="col" className="px-4 py-2 text-right font-semibold">
                  Line total
                </th>
              </tr>
            </thead>
            <tbody>
              {order.items.map((item) => (
                <tr key={item.id} className="border-t border-rule">
                  <th scope="row" className="px-4 py-3 text-left font-normal">
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
                  </th>
                  <td className="px-4 py-3 text-right tabular-nums">{item.quantity}</td>
                  <td className="px-4 py-3 text-right tabular-nums">{formatMoney(item.unitPriceCents, order.currency)}</td>
                  <td className="px-4 py-3 text-right tabular-nums">{formatMoney(item.lineTotalCents, order.currency)}</td>
                </tr>
              ))}
            </tbody>
            <tfoot className="border-t border-rule-strong">
              <tr>
                <th scope="row" colSpan={3} className="px-4 pt-3 text-right font-normal">
                  Bags
                </th>
                <td className="px-4 pt-3 text-right tabular-nums">{formatMoney(order.subtotalCents, order.currency)}</td>
              </tr>
              {order.discountCents > 0 ? (
                <tr>
                  <th scope="row" colSpan={3} className="px-4 pt-1 text-right font-normal">
                    {order.discountLabel ?? 'Discount'}
                  </th>
                  <td className="px-4 pt-1 text-right tabular-nums">−{formatMoney(order.discountCents, order.currency)}</td>
                </tr>
              ) : null}
              <tr>
                <th scope="row" colSpan={3} className="px-4 pt-1 text-right font-normal">
                  Shipping
                </th>
                <td className="px-4 pt-1 text-right tabular-nums">{formatMoney(order.shippingCents, order.currency)}</td>
              </tr>
              <tr>
                <th scope="row" colSpan={3} className="px-4 py-2 text-right font-semibold">
                  Total ({order.currency.toUpperCase()})
                </th>
                <td className="px-4 py-2 text-right font-semibold tabular-nums">{formatMoney(order.totalCents, order.currency)}</td>
              </tr>
              {order.refundedCents > 0 ? (
                <tr>
                  <th scope="row" colSpan={3} className="px-4 pb-3 text-right font-normal">
                    Refunded
                  </th>
                  <td className="px-4 pb-3 text-right tabular-nums">−{formatMoney(order.refundedCents, order.currency)}</td>
                </tr>
              ) : null}
            </tfoot>
          </table>
        </div>

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
                ...(order.shippedAt ? [{ term: 'Shipped', value: formatInstant(order.shippedAt) }] : []),
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
