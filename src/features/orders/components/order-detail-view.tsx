import { bagSizeDeclarations } from '@shared/domain/units';
import { grindLabels, roastLevelLabels, roastersRotationName } from '@shared/domain/vocabulary';
import { formatMoney } from '@shared/domain/money';
import type { OrderDetail, OrderItem } from '@shared/schemas/orders';
import { Link } from 'react-router-dom';
import { AddressDisplay } from '@/components/address/address-display';
import { paths } from '@/config/paths';
import { formatGrams } from '@/lib/format';
import { formatDay, formatInstant } from '@/lib/dates';
import { OrderStatusBadge } from './order-status-badge';

function itemDescription(item: OrderItem): string {
  const { amount, unit } = bagSizeDeclarations[item.size];
  const parts = [`${amount} ${unit} (${formatGrams(item.fillGrams)})`];
  if (item.roastLevel) parts.push(roastLevelLabels[item.roastLevel]);
  if (item.grind) parts.push(grindLabels[item.grind]);
  if (item.lotCode) parts.push(`lot ${item.lotCode}`);
  return parts.join(' · ');
}

/** One order as its customer sees it: status, bags, totals, dates and where it ships. */
export function OrderDetailView({ order }: { order: OrderDetail }) {
  const address = order.shippingAddress;
  const dates = [
    { term: 'Roast date', value: order.roastDate },
    { term: 'Ship date', value: order.shipDate },
    { term: 'Expected to arrive', value: order.expectedArrival },
    { term: 'Ready to brew from', value: order.readyFrom },
    { term: 'Best before', value: order.bestBefore },
  ].filter((each): each is { term: string; value: string } => each.value !== null);
  // Green coffee the customer has paid for is theirs to roast and log.
  const roastable = !['pending_payment', 'cancelled', 'refunded'].includes(order.status);

  return (
    <div className="grid gap-8 lg:grid-cols-[2fr_1fr]">
      <div>
        <p className="flex flex-wrap items-center gap-3">
          <OrderStatusBadge status={order.status} />
          <span className="text-small text-ink-muted">Placed {formatInstant(order.placedAt)}</span>
        </p>
        <ul aria-label="Bags in this order" className="mt-4 divide-y divide-rule rounded-card border border-rule bg-sheet">
          {order.items.map((item) => (
            <li key={item.id} className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 p-4">
              <div>
                <p className="font-semibold">{item.lotName ?? roastersRotationName}</p>
                <p className="text-small text-ink-muted">{itemDescription(item)}</p>
                {item.roastLevel === null && item.lotCode && roastable ? (
                  <Link
                    to={paths.account.journal.getHref({ lot: item.lotCode, log: true })}
                    className="mt-1 inline-block text-small font-semibold text-leaf underline"
                  >
                    Log a roast of this lot
                  </Link>
                ) : null}
              </div>
              <p className="text-small">
                {item.quantity} × {formatMoney(item.unitPriceCents, order.currency)} ={' '}
                <span className="font-semibold">{formatMoney(item.lineTotalCents, order.currency)}</span>
              </p>
            </li>
          ))}
        </ul>
        <dl className="mt-4 ml-auto grid max-w-xs grid-cols-[1fr_auto] gap-x-6 gap-y-1">
          <dt>Bags</dt>
          <dd className="text-right">{formatMoney(order.subtotalCents, order.currency)}</dd>
          {order.discountCents > 0 ? (
            <>
              <dt>{order.discountLabel ?? 'Discount'}</dt>
              <dd className="text-right">−{formatMoney(order.discountCents, order.currency)}</dd>
            </>
          ) : null}
          <dt>Shipping</dt>
          <dd className="text-right">{formatMoney(order.shippingCents, order.currency)}</dd>
          <dt className="border-t border-rule pt-1 font-semibold">Total</dt>
          <dd className="border-t border-rule pt-1 text-right font-semibold">{formatMoney(order.totalCents, order.currency)}</dd>
          {order.refundedCents > 0 ? (
            <>
              <dt>Refunded</dt>
              <dd className="text-right">{formatMoney(order.refundedCents, order.currency)}</dd>
            </>
          ) : null}
        </dl>
      </div>

      <div className="grid content-start gap-6">
        <section aria-labelledby="order-ships-to" className="rounded-card border border-rule bg-sheet p-4">
          <h2 id="order-ships-to" className="text-h3">
            Ships to
          </h2>
          <AddressDisplay address={address} className="mt-2" />
        </section>
        {dates.length > 0 || order.trackingNumber ? (
          <section aria-labelledby="order-dates" className="rounded-card border border-rule bg-sheet p-4">
            <h2 id="order-dates" className="text-h3">
              Dates and tracking
            </h2>
            <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
              {dates.map((each) => (
                <div key={each.term} className="contents">
                  <dt className="text-ink-muted">{each.term}</dt>
                  <dd>{formatDay(each.value)}</dd>
                </div>
              ))}
              {order.trackingNumber ? (
                <div className="contents">
                  <dt className="text-ink-muted">Tracking</dt>
                  <dd className="break-all">
                    {order.carrier ? `${order.carrier} ` : ''}
                    {order.trackingNumber}
                  </dd>
                </div>
              ) : null}
            </dl>
            {order.readyOnArrival !== null ? (
              <p className="mt-2 text-small">
                {order.readyOnArrival
                  ? 'Ready to brew on arrival: it will have rested by the time it lands.'
                  : 'It can arrive before it is ready: brew it from its ready-from date.'}
              </p>
            ) : null}
          </section>
        ) : null}
      </div>
    </div>
  );
}
