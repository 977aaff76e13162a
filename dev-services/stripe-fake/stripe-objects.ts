// The Stripe API objects the fake keeps, in Stripe's own field names and shapes (the subset Restday
// reads). Timestamps are Unix seconds on the fake's clock; amounts are integer minor units.

export type Metadata = Record<string, string>;

export interface ApiList<T> {
  object: 'list';
  data: T[];
  has_more: boolean;
  url: string;
}

export type RecurringInterval = 'day' | 'week' | 'month' | 'year';

export interface Recurring {
  interval: RecurringInterval;
  interval_count: number;
}

export interface Product {
  id: string;
  object: 'product';
  active: boolean;
  name: string;
  description: string | null;
  metadata: Metadata;
  created: number;
  livemode: false;
}

export interface Price {
  id: string;
  object: 'price';
  active: boolean;
  currency: string;
  unit_amount: number;
  product: string;
  recurring: Recurring | null;
  type: 'one_time' | 'recurring';
  metadata: Metadata;
  created: number;
  livemode: false;
}

export interface LineItem {
  id: string;
  object: 'item';
  amount_discount: number;
  amount_subtotal: number;
  amount_tax: number;
  amount_total: number;
  currency: string;
  description: string;
  price: Price;
  quantity: number;
}

export interface Customer {
  id: string;
  object: 'customer';
  email: string | null;
  name: string | null;
  metadata: Metadata;
  invoice_settings: { default_payment_method: string | null };
  created: number;
  livemode: false;
}

export interface PaymentMethod {
  id: string;
  object: 'payment_method';
  type: 'card';
  card: { brand: string; last4: string; exp_month: number; exp_year: number };
  customer: string | null;
  created: number;
  livemode: false;
}

export interface PaymentError {
  type: 'card_error';
  code: string;
  decline_code?: string;
  message: string;
}

export interface PaymentIntent {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_received: number;
  currency: string;
  customer: string | null;
  latest_charge: string | null;
  last_payment_error: PaymentError | null;
  metadata: Metadata;
  payment_method: string | null;
  status: 'requires_payment_method' | 'succeeded';
  created: number;
  livemode: false;
}

export interface Charge {
  id: string;
  object: 'charge';
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  captured: boolean;
  currency: string;
  customer: string | null;
  failure_code: string | null;
  failure_message: string | null;
  metadata: Metadata;
  paid: boolean;
  payment_intent: string;
  payment_method: string;
  refunded: boolean;
  status: 'succeeded' | 'failed';
  created: number;
  livemode: false;
}

export interface Refund {
  id: string;
  object: 'refund';
  amount: number;
  charge: string;
  currency: string;
  metadata: Metadata;
  payment_intent: string;
  reason: string | null;
  status: 'succeeded';
  created: number;
}

export interface CheckoutSession {
  id: string;
  object: 'checkout.session';
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  currency: string;
  customer: string | null;
  customer_details: { email: string | null } | null;
  customer_email: string | null;
  expires_at: number;
  invoice: string | null;
  metadata: Metadata;
  mode: 'payment' | 'subscription';
  payment_intent: string | null;
  payment_status: 'paid' | 'unpaid';
  status: 'open' | 'complete' | 'expired';
  subscription: string | null;
  success_url: string;
  url: string | null;
  created: number;
  livemode: false;
}

export interface SubscriptionItem {
  id: string;
  object: 'subscription_item';
  current_period_end: number;
  current_period_start: number;
  metadata: Metadata;
  price: Price;
  quantity: number;
  subscription: string;
  created: number;
}

export type SubscriptionStatus = 'active' | 'trialing' | 'past_due' | 'unpaid' | 'canceled' | 'incomplete';

export interface PauseCollection {
  behavior: 'keep_as_draft' | 'mark_uncollectible' | 'void';
  resumes_at: number | null;
}

export interface Subscription {
  id: string;
  object: 'subscription';
  billing_cycle_anchor: number;
  cancel_at: number | null;
  cancel_at_period_end: boolean;
  canceled_at: number | null;
  collection_method: 'charge_automatically';
  currency: string;
  customer: string;
  default_payment_method: string | null;
  ended_at: number | null;
  items: ApiList<SubscriptionItem>;
  latest_invoice: string | null;
  metadata: Metadata;
  pause_collection: PauseCollection | null;
  start_date: number;
  status: SubscriptionStatus;
  /** Set while a trial (or a charge moved later with `trial_end`) postpones the next invoice. */
  trial_end: number | null;
  trial_start: number | null;
  created: number;
  livemode: false;
}

export interface InvoiceLine {
  id: string;
  object: 'line_item';
  amount: number;
  currency: string;
  description: string;
  period: { start: number; end: number };
  pricing: { type: 'price_details'; price_details: { price: string; product: string }; unit_amount_decimal: string };
  quantity: number;
}

export interface InvoicePayment {
  id: string;
  object: 'invoice_payment';
  amount_paid: number | null;
  amount_requested: number;
  currency: string;
  invoice: string;
  is_default: boolean;
  payment: { type: 'payment_intent'; payment_intent: string };
  status: 'open' | 'paid';
  created: number;
}

export interface Invoice {
  id: string;
  object: 'invoice';
  amount_due: number;
  amount_paid: number;
  amount_remaining: number;
  attempt_count: number;
  attempted: boolean;
  billing_reason: 'subscription_create' | 'subscription_cycle' | 'subscription_update';
  currency: string;
  customer: string;
  lines: ApiList<InvoiceLine>;
  metadata: Metadata;
  next_payment_attempt: number | null;
  parent: {
    type: 'subscription_details';
    quote_details: null;
    subscription_details: { subscription: string; metadata: Metadata };
  };
  payments: ApiList<InvoicePayment>;
  period_end: number;
  period_start: number;
  status: 'open' | 'paid' | 'void';
  status_transitions: { finalized_at: number | null; paid_at: number | null; voided_at: number | null };
  subtotal: number;
  total: number;
  created: number;
  livemode: false;
}

export type StripeObject = Product | Price | Customer | PaymentMethod | PaymentIntent | Charge | Refund | CheckoutSession | Subscription | Invoice;

/** The event types the fake sends: the ones Restday's webhook endpoint subscribes to. */
export const eventTypes = [
  'checkout.session.completed',
  'checkout.session.expired',
  'invoice.paid',
  'invoice.payment_failed',
  'customer.subscription.updated',
  'customer.subscription.deleted',
  'charge.refunded',
] as const;
export type EventType = (typeof eventTypes)[number];

export interface StripeEvent {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: StripeObject; previous_attributes?: Record<string, unknown> };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: EventType;
}
