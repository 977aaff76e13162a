import { Router } from 'express';
import type { TodayResponse } from '@shared/schemas/today';
import { requireRole } from '../../middleware/require-role';
import type { TodayService } from './today.service';

const staffOnly = requireRole('staff', 'owner');

/** The Roastery's Today, mounted on `/api/roastery` beside the other Roastery routers (each route carries its own guard). */
export function todayRoutes(service: TodayService): Router {
  const router = Router();
  router.get('/today', staffOnly, async (_req, res) => {
    res.set('Cache-Control', 'no-store').json((await service.today()) satisfies TodayResponse);
  });
  return router;
}
