import { Router } from 'express';
import { z } from 'zod';
import { orderListQuerySchema, type OrderDetail, type OrderListResponse } from '@shared/schemas/orders';
import { refundOrderBodySchema, refundRequestHeadersSchema, type RefundResponse } from '@shared/schemas/packing';
import { sendDownload } from '../../lib/download';
import { requireRole, requireUser } from '../../middleware/require-role';
import type { OrdersService } from './orders.service';
import type { RefundsService } from './refunds.service';

const orderParams = z.object({ id: z.uuid('No such order.') });

/**
 * Orders at `/api/orders`: a customer's own, every order for staff, and the owner's refunds. Other
 * modules mount order actions at the same path (packing, trace), so each route carries its own guard.
 */
export function ordersRoutes(orders: OrdersService, refunds: RefundsService): Router {
  const router = Router();

  router.get('/', requireUser, async (req, res) => {
    res.json((await orders.list(req.user!, orderListQuerySchema.parse(req.query))) satisfies OrderListResponse);
  });

  router.get('/:id', requireUser, async (req, res) => {
    const { id } = orderParams.parse(req.params);
    res.json((await orders.get(req.user!, id)) satisfies OrderDetail);
  });

  router.post('/:id/refund', requireRole('owner'), async (req, res) => {
    const { id } = orderParams.parse(req.params);
    const body = refundOrderBodySchema.parse(req.body ?? {});
    const requestKey = refundRequestHeadersSchema.parse(req.headers)['idempotency-key'];
    res.status(202).json((await refunds.refund(id, body, req.user!.id, requestKey)) satisfies RefundResponse);
  });

  return router;
}

/** The orders list as a CSV file (staff), mounted at `/api/orders.csv` (a sibling of `/orders`, not under it). */
export function ordersCsvRoutes(orders: OrdersService): Router {
  const router = Router();
  router.get('/', requireRole('staff', 'owner'), async (req, res) => {
    sendDownload(res, 'restday-orders.csv', await orders.csv(req.user!, orderListQuerySchema.parse(req.query)));
  });
  return router;
}
