import { Lock } from 'lucide-react';
import { grindLabels, roastLevelLabels } from '@shared/domain/vocabulary';
import type { SubscriptionDelivery } from '@shared/schemas/subscriptions';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { bagsLabel, deliveryStatusLabels } from '@/lib/subscription-labels';
import { formatDayWithWeekday, formatInstantWithWeekday } from '@/lib/dates';
import { Table, TableBody, TableCell, TableFrame, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';

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
    <TableFrame>
      <Table className="min-w-[48rem]">
        <caption className="sr-only">{caption}</caption>
        <TableHead>
          <tr>
            <TableHeader>Roasts</TableHeader>
            <TableHeader>Ships</TableHeader>
            <TableHeader>Arrives about</TableHeader>
            <TableHeader>Ready from</TableHeader>
            <TableHeader>Best before</TableHeader>
            <TableHeader>Coffee</TableHeader>
            <TableHeader>Brings</TableHeader>
            <TableHeader>Status</TableHeader>
            {actions ? (
              <TableHeader>
                <span className="sr-only">Skip or undo</span>
              </TableHeader>
            ) : null}
          </tr>
        </TableHead>
        <TableBody>
          {deliveries.map((delivery) => {
            const status = deliveryStatusLabels[delivery.status];
            const skipped = delivery.status === 'skipped';
            return (
              <tr key={delivery.roastDate} className={skipped ? 'text-ink-muted' : undefined}>
                <TableRowHeader className="font-semibold whitespace-nowrap">
                  {skipped ? <s>{formatDayWithWeekday(delivery.roastDate)}</s> : formatDayWithWeekday(delivery.roastDate)}
                </TableRowHeader>
                <TableCell className="whitespace-nowrap">{formatDayWithWeekday(delivery.shipDate)}</TableCell>
                <TableCell className="whitespace-nowrap">{formatDayWithWeekday(delivery.expectedArrival)}</TableCell>
                <TableCell className="whitespace-nowrap">
                  {formatDayWithWeekday(delivery.readyFrom)}
                  <p className="text-caption text-ink-muted">{delivery.readyOnArrival ? 'Ready to brew on arrival' : 'Arrives before it is ready'}</p>
                </TableCell>
                <TableCell className="whitespace-nowrap">{formatDayWithWeekday(delivery.bestBefore)}</TableCell>
                <TableCell>{coffeeOf(delivery)}</TableCell>
                <TableCell>{contentsOf(delivery)}</TableCell>
                <TableCell>
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
                </TableCell>
                {actions ? (
                  <TableCell className="whitespace-nowrap">
                    {!delivery.locked && delivery.status === 'scheduled' ? (
                      <Button variant="secondary" disabled={actions.busy} onClick={() => actions.onSkip(delivery)}>
                        Skip<span className="sr-only"> the delivery of {formatDayWithWeekday(delivery.roastDate)}</span>
                      </Button>
                    ) : !delivery.locked && skipped ? (
                      <Button variant="secondary" disabled={actions.busy} onClick={() => actions.onUnskip(delivery)}>
                        Undo skip<span className="sr-only"> of the delivery of {formatDayWithWeekday(delivery.roastDate)}</span>
                      </Button>
                    ) : null}
                  </TableCell>
                ) : null}
              </tr>
            );
          })}
        </TableBody>
      </Table>
    </TableFrame>
  );
}
