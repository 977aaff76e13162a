import { Router } from 'express';
import { z } from 'zod';
import { subscriberListQuerySchema, type SubscriberDetail, type SubscriberListResponse } from '@shared/schemas/subscribers';
import { sendDownload } from '../../lib/download';
import { requireRole } from '../../middleware/require-role';
import type { SubscribersService } from './subscribers.service';

const subscriberParams = z.object({ id: z.uuid('No such subscription.') });

const staff = requireRole('staff', 'owner');

/** Subscribers in the Roastery (staff), mounted at `/api/roastery/subscribers`. */
export function subscribersRoutes(service: SubscribersService): Router {
  const router = Router();

  router.get('/', staff, async (req, res) => {
    res.json((await service.list(subscriberListQuerySchema.parse(req.query))) satisfies SubscriberListResponse);
  });

  router.get('/:id', staff, async (req, res) => {
    const { id } = subscriberParams.parse(req.params);
    res.json((await service.get(id)) satisfies SubscriberDetail);
  });

  return router;
}

/** The subscriber list as a CSV file (staff), mounted at `/api/roastery/subscribers.csv` (a sibling of `/subscribers`). */
export function subscribersCsvRoutes(service: SubscribersService): Router {
  const router = Router();
  router.get('/', staff, async (req, res) => {
    sendDownload(res, 'restday-subscribers.csv', await service.csv(subscriberListQuerySchema.parse(req.query)));
  });
  return router;
}
