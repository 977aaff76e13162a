import { Router } from 'express';
import { outboxListQuerySchema, type OutboxListResponse } from '@shared/schemas/outbox';
import { requireRole } from '../../middleware/require-role';
import type { OutboxService } from './outbox.service';

/** `GET /api/roastery/outbox`: the e-mail outbox for staff and the owner, newest first, filterable by status. */
export function outboxRoutes(service: OutboxService): Router {
  const router = Router();
  router.get('/', requireRole('staff', 'owner'), async (req, res) => {
    const items = await service.list(outboxListQuerySchema.parse(req.query));
    res.setHeader('Cache-Control', 'no-store');
    res.json({ items } satisfies OutboxListResponse);
  });
  return router;
}
