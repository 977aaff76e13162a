import { Lock } from 'lucide-react';
import { grindLabels, roastLevelLabels } from '@shared/domain/vocabulary';
import type { SubscriptionDelivery } from '@shared/schemas/subscriptions';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { bagsLabel, deliveryStatusLabels } from '@/lib/subscription-labels';
import { formatDayWithWeekday, formatInstantWithWeekday } from '@/lib/dates';

/** Skip and undo, per delivery whose cutoff is ahead; without them the schedule only reads. */
export type DeliveryActions = {
  onSkip: (delivery: SubscriptionDelivery) => void;
  onUnskip: (delivery: SubscriptionDelivery) => void;
  busy: boolean;
};

type DeliveryScheduleProps = {
  deliveries: readonly SubscriptionDelivery[];
  /** The table's caption, e.g. "Upcoming deliveries of Roaster's Rotation". */
  caption: string;
  actions?: DeliveryActions;
};

function coffeeOf(delivery: SubscriptionDelivery): string {
  return delivery.coffee ?? 'Lot chosen nearer the roast day';
}

/** "2 × 12 oz bags, Medium, Whole bean": what this delivery was frozen with, or will bring. */
function contentsOf(delivery: SubscriptionDelivery): string {
  return `${bagsLabel(delivery.bagsPerDelivery, delivery.bagSize)}, ${roastLevelLabels[delivery.roastLevel]}, ${grindLabels[delivery.grind]}`;
}

/** Each delivery's dates, whether it lands ready to brew, its coffee and where it stands; a locked one says why. */
export function DeliverySchedule({ deliveries, caption, actions }: DeliveryScheduleProps) {
  return (
    <div className="overflow-x-auto rounded-card border border-rule bg-sheet">
      <table className="w-full min-w-[48rem] border-collapse text-left text-small">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-paper-shade">
          <tr>
            <th scope="col" className="px-3 py-2 font-semibold">
              Roasts
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Ships
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Arrives about
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Ready from
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Best before
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Coffee
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Brings
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Status
            </th>
            {actions ? (
              <th scope="col" className="px-3 py-2 font-semibold">
                <span className="sr-only">Skip or undo</span>
              </th>
            ) : null}
          </tr>
        </thead>
        <tbody className="divide-y divide-rule">
          {deliveries.map((delivery) => {
            const status = deliveryStatusLabels[delivery.status];
            const skipped = delivery.status === 'skipped';
            return (
              <tr key={delivery.roastDate} className={skipped ? 'text-ink-muted' : undefined}>
                <th scope="row" className="px-3 py-2 font-semibold whitespace-nowrap">
                  {skipped ? <s>{formatDayWithWeekday(delivery.roastDate)}</s> : formatDayWithWeekday(delivery.roastDate)}
                </th>
                <td className="px-3 py-2 whitespace-nowrap">{formatDayWithWeekday(delivery.shipDate)}</td>
                <td className="px-3 py-2 whitespace-nowrap">{formatDayWithWeekday(delivery.expectedArrival)}</td>
                <td className="px-3 py-2 whitespace-nowrap">
                  {formatDayWithWeekday(delivery.readyFrom)}
                  <p className="text-caption text-ink-muted">{delivery.readyOnArrival ? 'Ready to brew on arrival' : 'Arrives before it is ready'}</p>
                </td>
                <td className="px-3 py-2 whitespace-nowrap">{formatDayWithWeekday(delivery.bestBefore)}</td>
                <td className="px-3 py-2">{coffeeOf(delivery)}</td>
                <td className="px-3 py-2">{contentsOf(delivery)}</td>
                <td className="px-3 py-2">
                  <div className="flex flex-wrap items-center gap-1.5">
                    <Badge tone={status.tone}>{status.label}</Badge>
                    {delivery.paid ? <Badge tone="ok">Paid</Badge> : null}
                    {delivery.locked && delivery.status === 'scheduled' ? (
                      <Badge>
                        <Lock aria-hidden="true" className="size-3" />
                        Locked
                      </Badge>
                    ) : null}
                  </div>
                  {delivery.locked && delivery.status === 'scheduled' ? (
                    <p className="mt-1 text-caption text-ink-muted">
                      Past its cutoff ({formatInstantWithWeekday(delivery.cutoffAt)}): it roasts as it is, and changes reach the next delivery.
                    </p>
                  ) : null}
                </td>
                {actions ? (
                  <td className="px-3 py-2 whitespace-nowrap">
                    {!delivery.locked && delivery.status === 'scheduled' ? (
                      <Button variant="secondary" disabled={actions.busy} onClick={() => actions.onSkip(delivery)}>
                        Skip<span className="sr-only"> the delivery of {formatDayWithWeekday(delivery.roastDate)}</span>
                      </Button>
                    ) : !delivery.locked && skipped ? (
                      <Button variant="secondary" disabled={actions.busy} onClick={() => actions.onUnskip(delivery)}>
                        Undo skip<span className="sr-only"> of the delivery of {formatDayWithWeekday(delivery.roastDate)}</span>
                      </Button>
                    ) : null}
                  </td>
                ) : null}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
