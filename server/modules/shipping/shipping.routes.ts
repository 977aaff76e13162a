import { createHash } from 'node:crypto';
import { Router } from 'express';
import type { ShippingRules } from '@shared/schemas/shipping';
import type { ShippingRepo } from './shipping.repo';

/**
 * `/api/shipping` (public). Caches may keep the answer but must ask again before each use
 * (`no-cache` with an ETag, answered 304 while the bands are unchanged), so a cart never prices
 * on bands the owner has since changed, yet an unchanged answer costs no body.
 */
export function shippingRoutes(repo: ShippingRepo): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    const rules = (await repo.rules()) satisfies ShippingRules;
    const body = JSON.stringify(rules);
    const etag = `"${createHash('sha256').update(body).digest('base64url').slice(0, 27)}"`;
    res.setHeader('Cache-Control', 'public, no-cache');
    res.setHeader('ETag', etag);
    if (req.headers['if-none-match'] === etag) {
      res.status(304).end();
      return;
    }
    res.type('application/json').send(body);
  });
  return router;
}
