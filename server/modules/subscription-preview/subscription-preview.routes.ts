import { Router } from 'express';
import { subscriptionPreviewQuerySchema, type SubscriptionPreview } from '@shared/schemas/subscription-preview';
import type { SubscriptionPreviewService } from './subscription-preview.service';

/**
 * The Roasted to Order builder's live price and first deliveries (public), mounted at
 * `/api/subscriptions/preview` ahead of the subscriptions router, so "preview" is never read as an id.
 */
export function subscriptionPreviewRoutes(service: SubscriptionPreviewService): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json((await service.preview(subscriptionPreviewQuerySchema.parse(req.query))) satisfies SubscriptionPreview);
  });
  return router;
}
