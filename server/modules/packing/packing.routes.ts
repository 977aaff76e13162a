import { Router } from 'express';
import { z } from 'zod';
import {
  bulkShipBodySchema,
  labelsPdfQuerySchema,
  packDayParamsSchema,
  shipOrderBodySchema,
  type PackListResponse,
  type PackOrder,
} from '@shared/schemas/packing';
import { sendDownload } from '../../lib/download';
import { packingRoles, requireRole } from '../../middleware/require-role';
import type { PackingService } from './packing.service';

const orderParams = z.object({ id: z.uuid('No such order.') });

const packers = requireRole(...packingRoles);

/**
 * A roast day's Pack List and its labels (packers, staff and the owner), mounted at `/api/roastery/days` beside the Roast
 * List's routes, so each route carries its own guard.
 */
export function packDayRoutes(packing: PackingService): Router {
  const router = Router();

  router.get('/:date/pack-list', packers, async (req, res) => {
    const { date } = packDayParamsSchema.parse(req.params);
    res.json((await packing.packList(date)) satisfies PackListResponse);
  });

  router.post('/:date/ship', packers, async (req, res) => {
    const { date } = packDayParamsSchema.parse(req.params);
    res.json((await packing.shipDay(date, bulkShipBodySchema.parse(req.body))) satisfies PackListResponse);
  });

  router.get('/:date/labels.pdf', packers, async (req, res) => {
    const { date } = packDayParamsSchema.parse(req.params);
    const { stock } = labelsPdfQuerySchema.parse(req.query);
    sendDownload(res, `restday-labels-${date}${stock === 'single' ? '' : `-${stock}`}.pdf`, await packing.labelsPdf(date, stock));
  });

  return router;
}

/**
 * Packing and shipping an order (packers, staff and the owner), mounted at `/api/orders` beside the orders module's own
 * routes, so each route carries its own guard.
 */
export function packOrderRoutes(packing: PackingService): Router {
  const router = Router();

  router.post('/:id/pack', packers, async (req, res) => {
    const { id } = orderParams.parse(req.params);
    res.json((await packing.pack(id)) satisfies PackOrder);
  });

  router.post('/:id/ship', packers, async (req, res) => {
    const { id } = orderParams.parse(req.params);
    res.json((await packing.ship(id, shipOrderBodySchema.parse(req.body))) satisfies PackOrder);
  });

  return router;
}
