import { z } from 'zod';
import { roastLevels } from '../domain/vocabulary';

/** `GET /api/owner/ledger?weeks=12`. */
export const ledgerQuerySchema = z.object({
  weeks: z.coerce.number().int('must be a whole number of weeks').min(1, 'must be at least 1 week').max(104, 'must be at most 104 weeks').default(12),
});
export type LedgerQuery = z.infer<typeof ledgerQuerySchema>;

/** Money paid in a week (order totals, shipping included) by kind, and refunds made in it. */
export const ledgerSalesWeekSchema = z.object({
  weekStart: z.string(),
  greenCents: z.number().int(),
  roastedCents: z.number().int(),
  subscriptionCents: z.number().int(),
  totalCents: z.number().int(),
  refundsCents: z.number().int(),
  /** Orders paid in the week. */
  orders: z.number().int(),
});
export type LedgerSalesWeek = z.infer<typeof ledgerSalesWeekSchema>;

export const ledgerSubscriptionsWeekSchema = z.object({
  weekStart: z.string(),
  /** On the books at the week's end (paused ones included). */
  active: z.number().int(),
  started: z.number().int(),
  paused: z.number().int(),
  cancelled: z.number().int(),
  /** Recurring revenue per month of the subscriptions active and not paused at the week's end. */
  monthlyRecurringCents: z.number().int(),
});
export type LedgerSubscriptionsWeek = z.infer<typeof ledgerSubscriptionsWeekSchema>;

export const ledgerGreenWeekSchema = z.object({
  weekStart: z.string(),
  /** Green put into the roaster (recorded batches). */
  roastedGreenGrams: z.number().int(),
  /** Green sold to home roasters (paid green orders). */
  soldGreenGrams: z.number().int(),
});
export type LedgerGreenWeek = z.infer<typeof ledgerGreenWeekSchema>;

export const ledgerLossRowSchema = z.object({
  lotCode: z.string(),
  name: z.string(),
  roastLevel: z.enum(roastLevels),
  batches: z.number().int(),
  greenGramsIn: z.number().int(),
  roastedGramsOut: z.number().int(),
  lossPct: z.number(),
  expected: z.object({ minPct: z.number(), maxPct: z.number(), defaultPct: z.number() }),
  position: z.enum(['below', 'within', 'above']),
});
export type LedgerLossRow = z.infer<typeof ledgerLossRowSchema>;

export const ledgerResponseSchema = z.object({
  currency: z.string(),
  timeZone: z.string(),
  weeks: z.number().int(),
  from: z.string(),
  to: z.string(),
  sales: z.array(ledgerSalesWeekSchema),
  subscriptions: z.array(ledgerSubscriptionsWeekSchema),
  green: z.array(ledgerGreenWeekSchema),
  loss: z.array(ledgerLossRowSchema),
});
export type LedgerResponse = z.infer<typeof ledgerResponseSchema>;

export const ledgerTables = ['sales', 'subscriptions', 'green', 'loss'] as const;
export type LedgerTable = (typeof ledgerTables)[number];
