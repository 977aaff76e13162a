import { Router } from 'express';
import type { AppDeps } from '../../app-deps';

export function healthRoutes({ database, queue }: Pick<AppDeps, 'database' | 'queue'>): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    const [dbUp, queueState] = await Promise.all([database.ping(), queue ? queue.state() : Promise.resolve('stopped' as const)]);
    // A process started without a queue (an API-only test app) is healthy on its database alone.
    const ok = dbUp && queueState !== 'down';
    res.status(ok ? 200 : 503).json({ ok, db: dbUp ? 'up' : 'down', queue: queueState });
  });
  return router;
}
