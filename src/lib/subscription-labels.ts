// Words and dates for subscriptions and their deliveries, shared by Deliveries and the Roastery.

import { bagNetWeightLabel } from '@shared/domain/labels';
import { bagSizeDeclarations } from '@shared/domain/units';
import type { BrewMethod, DeliveryStatus, RoastedBagSize, SubscriptionStatus } from '@shared/domain/vocabulary';
import type { BadgeTone } from '@/components/ui/badge';

export const subscriptionStatusLabels: Record<SubscriptionStatus, { label: string; tone: BadgeTone }> = {
  incomplete: { label: 'Awaiting payment', tone: 'neutral' },
  active: { label: 'Active', tone: 'ok' },
  paused: { label: 'Paused', tone: 'neutral' },
  past_due: { label: 'Payment due', tone: 'alert' },
  cancelled: { label: 'Cancelled', tone: 'neutral' },
};

export const deliveryStatusLabels: Record<DeliveryStatus, { label: string; tone: BadgeTone }> = {
  scheduled: { label: 'Scheduled', tone: 'neutral' },
  skipped: { label: 'Skipped', tone: 'neutral' },
  held: { label: 'Held until paid', tone: 'alert' },
  roasted: { label: 'Roasted', tone: 'ok' },
  shipped: { label: 'Shipped', tone: 'ok' },
};

export const brewMethodLabels: Record<BrewMethod, string> = { filter: 'Filter', espresso: 'Espresso' };

/** 1 → "Every week"; 3 → "Every 3 weeks" */
export function cadenceLabel(weeks: number): string {
  return weeks === 1 ? 'Every week' : `Every ${weeks} weeks`;
}

/** '12oz' → "12 oz" */
export function bagSizeShort(size: RoastedBagSize): string {
  const { amount, unit } = bagSizeDeclarations[size];
  return `${amount} ${unit}`;
}

/** The label's net-weight statement: "Net Wt 12 oz (340 g)". */
export function bagSizeNetLabel(size: RoastedBagSize): string {
  return bagNetWeightLabel(size);
}

/** 2, '12oz' → "2 × 12 oz bags" */
export function bagsLabel(count: number, size: RoastedBagSize): string {
  return `${count} × ${bagSizeShort(size)} ${count === 1 ? 'bag' : 'bags'}`;
}
