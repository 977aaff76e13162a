import { z } from 'zod';
import { areValidDates, isoDate } from './dates';
import { daysBetween } from '../domain/shop-time';

/** Longest range `GET /api/roastery/rotation` answers at once. */
export const maxRotationSpanDays = 92;

/** Query string of `GET /api/roastery/rotation` (staff): both days inclusive, shop-local. */
export const rotationQuerySchema = z
  .object({ from: isoDate('first day'), to: isoDate('last day') })
  .refine((query) => query.from <= query.to, { message: 'The first day must not be after the last.', path: ['to'] })
  .refine((query) => !areValidDates(query.from, query.to) || query.from > query.to || daysBetween(query.from, query.to) < maxRotationSpanDays, {
    message: `Ask for at most ${maxRotationSpanDays} days at once.`,
    path: ['to'],
  });
export type RotationQuery = z.infer<typeof rotationQuerySchema>;

/**
 * One open roast day of the Roaster's Rotation. `lotCode`/`coffee` are the pick (null until
 * chosen); `subscribers` counts active rotation subscriptions with a delivery that day; `bags`
 * and `roastedGrams` are what those deliveries need (fill weights).
 */
export const rotationDaySchema = z.object({
  roastDate: z.string(),
  lotCode: z.string().nullable(),
  coffee: z.string().nullable(),
  note: z.string(),
  subscribers: z.number().int(),
  bags: z.number().int(),
  roastedGrams: z.number().int(),
});
export type RotationDay = z.infer<typeof rotationDaySchema>;

export const rotationResponseSchema = z.object({ days: z.array(rotationDaySchema) });
export type RotationResponse = z.infer<typeof rotationResponseSchema>;

/** `PUT /api/roastery/rotation/:date` (staff): the lot the rotation subscribers get that roast day. */
export const rotationPickSchema = z.object({
  lotCode: z.string({ error: 'Choose a lot.' }).trim().min(1, 'Choose a lot.').max(40, 'Use at most 40 characters.'),
  note: z.string().trim().max(500, 'Use at most 500 characters.').default(''),
});
export type RotationPick = z.infer<typeof rotationPickSchema>;

/**
 * 200 answer: the saved pick. `warnings` say what staff should know but may accept: the lot is
 * not listed in Green Lots, or its green stock is short of what the day's rotation needs.
 */
export const rotationPickResponseSchema = z.object({
  roastDate: z.string(),
  lotCode: z.string(),
  coffee: z.string(),
  note: z.string(),
  warnings: z.array(z.object({ code: z.enum(['lot_not_listed', 'short_of_stock']), message: z.string() })),
});
export type RotationPickResponse = z.infer<typeof rotationPickResponseSchema>;
