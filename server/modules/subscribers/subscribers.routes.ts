import { Router } from 'express';
import { z } from 'zod';
import { subscriberListQuerySchema, type SubscriberDetail, type SubscriberListResponse } from '@shared/schemas/subscribers';
import { requireRole } from '../../middleware/require-role';
import type { SubscribersService } from './subscribers.service';

const subscriberParams = z.object({ id: z.uuid('No such subscription.') });

/**
 * Subscribers in the Roastery (staff): `/api/roastery/subscribers`, `…/subscribers.csv` and
 * `…/subscribers/:id`. Mounted on `/api/roastery` (the CSV path is not under `/subscribers/`).
 */
export function subscribersRoutes(service: SubscribersService): Router {
  const router = Router();
  const staff = requireRole('staff', 'owner');

  router.get('/subscribers', staff, async (req, res) => {
    res.json((await service.list(subscriberListQuerySchema.parse(req.query))) satisfies SubscriberListResponse);
  });

  router.get('/subscribers.csv', staff, async (req, res) => {
    const csv = await service.csv(subscriberListQuerySchema.parse(req.query));
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', 'attachment; filename="restday-subscribers.csv"');
    res.setHeader('Cache-Control', 'no-store');
    res.send(csv);
  });

  router.get('/subscribers/:id', staff, async (req, res) => {
    const { id } = subscriberParams.parse(req.params);
    res.json((await service.get(id)) satisfies SubscriberDetail);
  });

  return router;
}
