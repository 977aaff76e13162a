import { Router } from 'express';
import { z } from 'zod';
import { packDayParamsSchema, refundOrderBodySchema, refundRequestHeadersSchema, shipOrderBodySchema, type PackListResponse, type PackOrder, type RefundResponse } from '@shared/schemas/packing';
import { requireRole } from '../../middleware/require-role';
import type { PackingService } from './packing.service';
import type { RefundsService } from './refunds.service';

const orderParams = z.object({ id: z.uuid('No such order.') });

/**
 * The Pack List, its labels, and the order actions of packing and shipping (staff) and refunds
 * (owner). Mounted on `/api` itself, beside the orders routes, so each route carries its own guard.
 */
export function packingRoutes(packing: PackingService, refunds: RefundsService): Router {
  const router = Router();
  const staff = requireRole('staff', 'owner');

  router.get('/roastery/days/:date/pack-list', staff, async (req, res) => {
    const { date } = packDayParamsSchema.parse(req.params);
    res.json((await packing.packList(date)) satisfies PackListResponse);
  });

  router.get('/roastery/days/:date/labels.pdf', staff, async (req, res) => {
    const { date } = packDayParamsSchema.parse(req.params);
    const pdf = await packing.labelsPdf(date);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="restday-labels-${date}.pdf"`);
    res.setHeader('Cache-Control', 'no-store');
    res.send(pdf);
  });

  router.post('/orders/:id/pack', staff, async (req, res) => {
    const { id } = orderParams.parse(req.params);
    res.json((await packing.pack(id)) satisfies PackOrder);
  });

  router.post('/orders/:id/ship', staff, async (req, res) => {
    const { id } = orderParams.parse(req.params);
    res.json((await packing.ship(id, shipOrderBodySchema.parse(req.body))) satisfies PackOrder);
  });

  router.post('/orders/:id/refund', requireRole('owner'), async (req, res) => {
    const { id } = orderParams.parse(req.params);
    const body = refundOrderBodySchema.parse(req.body ?? {});
    const requestKey = refundRequestHeadersSchema.parse(req.headers)['idempotency-key'];
    res.status(202).json((await refunds.refund(id, body, req.user!.id, requestKey)) satisfies RefundResponse);
  });

  return router;
}
