import { Router } from 'express';
import { z } from 'zod';
import type { BatchTrace, OrderTrace } from '@shared/schemas/packing';
import { requireRole } from '../../middleware/require-role';
import type { TraceService } from './trace.service';

const orderParams = z.object({ id: z.uuid('No such order.') });
const batchParams = z.object({ id: z.uuid('No such batch.') });

/** Recall reads for staff. Mounted on `/api` itself: one path is under orders, the other under batches. */
export function traceRoutes(service: TraceService): Router {
  const router = Router();
  const staff = requireRole('staff', 'owner');

  router.get('/orders/:id/trace', staff, async (req, res) => {
    const { id } = orderParams.parse(req.params);
    res.json((await service.order(id)) satisfies OrderTrace);
  });

  router.get('/roastery/batches/:id/trace', staff, async (req, res) => {
    const { id } = batchParams.parse(req.params);
    res.json((await service.batch(id)) satisfies BatchTrace);
  });

  return router;
}
