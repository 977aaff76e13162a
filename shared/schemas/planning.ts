import { z } from 'zod';

/** `GET /api/roastery/planning?weeks=8`. */
export const planningQuerySchema = z.object({
  weeks: z.coerce.number().int('must be a whole number of weeks').min(1, 'must be at least 1 week').max(26, 'must be at most 26 weeks').default(8),
});
export type PlanningQuery = z.infer<typeof planningQuerySchema>;

export const planningWeekSchema = z.object({
  start: z.string(),
  roastGreenGrams: z.number().int(),
  salesGreenGrams: z.number().int(),
  needGrams: z.number().int(),
  /** Negative once the stock has run out. */
  stockAfterGrams: z.number().int(),
});
export type PlanningWeek = z.infer<typeof planningWeekSchema>;

export const lotPlanSchema = z.object({
  lotCode: z.string(),
  name: z.string(),
  isListed: z.boolean(),
  stockGrams: z.number().int(),
  reorderPointGrams: z.number().int(),
  leadTimeDays: z.number().int(),
  weeks: z.array(planningWeekSchema),
  needGrams: z.number().int(),
  runOutDate: z.string().nullable(),
  runOutWeek: z.string().nullable(),
  reorderBy: z.string().nullable(),
  /** The reorder-by day is today or past. */
  reorderNow: z.boolean(),
  /** Reorder now, or stock at or below the reorder point. */
  reorderAlert: z.boolean(),
});
export type LotPlan = z.infer<typeof lotPlanSchema>;

export const planningResponseSchema = z.object({
  from: z.string(),
  weeks: z.number().int(),
  /** The days of green sales the pace is taken from. */
  salesWindowDays: z.number().int(),
  lots: z.array(lotPlanSchema),
  unpickedRotationGreenGrams: z.array(z.number().int()),
});
export type PlanningResponse = z.infer<typeof planningResponseSchema>;
