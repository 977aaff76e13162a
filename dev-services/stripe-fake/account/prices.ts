// Prices and the billing intervals they recur on.
import { newId } from '../store';
import type { Price, Recurring } from '../stripe-objects';
import { day, type AccountContext } from './context';

export function createPrice(
  { state, now }: AccountContext,
  data: { currency: string; unit_amount: number; product: string; recurring: Recurring | null },
): Price {
  const price: Price = {
    id: newId('price'),
    object: 'price',
    active: true,
    currency: data.currency,
    unit_amount: data.unit_amount,
    product: data.product,
    recurring: data.recurring,
    type: data.recurring ? 'recurring' : 'one_time',
    metadata: {},
    created: now(),
    livemode: false,
  };
  state.prices[price.id] = price;
  return price;
}

/** The end of one interval that starts at `startSeconds` (months and years by the calendar, in UTC). */
export function addInterval(startSeconds: number, recurring: Recurring): number {
  const count = recurring.interval_count;
  if (recurring.interval === 'day') return startSeconds + count * day;
  if (recurring.interval === 'week') return startSeconds + count * 7 * day;
  const date = new Date(startSeconds * 1000);
  if (recurring.interval === 'month') date.setUTCMonth(date.getUTCMonth() + count);
  else date.setUTCFullYear(date.getUTCFullYear() + count);
  return Math.floor(date.getTime() / 1000);
}

export const sameRecurring = (a: Recurring | null, b: Recurring | null) => a?.interval === b?.interval && a?.interval_count === b?.interval_count;
