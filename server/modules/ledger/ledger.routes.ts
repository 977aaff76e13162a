import { stringify } from 'csv-stringify/sync';
import { Router } from 'express';
import { ledgerQuerySchema, type LedgerResponse, type LedgerTable } from '@shared/schemas/ledger';
import { sendDownload } from '../../lib/download';
import { requireRole } from '../../middleware/require-role';
import type { LedgerService } from './ledger.service';

const ownerOnly = requireRole('owner');

/** Each of the Ledger's tables as CSV rows: money in minor units, weights in grams, as the API gives them. */
const csvRows: Record<LedgerTable, (ledger: LedgerResponse) => Record<string, string | number>[]> = {
  sales: (ledger) =>
    ledger.sales.map((week) => ({
      week_start: week.weekStart,
      currency: ledger.currency,
      green_cents: week.greenCents,
      roasted_cents: week.roastedCents,
      subscription_cents: week.subscriptionCents,
      total_cents: week.totalCents,
      refunds_cents: week.refundsCents,
      orders: week.orders,
    })),
  subscriptions: (ledger) =>
    ledger.subscriptions.map((week) => ({
      week_start: week.weekStart,
      active: week.active,
      started: week.started,
      paused: week.paused,
      cancelled: week.cancelled,
      currency: ledger.currency,
      monthly_recurring_cents: week.monthlyRecurringCents,
    })),
  green: (ledger) =>
    ledger.green.map((week) => ({ week_start: week.weekStart, roasted_green_grams: week.roastedGreenGrams, sold_green_grams: week.soldGreenGrams })),
  loss: (ledger) =>
    ledger.loss.map((row) => ({
      lot_code: row.lotCode,
      lot_name: row.name,
      roast_level: row.roastLevel,
      batches: row.batches,
      green_grams_in: row.greenGramsIn,
      roasted_grams_out: row.roastedGramsOut,
      loss_pct: row.lossPct,
      expected_min_pct: row.expected.minPct,
      expected_max_pct: row.expected.maxPct,
      expected_default_pct: row.expected.defaultPct,
      position: row.position,
    })),
};

export function ledgerCsv(ledger: LedgerResponse, table: LedgerTable): string {
  return stringify(csvRows[table](ledger), { header: true });
}

/** The owner's Ledger on `/api/owner/ledger`, and one CSV per table. */
export function ledgerRoutes(service: LedgerService): Router {
  const router = Router();
  router.get('/', ownerOnly, async (req, res) => {
    const { weeks } = ledgerQuerySchema.parse(req.query);
    res.set('Cache-Control', 'no-store').json((await service.ledger(weeks)) satisfies LedgerResponse);
  });
  for (const table of Object.keys(csvRows) as LedgerTable[]) {
    router.get(`/${table}.csv`, ownerOnly, async (req, res) => {
      const { weeks } = ledgerQuerySchema.parse(req.query);
      const ledger = await service.ledger(weeks);
      sendDownload(res, `ledger-${table}-${ledger.from}-${ledger.to}.csv`, ledgerCsv(ledger, table));
    });
  }
  return router;
}
