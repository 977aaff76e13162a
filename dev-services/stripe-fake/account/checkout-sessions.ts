// Checkout sessions: created by Restday, paid on the fake's test-payment page with a test card
// (a subscription session also starts its subscription and pays the first invoice), or expired.
import { StripeApiError } from '../api-error';
import type { CheckoutSessionCreateParams } from '../params';
import { newId } from '../store';
import type { CheckoutSession, LineItem } from '../stripe-objects';
import { chargeOutcome, checkCardNumber, type CardDecline } from '../test-cards';
import { charge, savePaymentMethod, type CardDetails } from './cards';
import { day, type AccountContext } from './context';
import { createCustomer } from './customers';
import { attemptInvoice, createInvoice } from './invoices';
import { createPrice, sameRecurring } from './prices';
import { createSubscription } from './subscriptions';

export type PayResult = { ok: true; session: CheckoutSession } | { ok: false; decline: CardDecline };

/** Expires open sessions whose time has passed (checked whenever a session is read or time moves). */
export function expireIfDue(ctx: AccountContext, session: CheckoutSession) {
  if (session.status === 'open' && session.expires_at <= ctx.now()) expire(ctx, session);
}

function expire({ emit }: AccountContext, session: CheckoutSession) {
  session.status = 'expired';
  session.url = null;
  emit('checkout.session.expired', session);
}

/** Stripe's checks on a new session's line items: one currency, and prices that fit the mode. */
function checkLineItems(params: CheckoutSessionCreateParams) {
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
}

/** The session's line items, each with a new price (and a new product where `product_data` names one). */
function createLineItems(ctx: AccountContext, params: CheckoutSessionCreateParams, created: number): LineItem[] {
  const { state, find } = ctx;
  return params.line_items.map((item, index) => {
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
    const price = createPrice(ctx, { currency: data.currency, unit_amount: data.unit_amount, product: productId, recurring });
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
}

export function checkoutSessionApi(ctx: AccountContext) {
  const { store, state, now, emit, find } = ctx;

  function retrieveCheckoutSession(id: string): CheckoutSession {
    const session = find(state.sessions, id, 'checkout.session', 'session');
    expireIfDue(ctx, session);
    return session;
  }

  return {
    createCheckoutSession(params: CheckoutSessionCreateParams): CheckoutSession {
      if (params.customer) find(state.customers, params.customer, 'customer', 'customer');
      if (params.customer && params.customer_email) {
        throw StripeApiError.invalid('You may only specify one of these parameters: customer, customer_email.', 'customer_email');
      }
      checkLineItems(params);
      const created = now();
      // Callers send real time; on an advanced clock the session keeps the lifetime they asked for.
      const realNow = created - state.clockOffsetSeconds;
      const requestedExpiry = params.expires_at ?? realNow + day;
      if (requestedExpiry < realNow + 30 * 60 || requestedExpiry > realNow + day) {
        throw StripeApiError.invalid('The `expires_at` timestamp must be between 30 minutes and 24 hours from now.', 'expires_at');
      }
      const expiresAt = requestedExpiry + state.clockOffsetSeconds;

      const id = newId('cs_test', 58);
      const lineItems = createLineItems(ctx, params, created);
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
        url: `${ctx.baseUrl()}/test-payment/${id}`,
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

    retrieveCheckoutSession,

    lineItemsOf(id: string): LineItem[] {
      find(state.sessions, id, 'checkout.session', 'session');
      return state.sessionLineItems[id] ?? [];
    },

    expireCheckoutSession(id: string): CheckoutSession {
      const session = retrieveCheckoutSession(id);
      if (session.status !== 'open') {
        throw StripeApiError.invalid(`Only Checkout Sessions with a status of \`open\` can be expired; this one is \`${session.status}\`.`, 'session');
      }
      expire(ctx, session);
      store.changed();
      return session;
    },

    /** The test-payment page's "Pay": charge the card, then complete the session (and start its subscription). */
    payCheckoutSession(id: string, card: CardDetails): PayResult {
      const session = retrieveCheckoutSession(id);
      if (session.status !== 'open') throw StripeApiError.invalid(`This Checkout Session is ${session.status}.`, 'session');
      const check = checkCardNumber(card.number);
      if (!check.ok) return { ok: false, decline: check.decline };
      // A card that is declined outright changes nothing: the session stays open for another try.
      const decline = chargeOutcome(card.number);
      if (decline) return { ok: false, decline };

      const email = session.customer_email ?? (session.customer ? (state.customers[session.customer]?.email ?? null) : null);
      if (session.mode === 'payment') {
        const method = savePaymentMethod(ctx, card, session.customer);
        const { intent } = charge(ctx, session.amount_total, session.currency, method, session.customer, {
          ...(state.sessionSettings[id]?.paymentIntentMetadata ?? {}),
        });
        session.payment_intent = intent.id;
      } else {
        const customer = session.customer ? find(state.customers, session.customer, 'customer') : createCustomer(ctx, { email: email ?? undefined });
        const method = savePaymentMethod(ctx, card, customer.id);
        customer.invoice_settings.default_payment_method = method.id;
        const subscription = createSubscription(ctx, session, customer, method);
        const invoice = createInvoice(ctx, subscription, 'subscription_create', false);
        attemptInvoice(ctx, invoice);
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
  };
}
