// A subscription's current billing period (kept on each of its items, as Stripe does).
import type { Recurring, Subscription } from '../stripe-objects';

export function periodOf(subscription: Subscription) {
  const first = subscription.items.data[0];
  if (!first) throw new Error(`subscription ${subscription.id} has no items`);
  return { start: first.current_period_start, end: first.current_period_end, recurring: first.price.recurring as Recurring };
}

export function setPeriod(subscription: Subscription, start: number, end: number) {
  for (const item of subscription.items.data) {
    item.current_period_start = start;
    item.current_period_end = end;
  }
}
