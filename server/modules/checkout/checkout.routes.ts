import { Router } from 'express';
import { checkoutRequestHeadersSchema, greenCheckoutRequestSchema, type GreenCheckoutResponse } from '@shared/schemas/checkout';
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
