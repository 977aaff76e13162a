/**
 * Who decides a subscription's status. The payment service owns its standing (active, past due,
 * cancelled, or incomplete before the first payment); the subscriber owns the pause. So an event
 * from the payment service, late or out of order, can move the standing but never undo a pause,
 * and a pause ends by itself on its day.
 */
import type { IsoDate } from './shop-time';
import type { SubscriptionStatus } from './vocabulary';

/** What the payment service says about the money: every status except the subscriber's own `paused`. */
export type PaymentStanding = Exclude<SubscriptionStatus, 'paused'>;

/** The status a subscriber reads: `paused` while their pause runs and the standing is good, else the standing. */
export function subscriptionStatusOf(standing: SubscriptionStatus, pausedUntil: IsoDate | null, today: IsoDate): SubscriptionStatus {
  const good = standing === 'active' || standing === 'paused';
  if (!good) return standing;
  return pausedUntil !== null && pausedUntil > today ? 'paused' : 'active';
}
