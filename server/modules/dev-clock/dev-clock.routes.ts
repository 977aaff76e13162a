import { Router } from 'express';
import { devClockBodySchema, type DevClockResponse } from '@shared/schemas/dev-clock';
import type { DevClockService } from './dev-clock.service';

/**
 * `POST /api/dev/clock` {now}: moves the time scheduling and jobs read. Mounted only when the server
 * runs with RESTDAY_TEST_CLOCK on, which config refuses when NODE_ENV=production; open to any
 * caller then (tests and demos), like the rest of a test server.
 */
export function devClockRoutes(service: DevClockService): Router {
  const router = Router();
  router.post('/', async (req, res) => {
    const { now } = devClockBodySchema.parse(req.body);
    const moved = await service.move(new Date(now));
    res.json({ now: moved.now.toISOString(), dueJobs: moved.dueJobs } satisfies DevClockResponse);
  });
  return router;
}
