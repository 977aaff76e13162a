// One fake Stripe account: the objects Restday creates and reads, and what happens to them when a
// test card pays, a subscription period ends, or a refund is made. Every change that Stripe would
// announce becomes an event, handed to `onEvent` for delivery.
import { StripeApiError } from './api-error';
import type { CheckoutSessionCreateParams, CustomerCreateParams, RefundCreateParams, SubscriptionUpdateParams } from './params';
import { newId, type Store } from './store';
import type {
  ApiList,
  Charge,
  CheckoutSession,
  Customer,
  EventType,
  Invoice,
  LineItem,
  Metadata,
  PaymentIntent,
  PaymentMethod,
  Price,
  Recurring,
  StripeEvent,
  StripeObject,
  Subscription,
  SubscriptionItem,
} from './stripe-objects';
import { chargeOutcome, checkCardNumber, normalizeCardNumber, type CardDecline } from './test-cards';

/** The API version the fake's objects follow: the one stripe-node 23 pins. */
export const fakeApiVersion = '2026-10-28.endive';

const day = 86_400;
/** Stripe's default retry schedule is smarter; the fake retries a failed renewal every three days, three times. */
const renewalRetryDelaySeconds = 3 * day;
const renewalAttempts = 4;

export interface CardDetails {
  number: string;
  expMonth: number;
  expYear: number;
  cvc: string;
}

export type PayResult = { ok: true; session: CheckoutSession } | { ok: false; decline: CardDecline };

export interface RenewalSummary {
  subscription: string;
  invoice: string | null;
  outcome: 'paid' | 'failed' | 'skipped' | 'canceled';
}

export function emptyList<T>(url: string, data: T[] = []): ApiList<T> {
  return { object: 'list', data, has_more: false, url };
}

function addInterval(startSeconds: number, recurring: Recurring): number {
  const count = recurring.interval_count;
  if (recurring.interval === 'day') return startSeconds + count * day;
  if (recurring.interval === 'week') return startSeconds + count * 7 * day;
  const date = new Date(startSeconds * 1000);
  if (recurring.interval === 'month') date.setUTCMonth(date.getUTCMonth() + count);
  else date.setUTCFullYear(date.getUTCFullYear() + count);
  return Math.floor(date.getTime() / 1000);
}

const sameRecurring = (a: Recurring | null, b: Recurring | null) => a?.interval === b?.interval && a?.interval_count === b?.interval_count;

export function createFakeAccount(options: { store: Store; baseUrl: () => string; onEvent: (event: StripeEvent) => void }) {
  const { store, onEvent } = options;
  const state = store.state;

  const now = () => Math.floor(Date.now() / 1000) + state.clockOffsetSeconds;

  function emit(type: EventType, object: StripeObject, previousAttributes?: Record<string, unknown>) {
    const event: StripeEvent = {
      id: newId('evt'),
      object: 'event',
      api_version: fakeApiVersion,
      created: now(),
      // A snapshot: later changes to the object must not rewrite what the event said.
      data: { object: structuredClone(object), ...(previousAttributes ? { previous_attributes: previousAttributes } : {}) },
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      type,
    };
    state.events[event.id] = event;
    onEvent(event);
  }

  function find<T>(collection: Record<string, T>, id: string, kind: string, param = 'id'): T {
    const found = collection[id];
    if (!found) throw StripeApiError.missing(kind, id, param);
    return found;
  }

  function createPrice(data: { currency: string; unit_amount: number; product: string; recurring: Recurring | null }): Price {
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

  function createCustomer(params: CustomerCreateParams): Customer {
    const customer: Customer = {
      id: newId('cus', 14),
      object: 'customer',
      email: params.email ?? null,
      name: params.name ?? null,
      metadata: params.metadata ?? {},
      invoice_settings: { default_payment_method: null },
      created: now(),
      livemode: false,
    };
    state.customers[customer.id] = customer;
    return customer;
  }

  function savePaymentMethod(card: CardDetails, customer: string | null): PaymentMethod {
    const check = checkCardNumber(card.number);
    if (!check.ok) throw new Error('savePaymentMethod needs a known test card');
    const method: PaymentMethod = {
      id: newId('pm'),
      object: 'payment_method',
      type: 'card',
      card: { brand: check.brand, last4: check.last4, exp_month: card.expMonth, exp_year: card.expYear },
      customer,
      created: now(),
      livemode: false,
    };
    state.paymentMethods[method.id] = method;
    state.cardNumbers[method.id] = normalizeCardNumber(card.number);
    return method;
  }

  /** Charges a saved card: a payment intent and a charge, succeeded or failed. */
  function charge(amount: number, currency: string, paymentMethod: PaymentMethod, customer: string | null, metadata: Metadata) {
    const decline = chargeOutcome(state.cardNumbers[paymentMethod.id] ?? '');
    const intent: PaymentIntent = {
      id: newId('pi'),
      object: 'payment_intent',
      amount,
      amount_received: decline ? 0 : amount,
      currency,
      customer,
      latest_charge: null,
      last_payment_error: decline ? { type: 'card_error', code: decline.code, message: decline.message, ...(decline.declineCode ? { decline_code: decline.declineCode } : {}) } : null,
      metadata,
      payment_method: paymentMethod.id,
      status: decline ? 'requires_payment_method' : 'succeeded',
      created: now(),
      livemode: false,
    };
    const chargeObject: Charge = {
      id: newId('ch'),
      object: 'charge',
      amount,
      amount_captured: decline ? 0 : amount,
      amount_refunded: 0,
      captured: !decline,
      currency,
      customer,
      failure_code: decline?.code ?? null,
      failure_message: decline?.message ?? null,
      metadata: {},
      paid: !decline,
      payment_intent: intent.id,
      payment_method: paymentMethod.id,
      refunded: false,
      status: decline ? 'failed' : 'succeeded',
      created: now(),
      livemode: false,
    };
    intent.latest_charge = chargeObject.id;
    state.paymentIntents[intent.id] = intent;
    state.charges[chargeObject.id] = chargeObject;
    return { intent, decline };
  }

  /** Expires open sessions whose time has passed (checked whenever a session is read or time moves). */
  function expireIfDue(session: CheckoutSession) {
    if (session.status === 'open' && session.expires_at <= now()) expire(session);
  }

  function expire(session: CheckoutSession) {
    session.status = 'expired';
    session.url = null;
    emit('checkout.session.expired', session);
  }

  function periodOf(subscription: Subscription) {
    const first = subscription.items.data[0];
    if (!first) throw new Error(`subscription ${subscription.id} has no items`);
    return { start: first.current_period_start, end: first.current_period_end, recurring: first.price.recurring as Recurring };
  }

  function setPeriod(subscription: Subscription, start: number, end: number) {
    for (const item of subscription.items.data) {
      item.current_period_start = start;
      item.current_period_end = end;
    }
  }

  function createInvoice(subscription: Subscription, billingReason: Invoice['billing_reason'], paused: boolean): Invoice {
    const { start, end } = periodOf(subscription);
    const id = newId('in');
    const lines = subscription.items.data.map((item) => ({
      id: newId('il'),
      object: 'line_item' as const,
      amount: item.price.unit_amount * item.quantity,
      currency: item.price.currency,
      description: `${item.quantity} × ${state.products[item.price.product]?.name ?? 'item'}`,
      period: { start, end },
      pricing: {
        type: 'price_details' as const,
        price_details: { price: item.price.id, product: item.price.product },
        unit_amount_decimal: String(item.price.unit_amount),
      },
      quantity: item.quantity,
    }));
    const total = lines.reduce((sum, line) => sum + line.amount, 0);
    const invoice: Invoice = {
      id,
      object: 'invoice',
      amount_due: total,
      amount_paid: 0,
      amount_remaining: total,
      attempt_count: 0,
      attempted: false,
      billing_reason: billingReason,
      currency: subscription.currency,
      customer: subscription.customer,
      lines: emptyList(`/v1/invoices/${id}/lines`, lines),
      metadata: {},
      next_payment_attempt: paused ? null : now(),
      parent: {
        type: 'subscription_details',
        quote_details: null,
        subscription_details: { subscription: subscription.id, metadata: { ...subscription.metadata } },
      },
      payments: emptyList(`/v1/invoice_payments?invoice=${id}`),
      period_end: end,
      period_start: start,
      status: paused ? 'void' : 'open',
      status_transitions: { finalized_at: now(), paid_at: null, voided_at: paused ? now() : null },
      subtotal: total,
      total,
      created: now(),
      livemode: false,
    };
    state.invoices[id] = invoice;
    subscription.latest_invoice = id;
    return invoice;
  }

  function setSubscriptionStatus(subscription: Subscription, status: Subscription['status']) {
    if (subscription.status === status) return;
    const previous = subscription.status;
    subscription.status = status;
    emit('customer.subscription.updated', subscription, { status: previous });
  }

  /** One payment attempt on an open invoice with the subscription's saved card. */
  function attemptInvoice(invoice: Invoice): CardDecline | null {
    const subscription = find(state.subscriptions, invoice.parent.subscription_details.subscription, 'subscription');
    const customer = state.customers[subscription.customer];
    const methodId = subscription.default_payment_method ?? customer?.invoice_settings.default_payment_method;
    const method = methodId ? state.paymentMethods[methodId] : undefined;
    invoice.attempt_count += 1;
    invoice.attempted = true;
    if (!method) {
      invoice.next_payment_attempt = null;
      emit('invoice.payment_failed', invoice);
      setSubscriptionStatus(subscription, 'past_due');
      return { code: 'payment_method_missing', message: 'The customer has no saved card to charge.' };
    }
    const { intent, decline } = charge(invoice.amount_due, invoice.currency, method, subscription.customer, {});
    invoice.payments.data.push({
      id: newId('inpay'),
      object: 'invoice_payment',
      amount_paid: decline ? null : invoice.amount_due,
      amount_requested: invoice.amount_due,
      currency: invoice.currency,
      invoice: invoice.id,
      is_default: invoice.payments.data.length === 0,
      payment: { type: 'payment_intent', payment_intent: intent.id },
      status: decline ? 'open' : 'paid',
      created: now(),
    });
    if (decline) {
      invoice.next_payment_attempt = invoice.attempt_count < renewalAttempts ? now() + renewalRetryDelaySeconds : null;
      emit('invoice.payment_failed', invoice);
      setSubscriptionStatus(subscription, 'past_due');
      return decline;
    }
    invoice.status = 'paid';
    invoice.amount_paid = invoice.amount_due;
    invoice.amount_remaining = 0;
    invoice.next_payment_attempt = null;
    invoice.status_transitions.paid_at = now();
    emit('invoice.paid', invoice);
    setSubscriptionStatus(subscription, 'active');
    return null;
  }

  function cancelNow(subscription: Subscription, endedAt: number) {
    subscription.status = 'canceled';
    subscription.canceled_at ??= now();
    subscription.ended_at = endedAt;
    for (const invoice of Object.values(state.invoices)) {
      if (invoice.parent.subscription_details.subscription === subscription.id && invoice.status === 'open') invoice.next_payment_attempt = null;
    }
    emit('customer.subscription.deleted', subscription);
  }

  /** The period has ended: cancel, skip (collection paused) or invoice the next one. */
  function renew(subscription: Subscription): RenewalSummary {
    const { end, recurring } = periodOf(subscription);
    if (subscription.cancel_at_period_end) {
      cancelNow(subscription, end);
      return { subscription: subscription.id, invoice: null, outcome: 'canceled' };
    }
    const previousItems = structuredClone(subscription.items);
    setPeriod(subscription, end, addInterval(end, recurring));
    const paused = subscription.pause_collection !== null;
    const invoice = createInvoice(subscription, 'subscription_cycle', paused);
    emit('customer.subscription.updated', subscription, { items: previousItems, latest_invoice: invoice.id });
    if (paused) return { subscription: subscription.id, invoice: invoice.id, outcome: 'skipped' };
    const decline = attemptInvoice(invoice);
    return { subscription: subscription.id, invoice: invoice.id, outcome: decline ? 'failed' : 'paid' };
  }

  /** Brings everything up to the clock: expiries, pause ends, renewals and renewal retries. */
  function settle(): RenewalSummary[] {
    const summaries: RenewalSummary[] = [];
    for (const session of Object.values(state.sessions)) expireIfDue(session);
    for (const subscription of Object.values(state.subscriptions)) {
      const resumesAt = subscription.pause_collection?.resumes_at;
      if (resumesAt && resumesAt <= now()) {
        const previous = subscription.pause_collection;
        subscription.pause_collection = null;
        emit('customer.subscription.updated', subscription, { pause_collection: previous });
      }
      // A long jump renews once per elapsed period, each with its own invoice.
      while (subscription.status !== 'canceled' && subscription.status !== 'incomplete' && periodOf(subscription).end <= now()) {
        summaries.push(renew(subscription));
      }
    }
    for (const invoice of Object.values(state.invoices)) {
      if (invoice.status === 'open' && invoice.next_payment_attempt !== null && invoice.next_payment_attempt <= now()) {
        const decline = attemptInvoice(invoice);
        summaries.push({ subscription: invoice.parent.subscription_details.subscription, invoice: invoice.id, outcome: decline ? 'failed' : 'paid' });
      }
    }
    store.changed();
    return summaries;
  }

  function createSubscription(session: CheckoutSession, customer: Customer, method: PaymentMethod): Subscription {
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

  return {
    now,

    createCustomer(params: CustomerCreateParams) {
      const customer = createCustomer(params);
      store.changed();
      return customer;
    },

    updateCustomer(id: string, params: CustomerCreateParams) {
      const customer = find(state.customers, id, 'customer');
      if (params.email !== undefined) customer.email = params.email;
      if (params.name !== undefined) customer.name = params.name;
      if (params.metadata !== undefined) customer.metadata = { ...customer.metadata, ...params.metadata };
      store.changed();
      return customer;
    },

    /** Replaces the card a customer's subscriptions charge (a test card number). */
    setCustomerCard(id: string, card: CardDetails): PaymentMethod {
      const customer = find(state.customers, id, 'customer');
      const check = checkCardNumber(card.number);
      if (!check.ok) throw StripeApiError.card(check.decline.code, check.decline.message, check.decline.declineCode);
      const method = savePaymentMethod(card, customer.id);
      customer.invoice_settings.default_payment_method = method.id;
      for (const subscription of Object.values(state.subscriptions)) {
        if (subscription.customer === customer.id) subscription.default_payment_method = method.id;
      }
      store.changed();
      return method;
    },

    createCheckoutSession(params: CheckoutSessionCreateParams): CheckoutSession {
      if (params.customer) find(state.customers, params.customer, 'customer', 'customer');
      if (params.customer && params.customer_email) {
        throw StripeApiError.invalid('You may only specify one of these parameters: customer, customer_email.', 'customer_email');
      }
      const currencies = new Set(params.line_items.map((item) => item.price_data.currency));
      if (currencies.size > 1) throw StripeApiError.invalid('All line items must share one currency.', 'line_items');
      const recurrings = params.line_items.map((item) => item.price_data.recurring ?? null);
      if (params.mode === 'payment' && recurrings.some(Boolean)) {
        throw StripeApiError.invalid('In payment mode, every line item must have a one-time price.', 'line_items');
      }
      if (params.mode === 'subscription') {
        if (recurrings.some((recurring) => !recurring)) {
          throw StripeApiError.invalid('In subscription mode, every line item must have a recurring price.', 'line_items');
        }
        const first = recurrings[0] ?? null;
        const normalized = (recurring: typeof first) => (recurring ? { interval: recurring.interval, interval_count: recurring.interval_count ?? 1 } : null);
        if (recurrings.some((recurring) => !sameRecurring(normalized(recurring), normalized(first)))) {
          throw StripeApiError.invalid('Every recurring line item must bill on the same interval.', 'line_items');
        }
      }
      const created = now();
      // Callers send real time; on an advanced clock the session keeps the lifetime they asked for.
      const realNow = created - state.clockOffsetSeconds;
      const requestedExpiry = params.expires_at ?? realNow + day;
      if (requestedExpiry < realNow + 30 * 60 || requestedExpiry > realNow + day) {
        throw StripeApiError.invalid('The `expires_at` timestamp must be between 30 minutes and 24 hours from now.', 'expires_at');
      }
      const expiresAt = requestedExpiry + state.clockOffsetSeconds;

      const id = newId('cs_test', 58);
      const lineItems: LineItem[] = params.line_items.map((item, index) => {
        const data = item.price_data;
        let productId = data.product;
        if (productId) find(state.products, productId, 'product', `line_items[${index}][price_data][product]`);
        else if (data.product_data) {
          productId = newId('prod', 14);
          state.products[productId] = {
            id: productId,
            object: 'product',
            active: true,
            name: data.product_data.name,
            description: data.product_data.description ?? null,
            metadata: data.product_data.metadata ?? {},
            created,
            livemode: false,
          };
        } else {
          throw StripeApiError.invalid('You must specify either `product` or `product_data`.', `line_items[${index}][price_data]`, 'parameter_missing');
        }
        const recurring = data.recurring ? { interval: data.recurring.interval, interval_count: data.recurring.interval_count ?? 1 } : null;
        const price = createPrice({ currency: data.currency, unit_amount: data.unit_amount, product: productId, recurring });
        const amount = data.unit_amount * item.quantity;
        return {
          id: newId('li'),
          object: 'item',
          amount_discount: 0,
          amount_subtotal: amount,
          amount_tax: 0,
          amount_total: amount,
          currency: data.currency,
          description: state.products[productId]?.name ?? '',
          price,
          quantity: item.quantity,
        };
      });
      const total = lineItems.reduce((sum, item) => sum + item.amount_total, 0);
      const session: CheckoutSession = {
        id,
        object: 'checkout.session',
        amount_subtotal: total,
        amount_total: total,
        cancel_url: params.cancel_url ?? null,
        client_reference_id: params.client_reference_id ?? null,
        currency: lineItems[0]?.currency ?? 'usd',
        customer: params.customer ?? null,
        customer_details: null,
        customer_email: params.customer_email ?? null,
        expires_at: expiresAt,
        invoice: null,
        metadata: params.metadata ?? {},
        mode: params.mode,
        payment_intent: null,
        payment_status: 'unpaid',
        status: 'open',
        subscription: null,
        success_url: params.success_url,
        url: `${options.baseUrl()}/test-payment/${id}`,
        created,
        livemode: false,
      };
      state.sessions[id] = session;
      state.sessionLineItems[id] = lineItems;
      state.sessionSettings[id] = {
        paymentIntentMetadata: params.payment_intent_data?.metadata ?? {},
        subscriptionMetadata: params.subscription_data?.metadata ?? {},
      };
      store.changed();
      return session;
    },

    retrieveCheckoutSession(id: string): CheckoutSession {
      const session = find(state.sessions, id, 'checkout.session', 'session');
      expireIfDue(session);
      return session;
    },

    lineItemsOf(id: string): LineItem[] {
      find(state.sessions, id, 'checkout.session', 'session');
      return state.sessionLineItems[id] ?? [];
    },

    expireCheckoutSession(id: string): CheckoutSession {
      const session = this.retrieveCheckoutSession(id);
      if (session.status !== 'open') {
        throw StripeApiError.invalid(`Only Checkout Sessions with a status of \`open\` can be expired; this one is \`${session.status}\`.`, 'session');
      }
      expire(session);
      store.changed();
      return session;
    },

    /** The test-payment page's "Pay": charge the card, then complete the session (and start its subscription). */
    payCheckoutSession(id: string, card: CardDetails): PayResult {
      const session = this.retrieveCheckoutSession(id);
      if (session.status !== 'open') throw StripeApiError.invalid(`This Checkout Session is ${session.status}.`, 'session');
      const check = checkCardNumber(card.number);
      if (!check.ok) return { ok: false, decline: check.decline };
      // A card that is declined outright changes nothing: the session stays open for another try.
      const decline = chargeOutcome(card.number);
      if (decline) return { ok: false, decline };

      const email = session.customer_email ?? (session.customer ? (state.customers[session.customer]?.email ?? null) : null);
      if (session.mode === 'payment') {
        const method = savePaymentMethod(card, session.customer);
        const { intent } = charge(session.amount_total, session.currency, method, session.customer, {
          ...(state.sessionSettings[id]?.paymentIntentMetadata ?? {}),
        });
        session.payment_intent = intent.id;
      } else {
        const customer = session.customer ? find(state.customers, session.customer, 'customer') : createCustomer({ email: email ?? undefined });
        const method = savePaymentMethod(card, customer.id);
        customer.invoice_settings.default_payment_method = method.id;
        const subscription = createSubscription(session, customer, method);
        const invoice = createInvoice(subscription, 'subscription_create', false);
        attemptInvoice(invoice);
        session.customer = customer.id;
        session.subscription = subscription.id;
        session.invoice = invoice.id;
      }
      session.status = 'complete';
      session.payment_status = 'paid';
      session.url = null;
      session.customer_details = { email };
      emit('checkout.session.completed', session);
      store.changed();
      return { ok: true, session };
    },

    updateSubscription(id: string, params: SubscriptionUpdateParams): Subscription {
      const subscription = find(state.subscriptions, id, 'subscription');
      if (subscription.status === 'canceled') {
        throw StripeApiError.invalid('A canceled subscription can only update its metadata.', undefined, 'subscription_canceled');
      }
      const previous: Record<string, unknown> = {};
      const before = structuredClone(subscription);
      let intervalChanged = false;

      if (params.items) {
        const items = structuredClone(subscription.items.data);
        params.items.forEach((change, index) => {
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
            price = createPrice({
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
        intervalChanged = !sameRecurring(intervals[0] ?? null, periodOf(subscription).recurring);
        subscription.items.data = items;
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
        const invoice = createInvoice(subscription, 'subscription_update', subscription.pause_collection !== null);
        if (invoice.status === 'open') attemptInvoice(invoice);
      }
      store.changed();
      return subscription;
    },

    cancelSubscription(id: string): Subscription {
      const subscription = find(state.subscriptions, id, 'subscription');
      if (subscription.status === 'canceled') {
        throw StripeApiError.invalid(`The subscription ${id} is already canceled.`, undefined, 'subscription_canceled');
      }
      cancelNow(subscription, now());
      store.changed();
      return subscription;
    },

    payInvoice(id: string): Invoice {
      const invoice = find(state.invoices, id, 'invoice', 'invoice');
      if (invoice.status !== 'open') throw StripeApiError.invalid(`Invoice is ${invoice.status}; only an open invoice can be paid.`, undefined, `invoice_not_open`);
      const decline = attemptInvoice(invoice);
      store.changed();
      if (decline) throw StripeApiError.card(decline.code, decline.message, decline.declineCode);
      return invoice;
    },

    createRefund(params: RefundCreateParams) {
      if (!params.payment_intent && !params.charge) {
        throw StripeApiError.invalid('One of `charge` or `payment_intent` is required.', 'payment_intent', 'parameter_missing');
      }
      const intent = params.payment_intent ? find(state.paymentIntents, params.payment_intent, 'payment_intent', 'payment_intent') : undefined;
      const chargeId = params.charge ?? intent?.latest_charge;
      const refunded = chargeId ? state.charges[chargeId] : undefined;
      if (!refunded || refunded.status !== 'succeeded') {
        throw StripeApiError.invalid('This payment has no successful charge to refund.', params.charge ? 'charge' : 'payment_intent');
      }
      const remaining = refunded.amount - refunded.amount_refunded;
      if (remaining === 0) throw StripeApiError.invalid(`Charge ${refunded.id} has already been refunded.`, undefined, 'charge_already_refunded');
      const amount = params.amount ?? remaining;
      if (amount > remaining) {
        throw StripeApiError.invalid(`Refund amount (${amount}) is greater than the unrefunded amount on the charge (${remaining}).`, 'amount', 'amount_too_large');
      }
      const refund = {
        id: newId('re'),
        object: 'refund' as const,
        amount,
        charge: refunded.id,
        currency: refunded.currency,
        metadata: params.metadata ?? {},
        payment_intent: refunded.payment_intent,
        reason: params.reason ?? null,
        status: 'succeeded' as const,
        created: now(),
      };
      state.refunds[refund.id] = refund;
      const previous = { amount_refunded: refunded.amount_refunded, refunded: refunded.refunded };
      refunded.amount_refunded += amount;
      refunded.refunded = refunded.amount_refunded === refunded.amount;
      emit('charge.refunded', refunded, previous);
      store.changed();
      return refund;
    },

    /** Moves the fake's clock forward and brings every subscription and session up to it. */
    advanceClock(seconds: number): { now: number; renewals: RenewalSummary[] } {
      state.clockOffsetSeconds += seconds;
      const renewals = settle();
      return { now: now(), renewals };
    },
  };
}

export type FakeAccount = ReturnType<typeof createFakeAccount>;
