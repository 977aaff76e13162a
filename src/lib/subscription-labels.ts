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

const shopDay = new Intl.DateTimeFormat('en-US', { weekday: 'short', month: 'short', day: 'numeric', year: 'numeric', timeZone: 'UTC' });
const instant = new Intl.DateTimeFormat('en-US', { weekday: 'short', month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit' });

/** A shop day (`YYYY-MM-DD`) as written, whatever the reader's time zone: "Wed, Dec 9, 2026". */
export function formatDeliveryDay(isoDate: string): string {
  return shopDay.format(new Date(`${isoDate}T00:00:00Z`));
}

/** A UTC instant in the reader's own time: "Tue, Dec 8, 12:00 PM". */
export function formatCutoff(iso: string): string {
  return instant.format(new Date(iso));
}
