import { Router } from 'express';
import { z } from 'zod';
import type { BatchTrace, OrderTrace } from '@shared/schemas/packing';
import { requireRole } from '../../middleware/require-role';
import type { TraceService } from './trace.service';

const orderParams = z.object({ id: z.uuid('No such order.') });
const batchParams = z.object({ id: z.uuid('No such batch.') });

const staff = requireRole('staff', 'owner');

/** Where an order's coffee came from (staff), mounted at `/api/orders` beside the orders module's routes. */
export function orderTraceRoutes(service: TraceService): Router {
  const router = Router();
  router.get('/:id/trace', staff, async (req, res) => {
    const { id } = orderParams.parse(req.params);
    res.json((await service.order(id)) satisfies OrderTrace);
  });
  return router;
}

/** Where a batch's coffee went (staff), mounted at `/api/roastery/batches`. */
export function batchTraceRoutes(service: TraceService): Router {
  const router = Router();
  router.get('/:id/trace', staff, async (req, res) => {
    const { id } = batchParams.parse(req.params);
    res.json((await service.batch(id)) satisfies BatchTrace);
  });
  return router;
}
