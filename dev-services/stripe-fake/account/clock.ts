// The fake's clock: moving it forward expires sessions, ends pauses, renews subscriptions whose
// period has ended and retries failed renewals.
import type { Subscription } from '../stripe-objects';
import { expireIfDue } from './checkout-sessions';
import type { AccountContext } from './context';
import { attemptInvoice, createInvoice } from './invoices';
import { periodOf, setPeriod } from './periods';
import { addInterval } from './prices';
import { cancelNow } from './subscriptions';

export interface RenewalSummary {
  subscription: string;
  invoice: string | null;
  outcome: 'paid' | 'failed' | 'skipped' | 'canceled';
}

/** The period has ended: cancel, skip (collection paused) or invoice the next one. */
function renew(ctx: AccountContext, subscription: Subscription): RenewalSummary {
  const { end, recurring } = periodOf(subscription);
  if (subscription.cancel_at_period_end) {
    cancelNow(ctx, subscription, end);
    return { subscription: subscription.id, invoice: null, outcome: 'canceled' };
  }
  const previousItems = structuredClone(subscription.items);
  setPeriod(subscription, end, addInterval(end, recurring));
  const paused = subscription.pause_collection !== null;
  const invoice = createInvoice(ctx, subscription, 'subscription_cycle', paused);
  ctx.emit('customer.subscription.updated', subscription, { items: previousItems, latest_invoice: invoice.id });
  if (paused) return { subscription: subscription.id, invoice: invoice.id, outcome: 'skipped' };
  const decline = attemptInvoice(ctx, invoice);
  return { subscription: subscription.id, invoice: invoice.id, outcome: decline ? 'failed' : 'paid' };
}

/** Brings everything up to the clock: expiries, pause ends, renewals and renewal retries. */
function settle(ctx: AccountContext): RenewalSummary[] {
  const { store, state, now, emit } = ctx;
  const summaries: RenewalSummary[] = [];
  for (const session of Object.values(state.sessions)) expireIfDue(ctx, session);
  for (const subscription of Object.values(state.subscriptions)) {
    const resumesAt = subscription.pause_collection?.resumes_at;
    if (resumesAt && resumesAt <= now()) {
      const previous = subscription.pause_collection;
      subscription.pause_collection = null;
      emit('customer.subscription.updated', subscription, { pause_collection: previous });
    }
    // A long jump renews once per elapsed period, each with its own invoice.
    while (subscription.status !== 'canceled' && subscription.status !== 'incomplete' && periodOf(subscription).end <= now()) {
      summaries.push(renew(ctx, subscription));
    }
  }
  for (const invoice of Object.values(state.invoices)) {
    if (invoice.status === 'open' && invoice.next_payment_attempt !== null && invoice.next_payment_attempt <= now()) {
      const decline = attemptInvoice(ctx, invoice);
      summaries.push({ subscription: invoice.parent.subscription_details.subscription, invoice: invoice.id, outcome: decline ? 'failed' : 'paid' });
    }
  }
  store.changed();
  return summaries;
}

export function clockApi(ctx: AccountContext) {
  return {
    now: ctx.now,

    /** Moves the fake's clock forward and brings every subscription and session up to it. */
    advanceClock(seconds: number): { now: number; renewals: RenewalSummary[] } {
      ctx.state.clockOffsetSeconds += seconds;
      const renewals = settle(ctx);
      return { now: ctx.now(), renewals };
    },
  };
}
