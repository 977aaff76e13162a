import Stripe from 'stripe';
import type { Config } from '../config';
import { AppError } from '../lib/app-error';

/** Webhooks older than this are refused, so a captured request cannot be replayed later (stripe-node's default). */
export const webhookToleranceSeconds = 300;

export type PaymentsConfig = Pick<Config, 'STRIPE_SECRET_KEY' | 'STRIPE_WEBHOOK_SECRET' | 'STRIPE_API_URL'>;

/**
 * How long a call to Stripe may take. A request someone is waiting on (checkout, a refund, a webhook)
 * gives up within about 4.5 s (two tries of 2 s and the SDK's ~0.5 s backoff) and answers 503, so a
 * slow or unreachable Stripe never holds a request for the SDK's default 3 × 10 s; jobs, which
 * nobody waits on and which retry anyway, keep the patient policy.
 */
export const stripeCallPolicies = {
  request: { timeout: 2_000, maxNetworkRetries: 1 },
  job: { timeout: 10_000, maxNetworkRetries: 2 },
} as const;
export type StripeCallPolicy = keyof typeof stripeCallPolicies;

/**
 * The real Stripe SDK. With STRIPE_API_URL set (development and tests) it talks to that server, the
 * local payment fake; unset, to Stripe itself. Nothing else differs between the two.
 */
export function createStripeClient(config: Pick<Config, 'STRIPE_SECRET_KEY' | 'STRIPE_API_URL'>, policy: StripeCallPolicy = 'job'): Stripe {
  const api = config.STRIPE_API_URL ? new URL(config.STRIPE_API_URL) : undefined;
  const protocol = api?.protocol === 'http:' ? 'http' : 'https';
  return new Stripe(config.STRIPE_SECRET_KEY, {
    ...(api ? { host: api.hostname, port: api.port || (protocol === 'http' ? 80 : 443), protocol } : {}),
    // POSTs carry an Idempotency-Key, so the SDK's own retries never repeat a side effect.
    ...stripeCallPolicies[policy],
    telemetry: false,
    appInfo: { name: 'Restday' },
  });
}

/**
 * Stripe could not be reached, timed out, failed on its side or asked us to slow down: the request
 * may succeed if tried again later, so it answers 503 `payments_unavailable`, never a 500.
 */
export function isPaymentsUnavailable(error: unknown): boolean {
  return (
    error instanceof Stripe.errors.StripeConnectionError ||
    error instanceof Stripe.errors.StripeAPIError ||
    error instanceof Stripe.errors.StripeRateLimitError ||
    error instanceof Stripe.errors.StripeIdempotencyError
  );
}

/** What Restday asks of Stripe; payments.service and the later checkout and subscription steps use it. */
export interface PaymentsGateway {
  stripe: Stripe;
  createCheckoutSession(params: Stripe.Checkout.SessionCreateParams, idempotencyKey: string): Promise<Stripe.Checkout.Session>;
  retrieveCheckoutSession(id: string): Promise<Stripe.Checkout.Session>;
  retrieveSubscription(id: string): Promise<Stripe.Subscription>;
  retrieveInvoice(id: string): Promise<Stripe.Invoice>;
  retrieveCharge(id: string): Promise<Stripe.Charge>;
  retrievePaymentIntent(id: string): Promise<Stripe.PaymentIntent>;
  /** Checks the Stripe-Signature header against the raw body; a bad or stale signature is a 400. */
  verifyWebhook(rawBody: Buffer, signature: string | undefined): Stripe.Event;
}

export function createPaymentsGateway(config: PaymentsConfig, policy: StripeCallPolicy = 'job'): PaymentsGateway {
  const stripe = createStripeClient(config, policy);
  return {
    stripe,
    createCheckoutSession: (params, idempotencyKey) => stripe.checkout.sessions.create(params, { idempotencyKey }),
    retrieveCheckoutSession: (id) => stripe.checkout.sessions.retrieve(id),
    retrieveSubscription: (id) => stripe.subscriptions.retrieve(id),
    retrieveInvoice: (id) => stripe.invoices.retrieve(id),
    retrieveCharge: (id) => stripe.charges.retrieve(id),
    retrievePaymentIntent: (id) => stripe.paymentIntents.retrieve(id),
    verifyWebhook(rawBody, signature) {
      if (!Buffer.isBuffer(rawBody) || rawBody.length === 0) {
        throw new AppError(400, 'invalid_webhook', 'The webhook has no JSON body.');
      }
      try {
        return stripe.webhooks.constructEvent(rawBody, signature ?? '', config.STRIPE_WEBHOOK_SECRET, webhookToleranceSeconds);
      } catch (error) {
        if (error instanceof Stripe.errors.StripeSignatureVerificationError) {
          throw new AppError(400, 'invalid_signature', 'The webhook signature does not match, or it is too old.');
        }
        throw new AppError(400, 'invalid_webhook', 'The webhook body is not a Stripe event.');
      }
    },
  };
}
