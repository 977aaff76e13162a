// Subscriptions: started by a completed checkout, then changed (items, interval, pause, trial,
// cancel at period end) or cancelled at once.
import { StripeApiError } from '../api-error';
import type { SubscriptionUpdateParams } from '../params';
import { newId } from '../store';
import type { CheckoutSession, Customer, PaymentMethod, Subscription, SubscriptionItem } from '../stripe-objects';
import { emptyList, type AccountContext } from './context';
import { attemptInvoice, createInvoice } from './invoices';
import { periodOf, setPeriod } from './periods';
import { addInterval, createPrice, sameRecurring } from './prices';

export function createSubscription({ state, now }: AccountContext, session: CheckoutSession, customer: Customer, method: PaymentMethod): Subscription {
  const items = state.sessionLineItems[session.id] ?? [];
  const recurring = items[0]?.price.recurring;
  if (!recurring) throw new Error(`session ${session.id} has no recurring price`);
  const id = newId('sub');
  const start = now();
  const subscriptionItems: SubscriptionItem[] = items.map((item) => ({
    id: newId('si'),
    object: 'subscription_item',
    current_period_start: start,
    current_period_end: addInterval(start, recurring),
    metadata: {},
    price: item.price,
    quantity: item.quantity,
    subscription: id,
    created: start,
  }));
  const subscription: Subscription = {
    id,
    object: 'subscription',
    billing_cycle_anchor: start,
    cancel_at: null,
    cancel_at_period_end: false,
    canceled_at: null,
    collection_method: 'charge_automatically',
    currency: session.currency,
    customer: customer.id,
    default_payment_method: method.id,
    ended_at: null,
    items: emptyList(`/v1/subscription_items?subscription=${id}`, subscriptionItems),
    latest_invoice: null,
    metadata: { ...(state.sessionSettings[session.id]?.subscriptionMetadata ?? {}) },
    pause_collection: null,
    start_date: start,
    status: 'incomplete',
    trial_end: null,
    trial_start: null,
    created: start,
    livemode: false,
  };
  state.subscriptions[id] = subscription;
  return subscription;
}

export function cancelNow({ state, now, emit }: AccountContext, subscription: Subscription, endedAt: number) {
  subscription.status = 'canceled';
  subscription.canceled_at ??= now();
  subscription.ended_at = endedAt;
  for (const invoice of Object.values(state.invoices)) {
    if (invoice.parent.subscription_details.subscription === subscription.id && invoice.status === 'open') invoice.next_payment_attempt = null;
  }
  emit('customer.subscription.deleted', subscription);
}

/** Applies `params.items` to a copy of the subscription's items; says whether the billing interval changed. */
function changedItems(ctx: AccountContext, subscription: Subscription, changes: NonNullable<SubscriptionUpdateParams['items']>) {
  const { state, now, find } = ctx;
  const items = structuredClone(subscription.items.data);
  changes.forEach((change, index) => {
    const param = `items[${index}]`;
    const existing = change.id ? items.find((item) => item.id === change.id) : undefined;
    if (change.id && !existing) throw StripeApiError.invalid(`Invalid subscription_item: ${change.id}`, `${param}[id]`, 'resource_missing');
    if (change.deleted) {
      if (!existing) throw StripeApiError.invalid('Deleting an item needs its id.', `${param}[id]`, 'parameter_missing');
      items.splice(items.indexOf(existing), 1);
      return;
    }
    let price = existing?.price;
    if (change.price_data) {
      find(state.products, change.price_data.product, 'product', `${param}[price_data][product]`);
      price = createPrice(ctx, {
        currency: change.price_data.currency,
        unit_amount: change.price_data.unit_amount,
        product: change.price_data.product,
        recurring: { interval: change.price_data.recurring.interval, interval_count: change.price_data.recurring.interval_count ?? 1 },
      });
    }
    if (!price) throw StripeApiError.invalid('A new item needs `price_data`.', `${param}[price_data]`, 'parameter_missing');
    if (existing) {
      existing.price = price;
      if (change.quantity !== undefined) existing.quantity = change.quantity;
      if (change.metadata !== undefined) existing.metadata = change.metadata;
    } else {
      const period = periodOf(subscription);
      items.push({
        id: newId('si'),
        object: 'subscription_item',
        current_period_start: period.start,
        current_period_end: period.end,
        metadata: change.metadata ?? {},
        price,
        quantity: change.quantity ?? 1,
        subscription: subscription.id,
        created: now(),
      });
    }
  });
  if (items.length === 0) throw StripeApiError.invalid('A subscription needs at least one item.', 'items');
  const intervals = items.map((item) => item.price.recurring);
  if (intervals.some((recurring) => !sameRecurring(recurring, intervals[0] ?? null))) {
    throw StripeApiError.invalid('Every item of a subscription must bill on the same interval.', 'items');
  }
  return { items, intervalChanged: !sameRecurring(intervals[0] ?? null, periodOf(subscription).recurring) };
}

export function subscriptionApi(ctx: AccountContext) {
  const { store, state, now, emit, find } = ctx;
  return {
    updateSubscription(id: string, params: SubscriptionUpdateParams): Subscription {
      const subscription = find(state.subscriptions, id, 'subscription');
      if (subscription.status === 'canceled') {
        throw StripeApiError.invalid('A canceled subscription can only update its metadata.', undefined, 'subscription_canceled');
      }
      const previous: Record<string, unknown> = {};
      const before = structuredClone(subscription);
      let intervalChanged = false;

      if (params.items) {
        const changed = changedItems(ctx, subscription, params.items);
        intervalChanged = changed.intervalChanged;
        subscription.items.data = changed.items;
        previous.items = before.items;
      }
      if (params.cancel_at_period_end !== undefined && params.cancel_at_period_end !== subscription.cancel_at_period_end) {
        previous.cancel_at_period_end = subscription.cancel_at_period_end;
        subscription.cancel_at_period_end = params.cancel_at_period_end;
        subscription.cancel_at = params.cancel_at_period_end ? periodOf(subscription).end : null;
        subscription.canceled_at = params.cancel_at_period_end ? now() : null;
      }
      if (params.pause_collection !== undefined) {
        previous.pause_collection = subscription.pause_collection;
        subscription.pause_collection = params.pause_collection
          ? { behavior: params.pause_collection.behavior, resumes_at: params.pause_collection.resumes_at ?? null }
          : null;
      }
      if (params.metadata !== undefined) {
        previous.metadata = subscription.metadata;
        subscription.metadata = { ...subscription.metadata, ...params.metadata };
      }
      if (params.default_payment_method !== undefined) {
        find(state.paymentMethods, params.default_payment_method, 'payment_method', 'default_payment_method');
        previous.default_payment_method = subscription.default_payment_method;
        subscription.default_payment_method = params.default_payment_method;
      }

      // As in Stripe, a trial end moves the next invoice to it: the period runs from now until then.
      let trialSet = false;
      if (params.trial_end !== undefined) {
        const trialEnd = params.trial_end === 'now' ? now() : params.trial_end;
        if (params.trial_end !== 'now' && trialEnd <= now()) {
          throw StripeApiError.invalid('Invalid timestamp: must be an integer Unix timestamp in the future.', 'trial_end');
        }
        if (subscription.status !== 'active' && subscription.status !== 'trialing') {
          throw StripeApiError.invalid(`A subscription that is ${subscription.status} cannot start a trial.`, 'trial_end');
        }
        previous.trial_end = subscription.trial_end;
        previous.status = subscription.status;
        subscription.trial_start = now();
        subscription.trial_end = trialEnd;
        subscription.billing_cycle_anchor = trialEnd;
        subscription.status = trialEnd > now() ? 'trialing' : 'active';
        setPeriod(subscription, now(), trialEnd);
        trialSet = true;
      }

      if (Object.keys(previous).length > 0) emit('customer.subscription.updated', subscription, previous);
      // As in Stripe, a new billing interval restarts the period now and bills it at once (unless a trial end postpones it).
      if (intervalChanged && !trialSet) {
        const { recurring } = periodOf(subscription);
        setPeriod(subscription, now(), addInterval(now(), recurring));
        subscription.billing_cycle_anchor = now();
        const invoice = createInvoice(ctx, subscription, 'subscription_update', subscription.pause_collection !== null);
        if (invoice.status === 'open') attemptInvoice(ctx, invoice);
      }
      store.changed();
      return subscription;
    },

    cancelSubscription(id: string): Subscription {
      const subscription = find(state.subscriptions, id, 'subscription');
      if (subscription.status === 'canceled') {
        throw StripeApiError.invalid(`The subscription ${id} is already canceled.`, undefined, 'subscription_canceled');
      }
      cancelNow(ctx, subscription, now());
      store.changed();
      return subscription;
    },
  };
}
