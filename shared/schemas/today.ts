import { z } from 'zod';

/** `GET /api/roastery/today` (staff): the Roastery overview's figures. */
export const todayResponseSchema = z.object({
  today: z.string(),
  /** The first open roast day from today on, and what it still needs; null when none is open within the search horizon. */
  nextRoastDay: z
    .object({
      date: z.string(),
      isToday: z.boolean(),
      bags: z.number().int(),
      roastedGrams: z.number().int(),
      greenGrams: z.number().int(),
      batches: z.number().int(),
      shortfalls: z.array(z.object({ lotCode: z.string(), greenGrams: z.number().int(), stockGrams: z.number().int(), shortfallGrams: z.number().int() })),
      warnings: z.number().int(),
    })
    .nullable(),
  /** Parcels due out by today. */
  parcels: z.object({ toPack: z.number().int(), toShip: z.number().int() }),
  stuck: z.object({
    held: z.number().int(),
    /** Awaiting payment for longer than `awaitingPaymentHours`. */
    awaitingPayment: z.number().int(),
    awaitingPaymentHours: z.number().int(),
  }),
  failedMessages: z.object({
    count: z.number().int(),
    items: z.array(
      z.object({ id: z.string(), template: z.string(), to: z.string(), attempts: z.number().int(), createdAt: z.string(), orderId: z.string().nullable() }),
    ),
  }),
  reorder: z.array(
    z.object({
      lotCode: z.string(),
      name: z.string(),
      stockGrams: z.number().int(),
      reorderPointGrams: z.number().int(),
      runOutDate: z.string().nullable(),
      reorderBy: z.string().nullable(),
      reorderNow: z.boolean(),
    }),
  ),
});
export type TodayResponse = z.infer<typeof todayResponseSchema>;
