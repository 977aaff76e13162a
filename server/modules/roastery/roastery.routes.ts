import { Router } from 'express';
import { z } from 'zod';
import {
  batchCreateSchema,
  calendarDayUpdateSchema,
  calendarQuerySchema,
  roastDayParamsSchema,
  type BatchCreated,
  type BatchListResponse,
  type CalendarDayUpdateResponse,
  type CalendarResponse,
  type RoastListResponse,
} from '@shared/schemas/roastery';
import { shopSettingsUpdateSchema, type ShopSettings } from '@shared/schemas/settings';
import { sendDownload } from '../../lib/download';
import { packingRoles, requireRole } from '../../middleware/require-role';
import type { BatchesService } from './batches.service';
import type { CalendarService } from './calendar.service';
import { paperSizes, roastListCsv, roastListPdf } from './roast-list-documents';
import type { RoastListService } from './roast-list.service';
import type { RoasterySettingsService } from './settings.service';

const staffOnly = requireRole('staff', 'owner');
const ownerOnly = requireRole('owner');
const paperQuerySchema = z.object({ paper: z.enum(Object.keys(paperSizes) as [keyof typeof paperSizes]).default('letter') });

export interface RoasteryServices {
  settings: RoasterySettingsService;
  calendar: CalendarService;
  roastList: RoastListService;
  batches: BatchesService;
}

/**
 * The Roastery's settings, Roast Calendar, Roast List and batches, mounted on `/api/roastery`.
 * Each route carries its own guard: other Roastery routers share the mount path.
 */
export function roasteryRoutes(services: RoasteryServices): Router {
  const router = Router();
  const noStore = { 'Cache-Control': 'no-store' };

  // The whole team reads them (a packer's pages need the shop's time zone); only the owner changes them.
  router.get('/settings', requireRole(...packingRoles), async (_req, res) => {
    res.set(noStore).json((await services.settings.get()) satisfies ShopSettings);
  });

  router.put('/settings', ownerOnly, async (req, res) => {
    const settings = shopSettingsUpdateSchema.parse(req.body);
    res.json((await services.settings.replace(settings, { id: req.user!.id, ip: req.ip ?? null })) satisfies ShopSettings);
  });

  router.get('/calendar', staffOnly, async (req, res) => {
    res.set(noStore).json((await services.calendar.calendar(calendarQuerySchema.parse(req.query))) satisfies CalendarResponse);
  });

  router.put('/calendar/:date', staffOnly, async (req, res) => {
    const { date } = roastDayParamsSchema.parse(req.params);
    res.json((await services.calendar.updateDay(date, calendarDayUpdateSchema.parse(req.body))) satisfies CalendarDayUpdateResponse);
  });

  router.get('/days/:date/roast-list', staffOnly, async (req, res) => {
    const { date } = roastDayParamsSchema.parse(req.params);
    res.set(noStore).json((await services.roastList.roastList(date)).list satisfies RoastListResponse);
  });

  router.get('/days/:date/roast-list.csv', staffOnly, async (req, res) => {
    const { date } = roastDayParamsSchema.parse(req.params);
    const { list } = await services.roastList.roastList(date);
    sendDownload(res, `roast-list-${date}.csv`, roastListCsv(list));
  });

  router.get('/days/:date/roast-list.pdf', staffOnly, async (req, res) => {
    const { date } = roastDayParamsSchema.parse(req.params);
    const { paper } = paperQuerySchema.parse(req.query);
    const [{ shopName, list }, settings, recorded] = await Promise.all([
      services.roastList.roastList(date),
      services.settings.get(),
      services.batches.onDay(date),
    ]);
    sendDownload(res, `roast-list-${date}.pdf`, await roastListPdf(list, { shopName, timeZone: settings.timeZone }, paper, recorded.items));
  });

  router.post('/batches', staffOnly, async (req, res) => {
    const batch = await services.batches.record(batchCreateSchema.parse(req.body), req.user!.id);
    res.status(201).json(batch satisfies BatchCreated);
  });

  router.get('/days/:date/batches', staffOnly, async (req, res) => {
    const { date } = roastDayParamsSchema.parse(req.params);
    res.set(noStore).json((await services.batches.onDay(date)) satisfies BatchListResponse);
  });

  return router;
}
