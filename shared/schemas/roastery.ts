import { z } from 'zod';
import { areValidDates, instant, isoDate } from './dates';
import { MAX_CALENDAR_SPAN_DAYS } from '../domain/roast-schedule';
import { daysBetween } from '../domain/shop-time';
import { roastLevels, weekdays } from '../domain/vocabulary';

/**
 * The Roastery's API shapes: the Roast Calendar, the Roast List of a roast day
 * and the batches staff record. The shop settings are `shopSettingsSchema` in ./settings.
 */

const wholeGrams = z.number().int().min(0);

/** Path parameter of every `/api/roastery/days/:date/…` and `/api/roastery/calendar/:date` route. */
export const roastDayParamsSchema = z.object({ date: isoDate('date') });
export type RoastDayParams = z.infer<typeof roastDayParamsSchema>;

// ---------------------------------------------------------------------------------------------
// Roast Calendar

/** Query string of `GET /api/roastery/calendar`: both days inclusive, at most a year apart. */
export const calendarQuerySchema = z
  .object({ from: isoDate('date'), to: isoDate('date') })
  .refine((query) => query.from <= query.to, { message: 'The first day must not be after the last.', path: ['to'] })
  .refine((query) => !areValidDates(query.from, query.to) || query.from > query.to || daysBetween(query.from, query.to) < MAX_CALENDAR_SPAN_DAYS, {
    message: `Ask for at most ${MAX_CALENDAR_SPAN_DAYS} days at a time.`,
    path: ['to'],
  });
export type CalendarQuery = z.infer<typeof calendarQuerySchema>;

export const calendarDaySchema = z.object({
  date: z.string(),
  weekday: z.enum(weekdays),
  /** The day roasts. */
  open: z.boolean(),
  /** Parcels go out this day: the ship weekdays less carrier holidays, unless staff changed the day. */
  shipOpen: z.boolean(),
  /** Staff's choice for shipping this day (`PUT`'s `shipOpen`); null follows the ship weekdays and carrier holidays. */
  shipOverride: z.boolean().nullable(),
  /** The US federal holiday observed this day (carriers closed), or null. */
  holiday: z.string().nullable(),
  /** Green grams the day can roast: the day's own figure or the shop's daily capacity; 0 when closed. */
  capacityGrams: wholeGrams,
  /**
   * Green grams the day's paid and held roasted-coffee orders need, planned as the Roast List plans
   * them; Roaster's Rotation bags with no lot picked yet count at their level's default loss.
   */
  plannedGreenGrams: wholeGrams,
  note: z.string().nullable(),
  /** Paid or held roasted-coffee orders with this roast date. */
  ordersCount: z.number().int().min(0),
  /** What the day's recorded batches add up to (the Roast List's record): all zero before any batch. */
  roasted: z.object({ batches: z.number().int().min(0), greenGrams: wholeGrams, roastedGrams: wholeGrams }),
  /** True when staff changed this day (roasting, shipping, capacity or note); false when it follows the weekly settings. */
  overridden: z.boolean(),
});
export type CalendarDay = z.infer<typeof calendarDaySchema>;

/** `GET /api/roastery/calendar?from&to` (staff). */
export const calendarResponseSchema = z.object({ days: z.array(calendarDaySchema) });
export type CalendarResponse = z.infer<typeof calendarResponseSchema>;

/**
 * Body of `PUT /api/roastery/calendar/:date`. `open` is roasting; `shipOpen` is shipping, apart
 * from roasting: true or false sets it, null follows the ship weekdays and carrier holidays, left
 * out keeps it. `capacityGrams` null (or left out) uses the shop's daily capacity; `note` left out
 * keeps the day's note.
 */
export const calendarDayUpdateSchema = z.object({
  open: z.boolean(),
  shipOpen: z.boolean().nullable().optional(),
  capacityGrams: z.number().int().min(0).max(10_000_000).nullable().optional(),
  note: z.string().trim().max(200, 'Keep the note to 200 characters.').optional(),
});
export type CalendarDayUpdate = z.infer<typeof calendarDayUpdateSchema>;

/** An order a closure moved to another roast day. */
export const movedOrderSchema = z.object({ orderId: z.uuid(), from: z.string(), to: z.string() });
export type MovedOrder = z.infer<typeof movedOrderSchema>;

/** A subscription delivery (not yet an order) a closure moved to another roast day. */
export const movedDeliverySchema = z.object({ deliveryId: z.uuid(), subscriptionId: z.uuid(), from: z.string(), to: z.string() });
export type MovedDelivery = z.infer<typeof movedDeliverySchema>;

/** An order or a delivery not yet paid whose ship date a change of the day's shipping moved. */
export const shipMovedSchema = z.object({ orderId: z.uuid().nullable(), deliveryId: z.uuid().nullable(), from: z.string(), to: z.string() });
export type ShipMoved = z.infer<typeof shipMovedSchema>;

/** Reply of `PUT /api/roastery/calendar/:date`: the day as it now stands and what the change moved. */
export const calendarDayUpdateResponseSchema = calendarDaySchema.extend({
  moved: z.array(movedOrderSchema),
  movedDeliveries: z.array(movedDeliverySchema),
  shipMoved: z.array(shipMovedSchema),
});
export type CalendarDayUpdateResponse = z.infer<typeof calendarDayUpdateResponseSchema>;

// ---------------------------------------------------------------------------------------------
// Roast List

export const roastListWarningCodes = [
  'over_day_capacity',
  'below_preferred_load',
  'below_minimum_load',
  'green_shortfall',
  /** Roaster's Rotation bags on a day with no lot picked: they are not on the list. */
  'rotation_not_picked',
  /** The day is closed on the Roast Calendar but still has orders. */
  'day_closed',
] as const;
export type RoastListWarningCode = (typeof roastListWarningCodes)[number];

export const roastListWarningSchema = z.object({
  code: z.enum(roastListWarningCodes),
  message: z.string(),
  lotCode: z.string().optional(),
  roastLevel: z.enum(roastLevels).optional(),
});
export type RoastListWarning = z.infer<typeof roastListWarningSchema>;

export const roastListLineSchema = z.object({
  lotCode: z.string(),
  lotName: z.string(),
  roastLevel: z.enum(roastLevels),
  /** Bags of every size at this lot and level. */
  bags: z.number().int().min(0),
  roastedGrams: wholeGrams,
  /** Loss planned with, % to two decimals. */
  lossPct: z.number(),
  /** "level": the level's default from the loss model; "lot": the lot's own measured loss. */
  lossSource: z.enum(['level', 'lot']),
  /** ceil(roasted × (1 + overage) ÷ (1 − loss)). */
  greenGrams: wholeGrams,
  /** Green load of each planned batch, largest first. */
  batches: z.array(z.object({ greenGrams: wholeGrams })),
  /** Below the hard floor (25 % of capacity): raising each batch to the floor, and what that adds. */
  floorProposal: z.object({ batchGreenGrams: wholeGrams, extraGreenGrams: wholeGrams, extraRoastedGrams: wholeGrams }).optional(),
  /** Batches already recorded for this day, lot and level. */
  recorded: z.object({ batches: z.number().int().min(0), greenGrams: wholeGrams, roastedGrams: wholeGrams }),
  /**
   * What is left to roast: the roasted weight no done bag or recorded batch covers yet, its green
   * and its batches (empty when nothing is left). The pull list and warnings count only this.
   */
  toRoast: z.object({ roastedGrams: wholeGrams, greenGrams: wholeGrams, batches: z.array(z.object({ greenGrams: wholeGrams })) }),
});
export type RoastListLine = z.infer<typeof roastListLineSchema>;

export const pullLineSchema = z.object({
  lotCode: z.string(),
  lotName: z.string(),
  greenGrams: wholeGrams,
  stockGrams: wholeGrams,
  shortfallGrams: wholeGrams,
});
export type PullLine = z.infer<typeof pullLineSchema>;

/** `GET /api/roastery/days/:date/roast-list` (staff). */
export const roastListResponseSchema = z.object({
  date: z.string(),
  day: z.object({ open: z.boolean(), capacityGrams: wholeGrams }),
  lines: z.array(roastListLineSchema),
  pull: z.array(pullLineSchema),
  /** The whole day as planned, and what is left of it to roast. */
  totals: z.object({
    roastedGrams: wholeGrams,
    greenGrams: wholeGrams,
    batches: z.number().int().min(0),
    toRoast: z.object({ roastedGrams: wholeGrams, greenGrams: wholeGrams, batches: z.number().int().min(0) }),
  }),
  warnings: z.array(roastListWarningSchema),
});
export type RoastListResponse = z.infer<typeof roastListResponseSchema>;

// ---------------------------------------------------------------------------------------------
// Batches

/**
 * Body of `POST /api/roastery/batches`. Whole grams and whole seconds; the cross-field rules
 * (roasted below green, first crack before the end) are `batchMetrics` in shared/domain/roast-metrics.
 */
export const batchCreateSchema = z.object({
  /**
   * Chosen by the client (a fresh UUID per batch) so a retried request records the batch once:
   * the same id again answers with the batch already recorded.
   */
  id: z.uuid('Use a UUID.').optional(),
  roastDate: isoDate('roast date'),
  lotCode: z.string().trim().min(1, 'Choose a lot.').max(40),
  roastLevel: z.enum(roastLevels),
  greenGramsIn: z.number().int('Whole grams.').positive('More than 0 g.').max(500_000),
  roastedGramsOut: z.number().int('Whole grams.').positive('More than 0 g.').max(500_000),
  totalSeconds: z.number().int('Whole seconds.').positive('More than 0 seconds.').max(7_200).optional(),
  firstCrackSeconds: z.number().int('Whole seconds.').positive('More than 0 seconds.').max(7_200).optional(),
  notes: z.string().trim().max(1_000, 'Keep the notes to 1,000 characters.').optional(),
});
export type BatchCreate = z.infer<typeof batchCreateSchema>;

/** Reply of `POST /api/roastery/batches` (201). */
export const batchCreatedSchema = z.object({
  id: z.uuid(),
  lossPct: z.number(),
  withinExpected: z.boolean(),
  /** Where the loss falls against the level's range in the shop's loss model. */
  lossPosition: z.enum(['below', 'within', 'above']),
  expectedLossPct: z.object({ min: z.number(), max: z.number() }),
  developmentSeconds: z.number().int().optional(),
  /** Development time ÷ total roast time, % to two decimals; only with both times. */
  developmentTimeRatio: z.number().optional(),
  /** The loss the Roast List now plans this lot and level with, and its source. */
  lossSource: z.enum(['level', 'lot']),
  plannedLossPct: z.number(),
  /** The lot's green stock after this batch took its green. */
  stockGrams: wholeGrams,
});
export type BatchCreated = z.infer<typeof batchCreatedSchema>;

export const batchSchema = z.object({
  id: z.uuid(),
  roastDate: z.string(),
  lotCode: z.string(),
  lotName: z.string(),
  roastLevel: z.enum(roastLevels),
  greenGramsIn: z.number().int(),
  roastedGramsOut: z.number().int(),
  totalSeconds: z.number().int().nullable(),
  firstCrackSeconds: z.number().int().nullable(),
  lossPct: z.number(),
  withinExpected: z.boolean(),
  developmentTimeRatio: z.number().nullable(),
  operatorName: z.string().nullable(),
  notes: z.string(),
  createdAt: instant,
});
export type Batch = z.infer<typeof batchSchema>;

/** `GET /api/roastery/days/:date/batches` (staff): the day's batches in the order they were recorded. */
export const batchListResponseSchema = z.object({ items: z.array(batchSchema) });
export type BatchListResponse = z.infer<typeof batchListResponseSchema>;
