import { addressLines } from '@shared/domain/address';
import { grindLabels, roastLevelLabels } from '@shared/domain/vocabulary';
import { formatMoney } from '@shared/domain/money';
import type { Subscription } from '@shared/schemas/subscriptions';
import { bagsLabel, brewMethodLabels, cadenceLabel } from '@/lib/subscription-labels';

/** What each delivery brings, how often, what it costs and where it goes. */
export function SubscriptionSummary({ subscription }: { subscription: Subscription }) {
  const facts: [string, string][] = [
    ['Roast level', roastLevelLabels[subscription.roastLevel]],
    ['Each delivery', bagsLabel(subscription.bagsPerDelivery, subscription.bagSize)],
    ['Grind', grindLabels[subscription.grind]],
    ['Brew method', brewMethodLabels[subscription.brewMethod]],
    ['How often', cadenceLabel(subscription.cadenceWeeks)],
    ['Per delivery', `${formatMoney(subscription.priceCents, subscription.currency)} with shipping`],
    ['Ships to', addressLines(subscription.shippingAddress).join(', ')],
  ];
  return (
    <dl className="grid gap-x-6 gap-y-2 text-small sm:grid-cols-[max-content_1fr]">
      {facts.map(([term, value]) => (
        <div key={term} className="contents">
          <dt className="font-semibold text-ink-muted">{term}</dt>
          <dd>{value}</dd>
        </div>
      ))}
    </dl>
  );
}
