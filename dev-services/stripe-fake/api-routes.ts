// Stripe's REST API (`/v1/…`), the part Restday uses, over the fake account.
import { createHash } from 'node:crypto';
import express, { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import { parseParams, stripeErrorHandler, StripeApiError } from './api-error';
import { emptyList, type FakeAccount } from './fake-account';
import {
  checkoutSessionCreateParams,
  customerCreateParams,
  expandOnlyParams,
  expandParam,
  formArray,
  formInt,
  refundCreateParams,
  subscriptionCancelParams,
  subscriptionUpdateParams,
} from './params';
import type { FakeState, Store } from './store';

const idempotencyKeyLifetimeMs = 24 * 60 * 60 * 1000;

const listShape = {
  limit: formInt(1).pipe(z.number().max(100)).optional(),
  starting_after: z.string().optional(),
  ending_before: z.string().optional(),
  expand: expandParam,
};

/** Stripe answers 401 without a secret key; the fake takes any test-mode key. */
const requireTestKey: RequestHandler = (req, res, next) => {
  const key = /^Bearer (.+)$/.exec(req.get('Authorization') ?? '')?.[1];
  if (key?.startsWith('sk_test_')) return next();
  res.status(401).json({
    error: {
      type: 'invalid_request_error',
      message: key ? 'Invalid API Key provided: the local payment fake takes test keys (sk_test_…) only.' : 'You did not provide an API key.',
    },
  });
};

function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value && typeof value === 'object') {
    const entries = Object.entries(value).sort(([a], [b]) => a.localeCompare(b));
    return `{${entries.map(([key, entry]) => `${JSON.stringify(key)}:${canonicalJson(entry)}`).join(',')}}`;
  }
  return JSON.stringify(value ?? null);
}

/**
 * Idempotency-Key on POST: the first response is saved and replayed for the same key; the same key
 * with other parameters is an idempotency_error, as is reuse while the first request still runs.
 */
function honourIdempotencyKeys(store: Store): RequestHandler {
  const running = new Set<string>();
  return (req, res, next) => {
    const key = req.get('Idempotency-Key');
    if (req.method !== 'POST' || !key) return next();
    const state = store.state;
    const cutoff = Date.now() - idempotencyKeyLifetimeMs;
    for (const [storedKey, stored] of Object.entries(state.idempotency)) if (stored.createdAt < cutoff) delete state.idempotency[storedKey];

    const fingerprint = createHash('sha256')
      .update(`${req.method} ${req.path} ${canonicalJson(req.body)}`)
      .digest('hex');
    const stored = state.idempotency[key];
    if (stored) {
      if (stored.fingerprint !== fingerprint) {
        res.status(400).json({
          error: {
            type: 'idempotency_error',
            message: `Keys for idempotent requests can only be used with the same parameters they were first used with. Try a key other than '${key}' for a different request.`,
          },
        });
        return;
      }
      res.setHeader('Idempotent-Replayed', 'true');
      res.status(stored.status).json(stored.body);
      return;
    }
    if (running.has(key)) {
      res
        .status(409)
        .json({ error: { type: 'idempotency_error', message: 'Another request with this Idempotency-Key is still in progress. Try again shortly.' } });
      return;
    }
    running.add(key);
    res.on('close', () => running.delete(key));
    const send = res.json.bind(res);
    res.json = (body: unknown) => {
      // Requests that fail validation never ran, so Stripe keeps no result for them; the rest are replayed.
      if (res.statusCode < 400 || res.statusCode === 402 || res.statusCode >= 500) {
        state.idempotency[key] = { fingerprint, status: res.statusCode, body, createdAt: Date.now() };
        store.changed();
      }
      return send(body);
    };
    next();
  };
}

const collectionsByPrefix: [string, keyof FakeState][] = [
  ['cus_', 'customers'],
  ['cs_', 'sessions'],
  ['pi_', 'paymentIntents'],
  ['ch_', 'charges'],
  ['re_', 'refunds'],
  ['sub_', 'subscriptions'],
  ['in_', 'invoices'],
  ['pm_', 'paymentMethods'],
  ['prod_', 'products'],
  ['price_', 'prices'],
];

function lookup(state: FakeState, id: string): unknown {
  const collection = collectionsByPrefix.find(([prefix]) => id.startsWith(prefix))?.[1];
  return collection ? (state[collection] as Record<string, unknown>)[id] : undefined;
}

/** `expand[]=customer` or `expand[]=data.latest_charge`: ids on the path become their objects. */
function expandInto(state: FakeState, target: unknown, parts: string[]): void {
  if (Array.isArray(target)) {
    for (const entry of target) expandInto(state, entry, parts);
    return;
  }
  const [head, ...rest] = parts;
  if (!head || !target || typeof target !== 'object') return;
  const record = target as Record<string, unknown>;
  if (rest.length > 0) return expandInto(state, record[head], rest);
  const value = record[head];
  if (typeof value === 'string') {
    const found = lookup(state, value);
    if (found) record[head] = structuredClone(found);
  }
}

function withExpansions<T>(state: FakeState, object: T, paths: string[] | undefined, extra?: (copy: T, path: string) => boolean): T {
  if (!paths?.length) return object;
  const copy = structuredClone(object);
  for (const path of paths) {
    if (extra?.(copy, path)) continue;
    expandInto(state, copy, path.split('.'));
  }
  return copy;
}

function listOf<T extends { id: string }>(items: T[], params: { limit?: number; starting_after?: string; ending_before?: string }, url: string) {
  // Newest first, as Stripe lists.
  let ordered = [...items].reverse();
  if (params.starting_after) ordered = ordered.slice(ordered.findIndex((item) => item.id === params.starting_after) + 1);
  if (params.ending_before)
    ordered = ordered.slice(
      0,
      Math.max(
        0,
        ordered.findIndex((item) => item.id === params.ending_before),
      ),
    );
  const limit = params.limit ?? 10;
  return { ...emptyList(url, ordered.slice(0, limit)), has_more: ordered.length > limit };
}

export function stripeApiRoutes(store: Store, account: FakeAccount): Router {
  const state = store.state;
  const router = Router();
  router.use(requireTestKey);
  router.use(express.urlencoded({ extended: true, limit: '1mb' }));
  router.use(honourIdempotencyKeys(store));

  const withLineItems = (session: ReturnType<FakeAccount['retrieveCheckoutSession']>, path: string) => {
    if (path !== 'line_items') return false;
    (session as { line_items?: unknown }).line_items = emptyList(`/v1/checkout/sessions/${session.id}/line_items`, account.lineItemsOf(session.id));
    return true;
  };

  router.post('/customers', (req, res) => {
    const params = parseParams(customerCreateParams, req.body);
    res.json(account.createCustomer(params));
  });
  router.get('/customers/:id', (req, res) => {
    const { expand } = parseParams(expandOnlyParams, req.query);
    const customer = state.customers[req.params.id];
    if (!customer) throw StripeApiError.missing('customer', req.params.id);
    res.json(withExpansions(state, customer, expand));
  });
  router.post('/customers/:id', (req, res) => {
    res.json(account.updateCustomer(req.params.id, parseParams(customerCreateParams, req.body)));
  });

  router.post('/checkout/sessions', (req, res) => {
    const params = parseParams(checkoutSessionCreateParams, req.body);
    res.json(withExpansions(state, account.createCheckoutSession(params), params.expand, withLineItems));
  });
  router.get('/checkout/sessions', (req, res) => {
    const params = parseParams(
      z.strictObject({
        ...listShape,
        customer: z.string().optional(),
        payment_intent: z.string().optional(),
        subscription: z.string().optional(),
        status: z.enum(['open', 'complete', 'expired']).optional(),
      }),
      req.query,
    );
    const sessions = Object.keys(state.sessions)
      .map((id) => account.retrieveCheckoutSession(id))
      .filter(
        (session) =>
          (!params.customer || session.customer === params.customer) &&
          (!params.payment_intent || session.payment_intent === params.payment_intent) &&
          (!params.subscription || session.subscription === params.subscription) &&
          (!params.status || session.status === params.status),
      );
    res.json(withExpansions(state, listOf(sessions, params, '/v1/checkout/sessions'), params.expand));
  });
  router.get('/checkout/sessions/:id', (req, res) => {
    const { expand } = parseParams(expandOnlyParams, req.query);
    res.json(withExpansions(state, account.retrieveCheckoutSession(req.params.id), expand, withLineItems));
  });
  router.get('/checkout/sessions/:id/line_items', (req, res) => {
    const params = parseParams(z.strictObject(listShape), req.query);
    res.json(listOf([...account.lineItemsOf(req.params.id)].reverse(), params, `/v1/checkout/sessions/${req.params.id}/line_items`));
  });
  router.post('/checkout/sessions/:id/expire', (req, res) => {
    const { expand } = parseParams(expandOnlyParams, req.body);
    res.json(withExpansions(state, account.expireCheckoutSession(req.params.id), expand, withLineItems));
  });

  router.get('/subscriptions', (req, res) => {
    const params = parseParams(z.strictObject({ ...listShape, customer: z.string().optional(), status: z.string().optional() }), req.query);
    const subscriptions = Object.values(state.subscriptions).filter(
      (subscription) =>
        (!params.customer || subscription.customer === params.customer) &&
        // Stripe lists all but canceled subscriptions unless asked for a status.
        (params.status === 'all' || (params.status ? subscription.status === params.status : subscription.status !== 'canceled')),
    );
    res.json(withExpansions(state, listOf(subscriptions, params, '/v1/subscriptions'), params.expand));
  });
  router.get('/subscriptions/:id', (req, res) => {
    const { expand } = parseParams(expandOnlyParams, req.query);
    const subscription = state.subscriptions[req.params.id];
    if (!subscription) throw StripeApiError.missing('subscription', req.params.id);
    res.json(withExpansions(state, subscription, expand));
  });
  router.post('/subscriptions/:id', (req, res) => {
    const params = parseParams(subscriptionUpdateParams, req.body);
    res.json(withExpansions(state, account.updateSubscription(req.params.id, params), params.expand));
  });
  router.delete('/subscriptions/:id', (req, res) => {
    const { expand } = parseParams(subscriptionCancelParams, { ...req.query, ...(req.body as object) });
    res.json(withExpansions(state, account.cancelSubscription(req.params.id), expand));
  });

  router.get('/invoices', (req, res) => {
    const params = parseParams(
      z.strictObject({
        ...listShape,
        customer: z.string().optional(),
        subscription: z.string().optional(),
        status: z.enum(['open', 'paid', 'void']).optional(),
      }),
      req.query,
    );
    const invoices = Object.values(state.invoices).filter(
      (invoice) =>
        (!params.customer || invoice.customer === params.customer) &&
        (!params.subscription || invoice.parent.subscription_details.subscription === params.subscription) &&
        (!params.status || invoice.status === params.status),
    );
    res.json(withExpansions(state, listOf(invoices, params, '/v1/invoices'), params.expand));
  });
  router.get('/invoices/:id', (req, res) => {
    const { expand } = parseParams(expandOnlyParams, req.query);
    const invoice = state.invoices[req.params.id];
    if (!invoice) throw StripeApiError.missing('invoice', req.params.id, 'invoice');
    res.json(withExpansions(state, invoice, expand));
  });
  router.post('/invoices/:id/pay', (req, res) => {
    const { expand } = parseParams(expandOnlyParams, req.body);
    res.json(withExpansions(state, account.payInvoice(req.params.id), expand));
  });

  const retrieve = (path: string, collection: 'paymentIntents' | 'charges' | 'refunds' | 'products' | 'prices' | 'paymentMethods', kind: string) => {
    router.get(`${path}/:id`, (req, res) => {
      const { expand } = parseParams(expandOnlyParams, req.query);
      const found = state[collection][req.params.id];
      if (!found) throw StripeApiError.missing(kind, req.params.id);
      res.json(withExpansions(state, found, expand));
    });
  };
  retrieve('/payment_intents', 'paymentIntents', 'payment_intent');
  retrieve('/charges', 'charges', 'charge');
  retrieve('/products', 'products', 'product');
  retrieve('/prices', 'prices', 'price');
  retrieve('/payment_methods', 'paymentMethods', 'payment_method');

  router.post('/refunds', (req, res) => {
    const params = parseParams(refundCreateParams, req.body);
    res.json(withExpansions(state, account.createRefund(params), params.expand));
  });
  router.get('/refunds', (req, res) => {
    const params = parseParams(z.strictObject({ ...listShape, charge: z.string().optional(), payment_intent: z.string().optional() }), req.query);
    const refunds = Object.values(state.refunds).filter(
      (refund) => (!params.charge || refund.charge === params.charge) && (!params.payment_intent || refund.payment_intent === params.payment_intent),
    );
    res.json(listOf(refunds, params, '/v1/refunds'));
  });
  retrieve('/refunds', 'refunds', 'refund');

  router.get('/events', (req, res) => {
    const params = parseParams(z.strictObject({ ...listShape, type: z.string().optional(), types: formArray(z.string()).optional() }), req.query);
    const events = Object.values(state.events).filter(
      (event) => (!params.type || event.type === params.type) && (!params.types || params.types.includes(event.type)),
    );
    res.json(listOf(events, params, '/v1/events'));
  });
  router.get('/events/:id', (req, res) => {
    const event = state.events[req.params.id];
    if (!event) throw StripeApiError.missing('event', req.params.id);
    res.json(event);
  });

  router.use((req, _res, next) => {
    next(
      new StripeApiError(404, {
        type: 'invalid_request_error',
        message: `Unrecognized request URL (${req.method}: /v1${req.path}). The local payment fake does not implement it.`,
      }),
    );
  });
  router.use(stripeErrorHandler);
  return router;
}
