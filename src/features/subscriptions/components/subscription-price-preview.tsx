import { shipPolicyCustomerNotes } from '@shared/domain/vocabulary';
import { formatMoney } from '@shared/domain/money';
import type { SubscriptionPreview } from '@shared/schemas/subscription-preview';
import { ErrorState } from '@/components/ui/error-state';
import { Skeleton } from '@/components/ui/skeleton';
import { cadenceLabel } from '@/lib/subscription-labels';
import { formatDayWithWeekday, formatInstantWithWeekday } from '@/lib/dates';

type SubscriptionPricePreviewProps = {
  preview: SubscriptionPreview | undefined;
  /** True while a newer choice is being priced and the figures shown are the last ones. */
  updating: boolean;
  error: unknown;
  onRetry: () => void;
  cadenceWeeks: number;
};

/** The price of each delivery with the subscription discount, and the first three deliveries if paid now. */
export function SubscriptionPricePreview({ preview, updating, error, onRetry, cadenceWeeks }: SubscriptionPricePreviewProps) {
  if (!preview) {
    if (error) return <ErrorState title="The price could not load" error={error} onRetry={onRetry} />;
    return (
      <div>
        <p role="status" className="sr-only">
          Working out the price and dates…
        </p>
        <Skeleton className="h-64 rounded-card" />
      </div>
    );
  }
  const firstCutoff = preview.deliveries[0]?.cutoffAt;
  return (
    <div className="grid gap-5" aria-busy={updating}>
      <div aria-live="polite" aria-atomic="true">
        <p className="text-small font-semibold text-ink-muted">Each delivery</p>
        <p className="flex flex-wrap items-baseline gap-x-3">
          <span className="font-heading text-h1 font-semibold">{formatMoney(preview.priceCents, preview.currency)}</span>
          {preview.regularPriceCents > preview.priceCents ? (
            <span className="text-ink-muted">
              <span className="sr-only">instead of </span>
              <s>{formatMoney(preview.regularPriceCents, preview.currency)}</s>
            </span>
          ) : null}
        </p>
        <p className="text-small text-ink-muted">
          {preview.discountPct > 0 ? `${preview.discountPct}% subscription discount on the coffee; ` : ''}
          shipping of {formatMoney(preview.shippingCents, preview.currency)} included. Charged {cadenceLabel(cadenceWeeks).toLowerCase()}.
        </p>
      </div>
      <div>
        <h3 className="text-h3">Your first deliveries</h3>
        {firstCutoff ? (
          <p className="mt-1 text-small text-ink-muted">
            If you pay before {formatInstantWithWeekday(firstCutoff)}; later, each date moves to the next roast day.
          </p>
        ) : null}
        <p className="mt-1 text-small">{shipPolicyCustomerNotes[preview.shipPolicy]}</p>
        <ol aria-label="First three deliveries" className="mt-3 grid gap-3">
          {preview.deliveries.map((delivery, index) => (
            <li key={delivery.roastDate} className="rounded-control border border-rule bg-sheet p-3">
              <p className="font-semibold">Delivery {index + 1}</p>
              <dl className="mt-1 grid grid-cols-[max-content_1fr] gap-x-4 text-small">
                <dt className="text-ink-muted">Roasted</dt>
                <dd>{formatDayWithWeekday(delivery.roastDate)}</dd>
                <dt className="text-ink-muted">Ships</dt>
                <dd>{formatDayWithWeekday(delivery.shipDate)}</dd>
                <dt className="text-ink-muted">Arrives about</dt>
                <dd>{formatDayWithWeekday(delivery.expectedArrival)}</dd>
                <dt className="text-ink-muted">Ready from</dt>
                <dd>{formatDayWithWeekday(delivery.readyFrom)}</dd>
                <dt className="text-ink-muted">Best before</dt>
                <dd>{formatDayWithWeekday(delivery.bestBefore)}</dd>
              </dl>
            </li>
          ))}
        </ol>
      </div>
    </div>
  );
}
