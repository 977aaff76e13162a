import { Router } from 'express';
import { z } from 'zod';
import { isoDate } from '@shared/schemas/dates';
import { rotationPickSchema, rotationQuerySchema, type RotationPickResponse, type RotationResponse } from '@shared/schemas/rotation';
import { requireRole } from '../../middleware/require-role';
import type { RotationService } from './rotation.service';

const dayParams = z.object({ date: isoDate('roast date') });

/** The Roaster's Rotation in the Roastery (staff): `/api/roastery/rotation` and `…/rotation/:date`. */
export function rotationRoutes(service: RotationService): Router {
  const router = Router();
  router.use(requireRole('staff', 'owner'));

  router.get('/', async (req, res) => {
    res.json((await service.days(rotationQuerySchema.parse(req.query))) satisfies RotationResponse);
  });

  router.put('/:date', async (req, res) => {
    const { date } = dayParams.parse(req.params);
    res.json((await service.pick(req.user!, date, rotationPickSchema.parse(req.body), { ip: req.ip })) satisfies RotationPickResponse);
  });

  return router;
}
