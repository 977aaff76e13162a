import { stringify } from 'csv-stringify/sync';
import { Router } from 'express';
import { planningQuerySchema, type PlanningResponse } from '@shared/schemas/planning';
import { sendDownload } from '../../lib/download';
import { requireRole } from '../../middleware/require-role';
import type { PlanningService } from './planning.service';

const staffOnly = requireRole('staff', 'owner');

/** One row per lot and week. */
export function planningCsv(plan: PlanningResponse): string {
  const rows = plan.lots.flatMap((lot) =>
    lot.weeks.map((week) => ({
      lot_code: lot.lotCode,
      lot_name: lot.name,
      week_start: week.start,
      roast_green_grams: week.roastGreenGrams,
      sales_green_grams: week.salesGreenGrams,
      need_grams: week.needGrams,
      stock_after_grams: week.stockAfterGrams,
      run_out_date: lot.runOutDate ?? '',
      supplier_lead_time_days: lot.leadTimeDays,
      reorder_by: lot.reorderBy ?? '',
    })),
  );
  return stringify(rows, {
    header: true,
    columns: [
      'lot_code',
      'lot_name',
      'week_start',
      'roast_green_grams',
      'sales_green_grams',
      'need_grams',
      'stock_after_grams',
      'run_out_date',
      'supplier_lead_time_days',
      'reorder_by',
    ],
  });
}

/** Green planning, mounted on `/api/roastery` beside the other Roastery routers (each route carries its own guard). */
export function planningRoutes(service: PlanningService): Router {
  const router = Router();
  router.get('/planning', staffOnly, async (req, res) => {
    const { weeks } = planningQuerySchema.parse(req.query);
    res.set('Cache-Control', 'no-store').json((await service.plan(weeks)) satisfies PlanningResponse);
  });
  router.get('/planning.csv', staffOnly, async (req, res) => {
    const { weeks } = planningQuerySchema.parse(req.query);
    const plan = await service.plan(weeks);
    sendDownload(res, `green-planning-${plan.from}.csv`, planningCsv(plan));
  });
  return router;
}
