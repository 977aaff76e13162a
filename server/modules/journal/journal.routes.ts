import { Router } from 'express';
import { z } from 'zod';
import {
  journalEntryInputSchema,
  journalEntryParamsSchema,
  journalListQuerySchema,
  type JournalEntryCreated,
  type JournalListResponse,
} from '@shared/schemas/journal';
import type { LotRoastSummaryResponse } from '@shared/schemas/journal-summary';
import { sendDownload } from '../../lib/download';
import { requireRole, requireUser } from '../../middleware/require-role';
import type { JournalService } from './journal.service';

const lotCodeParams = z.object({ code: z.string().trim().min(1).max(40) });

/** The customer's own Roast Journal, mounted at `/api/journal`: nobody else's entry is ever found (404). */
export function journalRoutes(service: JournalService): Router {
  const router = Router();
  router.use(requireUser);

  router.get('/', async (req, res) => {
    res.json((await service.list(req.user!.id, journalListQuerySchema.parse(req.query))) satisfies JournalListResponse);
  });

  router.post('/', async (req, res) => {
    res.status(201).json((await service.create(req.user!.id, journalEntryInputSchema.parse(req.body))) satisfies JournalEntryCreated);
  });

  router.put('/:id', async (req, res) => {
    const { id } = journalEntryParamsSchema.parse(req.params);
    res.json((await service.update(req.user!.id, id, journalEntryInputSchema.parse(req.body))) satisfies JournalEntryCreated);
  });

  router.delete('/:id', async (req, res) => {
    const { id } = journalEntryParamsSchema.parse(req.params);
    await service.remove(req.user!.id, id);
    res.status(204).end();
  });

  return router;
}

/** `GET /api/journal.csv`: the customer's own journal as a spreadsheet. */
export function journalCsvRoutes(service: JournalService): Router {
  const router = Router();
  router.get('/', requireUser, async (req, res) => {
    sendDownload(res, 'roast-journal.csv', await service.csv(req.user!.id));
  });
  return router;
}

/** `GET /api/roastery/lots/:code/journal-summary` (staff): anonymous, from the minimum roasts and customers. */
export function journalSummaryRoutes(service: JournalService): Router {
  const router = Router();
  router.get('/:code/journal-summary', requireRole('staff', 'owner'), async (req, res) => {
    const { code } = lotCodeParams.parse(req.params);
    res.json((await service.summary(code)) satisfies LotRoastSummaryResponse);
  });
  return router;
}

/** `GET /api/lots/:code/home-roasts` (public): the same anonymous figures for the lot page. */
export function homeRoastsRoutes(service: JournalService): Router {
  const router = Router();
  router.get('/:code/home-roasts', async (req, res) => {
    const { code } = lotCodeParams.parse(req.params);
    res.json((await service.summary(code)) satisfies LotRoastSummaryResponse);
  });
  return router;
}
