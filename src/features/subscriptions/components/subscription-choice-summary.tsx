import { grindLabels, roastLevelLabels } from '@shared/domain/vocabulary';
import type { SubscriptionBuild } from '../utils/subscription-form';
import { bagSizeNetLabel, brewMethodLabels, cadenceLabel } from '@/lib/subscription-labels';

/** The builder's choices, read back before paying. */
export function SubscriptionChoiceSummary({ build, coffee }: { build: SubscriptionBuild; coffee: string }) {
  const facts: [string, string][] = [
    ['Coffee', coffee],
    ['Roast level', roastLevelLabels[build.roastLevel]],
    ['Bags per delivery', `${build.bagsPerDelivery} × ${bagSizeNetLabel(build.bagSize)}`],
    ['Brew method', brewMethodLabels[build.brewMethod]],
    ['Grind', grindLabels[build.grind]],
    ['How often', cadenceLabel(build.cadenceWeeks)],
  ];
  return (
    <dl className="grid grid-cols-[max-content_1fr] gap-x-6 gap-y-2">
      {facts.map(([term, value]) => (
        <div key={term} className="contents">
          <dt className="font-semibold text-ink-muted">{term}</dt>
          <dd>{value}</dd>
        </div>
      ))}
    </dl>
  );
}
