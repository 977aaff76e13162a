// Subscription invoices and the payment attempts on them, which move the subscription between
// active and past_due.
import { StripeApiError } from '../api-error';
import { newId } from '../store';
import type { Invoice, Subscription } from '../stripe-objects';
import type { CardDecline } from '../test-cards';
import { charge } from './cards';
import { day, emptyList, type AccountContext } from './context';
import { periodOf } from './periods';

/** Stripe's default retry schedule is smarter; the fake retries a failed renewal every three days, three times. */
const renewalRetryDelaySeconds = 3 * day;
const renewalAttempts = 4;

export function createInvoice({ state, now }: AccountContext, subscription: Subscription, billingReason: Invoice['billing_reason'], paused: boolean): Invoice {
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

function setSubscriptionStatus({ emit }: AccountContext, subscription: Subscription, status: Subscription['status']) {
  if (subscription.status === status) return;
  const previous = subscription.status;
  subscription.status = status;
  emit('customer.subscription.updated', subscription, { status: previous });
}

/** One payment attempt on an open invoice with the subscription's saved card. */
export function attemptInvoice(ctx: AccountContext, invoice: Invoice): CardDecline | null {
  const { state, now, emit, find } = ctx;
  const subscription = find(state.subscriptions, invoice.parent.subscription_details.subscription, 'subscription');
  const customer = state.customers[subscription.customer];
  const methodId = subscription.default_payment_method ?? customer?.invoice_settings.default_payment_method;
  const method = methodId ? state.paymentMethods[methodId] : undefined;
  invoice.attempt_count += 1;
  invoice.attempted = true;
  if (!method) {
    invoice.next_payment_attempt = null;
    emit('invoice.payment_failed', invoice);
    setSubscriptionStatus(ctx, subscription, 'past_due');
    return { code: 'payment_method_missing', message: 'The customer has no saved card to charge.' };
  }
  const { intent, decline } = charge(ctx, invoice.amount_due, invoice.currency, method, subscription.customer, {});
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
    setSubscriptionStatus(ctx, subscription, 'past_due');
    return decline;
  }
  invoice.status = 'paid';
  invoice.amount_paid = invoice.amount_due;
  invoice.amount_remaining = 0;
  invoice.next_payment_attempt = null;
  invoice.status_transitions.paid_at = now();
  emit('invoice.paid', invoice);
  setSubscriptionStatus(ctx, subscription, 'active');
  return null;
}

export function invoiceApi(ctx: AccountContext) {
  const { store, state, find } = ctx;
  return {
    payInvoice(id: string): Invoice {
      const invoice = find(state.invoices, id, 'invoice', 'invoice');
      if (invoice.status !== 'open')
        throw StripeApiError.invalid(`Invoice is ${invoice.status}; only an open invoice can be paid.`, undefined, `invoice_not_open`);
      const decline = attemptInvoice(ctx, invoice);
      store.changed();
      if (decline) throw StripeApiError.card(decline.code, decline.message, decline.declineCode);
      return invoice;
    },
  };
}
