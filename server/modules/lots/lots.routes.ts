import { Router } from 'express';
import { sendWrittenJson, writtenJson, type WrittenJson } from '../../lib/written-json';
import { z } from 'zod';
import { lotListQuerySchema, roastGuideQuerySchema, type LotDetail, type LotListResponse, type LotSummary } from '@shared/schemas/lots';
import type { LotsService } from './lots.service';

const lotCodeParams = z.object({ code: z.string().trim().min(1).max(40) });

export function lotsRoutes(service: LotsService): Router {
  const router = Router();

  // A list held in memory is the same array until it changes, so its JSON, compressed copies and
  // ETag are made once, not on every request.
  const written = new WeakMap<LotSummary[], WrittenJson>();
  router.get('/', async (req, res) => {
    const items = await service.list(lotListQuerySchema.parse(req.query));
    let body = written.get(items);
    if (body === undefined) {
      body = writtenJson({ items } satisfies LotListResponse);
      written.set(items, body);
    }
    // The same for every visitor, so browsers and any shared cache may keep it briefly; stock shown
    // a few seconds old is safe, because checkout takes stock only if it is really there.
    res.setHeader('Cache-Control', 'public, max-age=10');
    sendWrittenJson(req, res, body);
  });

  router.get('/:code', async (req, res) => {
    const { code } = lotCodeParams.parse(req.params);
    res.json((await service.get(code)) satisfies LotDetail);
  });

  router.get('/:code/roast-guide', async (req, res) => {
    const { code } = lotCodeParams.parse(req.params);
    res.json(await service.roastGuide(code, roastGuideQuerySchema.parse(req.query)));
  });

  return router;
}
