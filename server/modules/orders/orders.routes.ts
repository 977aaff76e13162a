import { Router } from 'express';
import { z } from 'zod';
import {
  orderAddressCorrectionSchema,
  orderListQuerySchema,
  orderNoteSchema,
  orderResendParamsSchema,
  type OrderDetail,
  type OrderListResponse,
} from '@shared/schemas/orders';
import { refundOrderBodySchema, refundRequestHeadersSchema, type RefundResponse } from '@shared/schemas/packing';
import { sendDownload } from '../../lib/download';
import { packingRoles, requireRole, requireUser } from '../../middleware/require-role';
import type { OrderDeskService } from './order-desk.service';
import type { OrdersService } from './orders.service';
import type { RefundsService } from './refunds.service';

const orderParams = z.object({ id: z.uuid('No such order.') });

/**
 * Orders at `/api/orders`: a customer's own, every order for staff, and the owner's refunds. Other
 * modules mount order actions at the same path (packing, trace), so each route carries its own guard.
 */
export function ordersRoutes(orders: OrdersService, refunds: RefundsService, desk: OrderDeskService): Router {
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

  // Staff acting on an order; each answers with the order as it now is.
  const staff = requireRole('staff', 'owner');

  router.post('/:id/cancel', staff, async (req, res) => {
    const { id } = orderParams.parse(req.params);
    await desk.cancel(req.user!, id, { ip: req.ip });
    res.json((await orders.get(req.user!, id)) satisfies OrderDetail);
  });

  router.post('/:id/resend/:template', staff, async (req, res) => {
    const { id, template } = orderResendParamsSchema.parse(req.params);
    await desk.resend(req.user!, id, template, { ip: req.ip });
    res.status(202).json((await orders.get(req.user!, id)) satisfies OrderDetail);
  });

  router.patch('/:id/address', staff, async (req, res) => {
    const { id } = orderParams.parse(req.params);
    await desk.correctAddress(req.user!, id, orderAddressCorrectionSchema.parse(req.body), { ip: req.ip });
    res.json((await orders.get(req.user!, id)) satisfies OrderDetail);
  });

  router.put('/:id/note', staff, async (req, res) => {
    const { id } = orderParams.parse(req.params);
    await desk.saveNote(req.user!, id, orderNoteSchema.parse(req.body).note, { ip: req.ip });
    res.json((await orders.get(req.user!, id)) satisfies OrderDetail);
  });

  return router;
}

/** The orders list as a CSV file (packers, staff and the owner), mounted at `/api/orders.csv` (a sibling of `/orders`, not under it). */
export function ordersCsvRoutes(orders: OrdersService): Router {
  const router = Router();
  router.get('/', requireRole(...packingRoles), async (req, res) => {
    sendDownload(res, 'restday-orders.csv', await orders.csv(req.user!, orderListQuerySchema.parse(req.query)));
  });
  return router;
}
