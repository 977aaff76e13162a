import { Router } from 'express';
import { subscriptionPreviewQuerySchema, type SubscriptionPreview } from '@shared/schemas/subscription-preview';
import type { SubscriptionPreviewService } from './subscription-preview.service';

/**
 * `GET /api/subscriptions/preview` (public): the Roasted to Order builder's live price and first
 * deliveries. Mounted on `/subscriptions` before the subscriptions router, so "preview" is never read as an id.
 */
export function subscriptionPreviewRoutes(service: SubscriptionPreviewService): Router {
  const router = Router();
  router.get('/preview', async (req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json((await service.preview(subscriptionPreviewQuerySchema.parse(req.query))) satisfies SubscriptionPreview);
  });
  return router;
}
