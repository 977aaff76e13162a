// The fake's own control API (JSON, not part of Stripe's): move its clock so subscriptions renew,
// change a customer's test card, point and pause webhook delivery, and send an event again.
import express, { Router } from 'express';
import { z } from 'zod';
import { parseParams, stripeErrorHandler, StripeApiError } from './api-error';
import type { FakeAccount } from './fake-account';
import type { Store } from './store';
import type { WebhookSender } from './webhook-sender';

export const advanceClockBody = z
  .strictObject({ days: z.number().int().min(0).max(3650).optional(), seconds: z.number().int().min(0).max(315_360_000).optional() })
  .refine((body) => body.days !== undefined || body.seconds !== undefined, 'give days or seconds');

export const webhookEndpointBody = z.strictObject({ url: z.url({ protocol: /^https?$/ }).nullable() });

export const customerCardBody = z.strictObject({ number: z.string().min(1).max(30) });

export function controlRoutes(store: Store, account: FakeAccount, sender: WebhookSender): Router {
  const state = store.state;
  const router = Router();
  router.use(express.json({ limit: '10kb' }));

  router.get('/clock', (_req, res) => {
    res.json({ now: account.now() });
  });

  router.post('/clock', (req, res) => {
    const body = parseParams(advanceClockBody, req.body);
    res.json(account.advanceClock((body.days ?? 0) * 86_400 + (body.seconds ?? 0)));
  });

  router.put('/webhook-endpoint', (req, res) => {
    const { url } = parseParams(webhookEndpointBody, req.body);
    sender.setEndpoint(url);
    res.json({ url });
  });

  router.post('/webhooks/pause', (_req, res) => {
    sender.pause();
    res.json({ paused: true });
  });

  router.post('/webhooks/resume', (_req, res) => {
    sender.resume();
    res.json({ paused: false });
  });

  router.get('/deliveries', (req, res) => {
    const { type } = parseParams(z.object({ type: z.string().optional() }), req.query);
    const items = Object.values(state.deliveries)
      .map((delivery) => {
        const event = state.events[delivery.eventId];
        return { ...delivery, type: event?.type ?? 'unknown', objectId: event?.data.object.id ?? null, created: event?.created ?? 0 };
      })
      .filter((delivery) => !type || delivery.type === type);
    res.json({ items });
  });

  router.post('/events/:id/deliver', async (req, res) => {
    if (!state.events[req.params.id]) throw StripeApiError.missing('event', req.params.id);
    res.json(await sender.deliverNow(req.params.id));
  });

  router.post('/customers/:id/card', (req, res) => {
    const { number } = parseParams(customerCardBody, req.body);
    const nextYear = new Date().getUTCFullYear() + 1;
    const method = account.setCustomerCard(req.params.id, { number, expMonth: 12, expYear: nextYear, cvc: '123' });
    res.json({ paymentMethod: method.id, brand: method.card.brand, last4: method.card.last4 });
  });

  router.use(stripeErrorHandler);
  return router;
}
