import { Router } from 'express';
import { z } from 'zod';
import { orderListQuerySchema, type OrderDetail, type OrderListResponse } from '@shared/schemas/orders';
import { requireRole, requireUser } from '../../middleware/require-role';
import type { OrdersService } from './orders.service';

const orderParams = z.object({ id: z.uuid('No such order.') });

/**
 * `/api/orders`, `/api/orders.csv` and `/api/orders/:id`. Mounted on `/api` itself (the CSV path is
 * not under `/orders/`), so each route carries its own guard.
 */
export function ordersRoutes(service: OrdersService): Router {
  const router = Router();

  router.get('/orders', requireUser, async (req, res) => {
    res.json((await service.list(req.user!, orderListQuerySchema.parse(req.query))) satisfies OrderListResponse);
  });

  router.get('/orders.csv', requireRole('staff', 'owner'), async (req, res) => {
    const csv = await service.csv(req.user!, orderListQuerySchema.parse(req.query));
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', 'attachment; filename="restday-orders.csv"');
    res.setHeader('Cache-Control', 'no-store');
    res.send(csv);
  });

  router.get('/orders/:id', requireUser, async (req, res) => {
    const { id } = orderParams.parse(req.params);
    res.json((await service.get(req.user!, id)) satisfies OrderDetail);
  });

  return router;
}
