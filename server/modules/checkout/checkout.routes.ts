import { Router } from 'express';
import { z } from 'zod';
import { checkoutRequestHeadersSchema, greenCheckoutRequestSchema, type CheckoutUrlResponse, type GreenCheckoutResponse } from '@shared/schemas/checkout';
import { requireUser } from '../../middleware/require-role';
import type { CheckoutService } from './checkout.service';

/** `/api/checkout`: buying, for signed-in accounts. */
export function checkoutRoutes(service: CheckoutService): Router {
  const router = Router();
  router.use(requireUser);

  router.post('/green', async (req, res) => {
    const checkoutKey = checkoutRequestHeadersSchema.parse(req.headers)['idempotency-key'];
    const started = await service.checkoutGreen(req.user!, greenCheckoutRequestSchema.parse(req.body), checkoutKey);
    res.status(201).json(started satisfies GreenCheckoutResponse);
  });

  return router;
}

const orderParams = z.object({ id: z.uuid('No such order.') });

/**
 * A customer's own order left awaiting payment: pay it now or discard it. Mounted at `/api/orders`
 * beside the orders module's own routes, so each route carries its own guard.
 */
export function unpaidOrderRoutes(service: CheckoutService): Router {
  const router = Router();

  router.post('/:id/pay', requireUser, async (req, res) => {
    const { id } = orderParams.parse(req.params);
    res.json((await service.resumePayment(req.user!, id)) satisfies CheckoutUrlResponse);
  });

  router.post('/:id/discard', requireUser, async (req, res) => {
    const { id } = orderParams.parse(req.params);
    await service.discard(req.user!, id);
    res.status(204).end();
  });

  return router;
}
