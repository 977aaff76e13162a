import { z } from 'zod';

/** One lot on the Roastery's Green Stock screen. */
export const greenStockItemSchema = z.object({
  code: z.string(),
  name: z.string(),
  isListed: z.boolean(),
  stockGrams: z.number().int(),
  reorderPointGrams: z.number().int(),
  /** Days from ordering more from the supplier to the coffee on the shelf. */
  supplierLeadTimeDays: z.number().int(),
  /** Green planning's last day to reorder (run-out day less the lead time); null when stock lasts the plan. */
  reorderBy: z.string().nullable(),
  /** Stock is at or below a reorder point staff have set, or green planning's reorder-by day has come. */
  reorderAlert: z.boolean(),
  /** Grams sold and roasted over the cover window (the last 28 days). */
  usedGramsInWindow: z.number().int(),
  averageDailyUseGrams: z.number().int(),
  /** Whole days the stock lasts at that pace; null when nothing was used in the window. */
  daysOfCover: z.number().int().nullable(),
});
export type GreenStockItem = z.infer<typeof greenStockItemSchema>;

/** `GET /api/roastery/green-stock` (staff). */
export const greenStockResponseSchema = z.object({
  windowDays: z.number().int(),
  items: z.array(greenStockItemSchema),
});
export type GreenStockResponse = z.infer<typeof greenStockResponseSchema>;
