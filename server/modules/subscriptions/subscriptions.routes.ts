import { Router } from 'express';
import type { CheckoutUrlResponse } from '@shared/schemas/checkout';
import { z } from 'zod';
import {
  subscriptionCheckoutRequestSchema,
  subscriptionDeliveriesQuerySchema,
  subscriptionDeliveryParamsSchema,
  subscriptionPauseSchema,
  subscriptionSkipSchema,
  subscriptionUpdateSchema,
  type Subscription,
  type SubscriptionChangeResponse,
  type SubscriptionCheckoutResponse,
  type SubscriptionDeliveriesResponse,
  type SubscriptionListResponse,
} from '@shared/schemas/subscriptions';
import { requireUser } from '../../middleware/require-role';
import type { SubscriptionsService } from './subscriptions.service';

const subscriptionParams = z.object({ id: z.uuid('No such subscription.') });

/** `/api/subscriptions`: a subscriber's own subscriptions and their deliveries (someone else's answers 404). */
export function subscriptionsRoutes(service: SubscriptionsService): Router {
  const router = Router();
  router.use(requireUser);

  router.get('/', async (req, res) => {
    res.json({ items: await service.list(req.user!) } satisfies SubscriptionListResponse);
  });

  router.get('/:id', async (req, res) => {
    const { id } = subscriptionParams.parse(req.params);
    res.json((await service.get(req.user!, id)) satisfies Subscription);
  });

  router.get('/:id/deliveries', async (req, res) => {
    const { id } = subscriptionParams.parse(req.params);
    const { count } = subscriptionDeliveriesQuerySchema.parse(req.query);
    res.json({ items: await service.deliveries(req.user!, id, count) } satisfies SubscriptionDeliveriesResponse);
  });

  router.patch('/:id', async (req, res) => {
    const { id } = subscriptionParams.parse(req.params);
    res.json((await service.update(req.user!, id, subscriptionUpdateSchema.parse(req.body))) satisfies SubscriptionChangeResponse);
  });

  router.post('/:id/skip', async (req, res) => {
    const { id } = subscriptionParams.parse(req.params);
    const { roastDate } = subscriptionSkipSchema.parse(req.body ?? {});
    res.json((await service.skip(req.user!, id, roastDate)) satisfies SubscriptionChangeResponse);
  });

  router.post('/:id/deliveries/:date/skip', async (req, res) => {
    const { id, date } = subscriptionDeliveryParamsSchema.parse(req.params);
    res.json((await service.skip(req.user!, id, date)) satisfies SubscriptionChangeResponse);
  });

  router.post('/:id/deliveries/:date/unskip', async (req, res) => {
    const { id, date } = subscriptionDeliveryParamsSchema.parse(req.params);
    res.json((await service.unskip(req.user!, id, date)) satisfies SubscriptionChangeResponse);
  });

  router.post('/:id/pause', async (req, res) => {
    const { id } = subscriptionParams.parse(req.params);
    const { until, paidDelivery } = subscriptionPauseSchema.parse(req.body);
    res.json((await service.pause(req.user!, id, until, paidDelivery)) satisfies SubscriptionChangeResponse);
  });

  router.post('/:id/resume', async (req, res) => {
    const { id } = subscriptionParams.parse(req.params);
    res.json((await service.resume(req.user!, id)) satisfies SubscriptionChangeResponse);
  });

  router.post('/:id/cancel', async (req, res) => {
    const { id } = subscriptionParams.parse(req.params);
    res.json((await service.cancel(req.user!, id)) satisfies SubscriptionChangeResponse);
  });

  router.post('/:id/pay', async (req, res) => {
    const { id } = subscriptionParams.parse(req.params);
    res.json((await service.resumePayment(req.user!, id)) satisfies CheckoutUrlResponse);
  });

  router.post('/:id/discard', async (req, res) => {
    const { id } = subscriptionParams.parse(req.params);
    await service.discard(req.user!, id);
    res.status(204).end();
  });

  return router;
}

/** Roasted to Order's checkout for signed-in accounts, mounted at `/api/checkout/subscription`. */
export function subscriptionCheckoutRoutes(service: SubscriptionsService): Router {
  const router = Router();
  router.post('/', requireUser, async (req, res) => {
    const started = await service.startCheckout(req.user!, subscriptionCheckoutRequestSchema.parse(req.body));
    res.status(201).json(started satisfies SubscriptionCheckoutResponse);
  });
  return router;
}
