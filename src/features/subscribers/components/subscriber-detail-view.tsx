import { grindLabels, roastLevelLabels } from '@shared/domain/vocabulary';
import { formatMoney } from '@shared/domain/money';
import type { SubscriberDetail } from '@shared/schemas/subscribers';
import { AddressDisplay } from '@/components/address/address-display';
import { Badge } from '@/components/ui/badge';
import { bagsLabel, brewMethodLabels, cadenceLabel, deliveryStatusLabels, subscriptionStatusLabels } from '@/lib/subscription-labels';
import { formatDayWithWeekday } from '@/lib/dates';
import { useShopClock } from '@/lib/shop-clock';
import { Table, TableBody, TableCell, TableFrame, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';

/** A subscriber's subscription, where it ships, and every delivery with the order it became. */
export function SubscriberDetailView({ subscriber }: { subscriber: SubscriberDetail }) {
  const clock = useShopClock();
  const status = subscriptionStatusLabels[subscriber.status];
  const facts: [string, string][] = [
    ['Coffee', subscriber.lotCode ? `${subscriber.coffee} (${subscriber.lotCode})` : subscriber.coffee],
    ['Roast level', roastLevelLabels[subscriber.roastLevel]],
    ['Each delivery', bagsLabel(subscriber.bagsPerDelivery, subscriber.bagSize)],
    ['Grind', grindLabels[subscriber.grind]],
    ['Brew method', brewMethodLabels[subscriber.brewMethod]],
    ['Cadence', cadenceLabel(subscriber.cadenceWeeks)],
    ['Per delivery', formatMoney(subscriber.priceCents, subscriber.currency)],
    ['Subscribed', clock.date(subscriber.createdAt)],
    ...(subscriber.pausedUntil ? [['Paused until', formatDayWithWeekday(subscriber.pausedUntil)] as [string, string]] : []),
    ...(subscriber.cancelledAt ? [['Cancelled', clock.date(subscriber.cancelledAt)] as [string, string]] : []),
  ];
  return (
    <div className="grid gap-8">
      <div className="grid gap-6 md:grid-cols-[2fr_1fr]">
        <section aria-labelledby="subscriber-subscription" className="rounded-card border border-rule bg-sheet p-5">
          <div className="flex flex-wrap items-center gap-3">
            <h2 id="subscriber-subscription" className="text-h3">
              Subscription
            </h2>
            <Badge tone={status.tone}>{status.label}</Badge>
          </div>
          <dl className="mt-3 grid grid-cols-[max-content_1fr] gap-x-6 gap-y-1 text-small">
            {facts.map(([term, value]) => (
              <div key={term} className="contents">
                <dt className="font-semibold text-ink-muted">{term}</dt>
                <dd>{value}</dd>
              </div>
            ))}
          </dl>
        </section>
        <section aria-labelledby="subscriber-address" className="rounded-card border border-rule bg-sheet p-5">
          <h2 id="subscriber-address" className="text-h3">
            Ships to
          </h2>
          <AddressDisplay address={subscriber.shippingAddress} className="mt-3 text-small" />
          <p className="mt-3 text-small break-all">
            <a href={`mailto:${subscriber.customer.email}`} className="text-leaf underline">
              {subscriber.customer.email}
            </a>
          </p>
        </section>
      </div>

      <section aria-labelledby="subscriber-deliveries">
        <h2 id="subscriber-deliveries" className="mb-3 text-h2">
          Deliveries
        </h2>
        {subscriber.deliveries.length === 0 ? (
          <p className="text-ink-muted">No deliveries yet.</p>
        ) : (
          <TableFrame>
            <Table className="min-w-[48rem]">
              <caption className="sr-only">Deliveries of this subscription</caption>
              <TableHead>
                <tr>
                  {['#', 'Roasts', 'Ships', 'Ready from', 'Best before', 'Coffee', 'Status', 'Order'].map((column) => (
                    <TableHeader key={column} className="whitespace-nowrap">
                      {column}
                    </TableHeader>
                  ))}
                </tr>
              </TableHead>
              <TableBody>
                {subscriber.deliveries.map((delivery) => {
                  const deliveryStatus = deliveryStatusLabels[delivery.status];
                  return (
                    <tr key={delivery.id}>
                      <TableCell>{delivery.sequence}</TableCell>
                      <TableRowHeader className="font-semibold whitespace-nowrap">{formatDayWithWeekday(delivery.roastDate)}</TableRowHeader>
                      <TableCell className="whitespace-nowrap">{formatDayWithWeekday(delivery.shipDate)}</TableCell>
                      <TableCell className="whitespace-nowrap">{formatDayWithWeekday(delivery.readyFrom)}</TableCell>
                      <TableCell className="whitespace-nowrap">{formatDayWithWeekday(delivery.bestBefore)}</TableCell>
                      <TableCell>{delivery.coffee ?? 'Not picked yet'}</TableCell>
                      <TableCell>
                        <Badge tone={deliveryStatus.tone}>{deliveryStatus.label}</Badge>
                      </TableCell>
                      <TableCell>
                        {delivery.order ? (
                          <>
                            {formatMoney(delivery.order.totalCents, subscriber.currency)}
                            {delivery.order.trackingNumber ? (
                              <span className="block text-caption text-ink-muted">
                                {delivery.order.carrier} {delivery.order.trackingNumber}
                              </span>
                            ) : null}
                          </>
                        ) : (
                          '—'
                        )}
                      </TableCell>
                    </tr>
                  );
                })}
              </TableBody>
            </Table>
          </TableFrame>
        )}
      </section>
    </div>
  );
}
