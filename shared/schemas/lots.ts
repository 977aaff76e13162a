import { z } from 'zod';
import { isRoastGuideDevice, roastGuideDevices } from '../domain/home-roast-guide';
import { processes, roastLevels, stockMovementReasons } from '../domain/vocabulary';

const booleanFlag = z.enum(['true', 'false', '1', '0']).transform((value) => value === 'true' || value === '1');

const pricePerKgBound = z.coerce
  .number({ error: 'must be a whole number of cents per kg' })
  .int('must be a whole number of cents per kg')
  .min(0, 'must not be negative')
  .max(10_000_000, 'must be at most 10000000');

/** How `GET /api/lots` orders its items; `origin` (then name) when none is asked for. */
export const lotSorts = ['origin', 'name', 'price-asc', 'price-desc', 'newest', 'altitude'] as const;
export type LotSort = (typeof lotSorts)[number];

/** Query string of `GET /api/lots`. Prices are the lot's list price per kg, bounds inclusive. */
export const lotListQuerySchema = z
  .object({
    q: z.string().trim().max(100).optional(),
    origin: z.string().trim().max(60).optional(),
    process: z.enum(processes).optional(),
    level: z.enum(roastLevels).optional(),
    inStock: booleanFlag.optional(),
    minPricePerKgCents: pricePerKgBound.optional(),
    maxPricePerKgCents: pricePerKgBound.optional(),
    sort: z.enum(lotSorts).optional(),
  })
  .refine((query) => query.minPricePerKgCents === undefined || query.maxPricePerKgCents === undefined || query.minPricePerKgCents <= query.maxPricePerKgCents, {
    path: ['minPricePerKgCents'],
    message: 'must not be more than maxPricePerKgCents',
  });
export type LotListQuery = z.infer<typeof lotListQuerySchema>;

export const lotSummarySchema = z.object({
  code: z.string(),
  name: z.string(),
  origin: z.string(),
  region: z.string(),
  process: z.enum(processes),
  variety: z.string(),
  altitudeM: z.number().int(),
  cropYear: z.number().int(),
  suggestedLevel: z.enum(roastLevels),
  tastingNotes: z.array(z.string()),
  cuppingScore: z.number().nullable(),
  stockGrams: z.number().int(),
  pricePerKgCents: z.number().int(),
  photoUrl: z.string().nullable(),
});
export type LotSummary = z.infer<typeof lotSummarySchema>;

export const lotListResponseSchema = z.object({ items: z.array(lotSummarySchema) });
export type LotListResponse = z.infer<typeof lotListResponseSchema>;

export const priceBreakSchema = z.object({
  minGrams: z.number().int().positive(),
  pricePerKgCents: z.number().int().positive(),
});

export const lotDetailSchema = lotSummarySchema.omit({ photoUrl: true }).extend({
  producer: z.string(),
  moisturePct: z.number(),
  densityGPerL: z.number().int().nullable(),
  screenSize: z.string().nullable(),
  description: z.string(),
  allowedLevels: z.array(z.enum(roastLevels)),
  priceBreaks: z.array(priceBreakSchema),
  photos: z.array(z.string()),
  specSheetUrl: z.string().nullable(),
});
export type LotDetail = z.infer<typeof lotDetailSchema>;

/** Query string of `GET /api/lots/:code/roast-guide`; the level defaults to the lot's suggestion. */
export const roastGuideQuerySchema = z.object({
  device: z
    .string()
    .default('popper')
    .refine(isRoastGuideDevice, { message: `must be one of: ${roastGuideDevices.join(', ')}` }),
  level: z.enum(roastLevels).optional(),
  greenGrams: z.coerce.number().int('must be whole grams').min(1).max(100_000).default(454),
});
export type RoastGuideQuery = z.infer<typeof roastGuideQuerySchema>;

/** Stock reasons staff may give by hand; sales, roasts and refunds move stock through their own flows. */
export const stockAdjustmentReasons = ['arrival', 'sample', 'loss', 'count'] as const;

const lotText = (max: number) => z.string().trim().min(1, 'is required').max(max);
const optionalLotText = (max: number) => z.string().trim().max(max);

/** Every descriptor staff set on a lot, without defaults (a PATCH must leave out what it does not change). */
const lotFieldsSchema = z.object({
  code: z
    .string()
    .trim()
    .regex(/^[A-Z0-9][A-Z0-9-]{1,39}$/, 'use 2 to 40 capital letters, digits and hyphens, e.g. WR-26-ETH-01'),
  name: lotText(120),
  origin: lotText(60),
  region: lotText(80),
  producer: lotText(120),
  variety: lotText(80),
  process: z.enum(processes),
  altitudeM: z.number().int('must be whole metres').min(0).max(3500),
  cropYear: z.number().int().min(1990).max(2100),
  moisturePct: z.number().min(0).max(20).multipleOf(0.01, 'use at most two decimals'),
  densityGPerL: z.number().int('must be whole grams per litre').positive().max(2000).nullable(),
  screenSize: optionalLotText(20).nullable(),
  cuppingScore: z.number().min(0).max(100).multipleOf(0.01, 'use at most two decimals').nullable(),
  tastingNotes: z.array(lotText(40)).max(12),
  description: optionalLotText(4000),
  suggestedLevel: z.enum(roastLevels),
  allowedLevels: z.array(z.enum(roastLevels)).min(1, 'choose at least one level'),
  pricePerKgCents: z.number().int('must be whole cents').positive().max(10_000_000),
  priceBreaks: z.array(priceBreakSchema).max(10),
  reorderPointGrams: z.number().int('must be whole grams').min(0).max(10_000_000),
  isListed: z.boolean(),
});

/**
 * Days from ordering more from the supplier to the coffee on the shelf; green planning's reorder-by
 * day is the run-out day less this. A new lot starts at two weeks (the column's default), set on
 * its Green Stock page.
 */
const supplierLeadTimeDays = z.number().int('must be whole days').min(0, 'must be 0 days or more').max(365, 'must be at most 365 days');

type LotFields = z.infer<typeof lotFieldsSchema>;
type LotConsistencyFields = Pick<LotFields, 'suggestedLevel' | 'allowedLevels' | 'pricePerKgCents' | 'priceBreaks'>;

/**
 * Problems between fields, by field: the suggested level must be allowed, levels listed once, and
 * each price break must start at its own weight and cost less per kg than the list price.
 */
export function lotConsistencyProblems(lot: Partial<LotConsistencyFields>): Record<string, string> {
  const problems: Record<string, string> = {};
  if (lot.allowedLevels && new Set(lot.allowedLevels).size !== lot.allowedLevels.length) {
    problems.allowedLevels = 'lists a level more than once';
  }
  if (lot.allowedLevels && lot.suggestedLevel && !lot.allowedLevels.includes(lot.suggestedLevel)) {
    problems.suggestedLevel = 'must be one of the allowed levels';
  }
  if (lot.priceBreaks) {
    const weights = lot.priceBreaks.map((priceBreak) => priceBreak.minGrams);
    if (new Set(weights).size !== weights.length) problems.priceBreaks = 'has two breaks at the same weight';
    else if (lot.pricePerKgCents !== undefined && lot.priceBreaks.some((priceBreak) => priceBreak.pricePerKgCents >= lot.pricePerKgCents!)) {
      problems.priceBreaks = 'each break must cost less per kg than the list price';
    }
  }
  return problems;
}

function refineConsistency(lot: Partial<LotConsistencyFields>, context: z.RefinementCtx) {
  for (const [field, message] of Object.entries(lotConsistencyProblems(lot))) {
    context.addIssue({ code: 'custom', path: [field], message });
  }
}

/** Body of `POST /api/lots` (staff). Stock starts at zero; arrivals are stock adjustments. */
export const lotCreateSchema = lotFieldsSchema
  .extend({
    densityGPerL: lotFieldsSchema.shape.densityGPerL.default(null),
    screenSize: lotFieldsSchema.shape.screenSize.default(null),
    cuppingScore: lotFieldsSchema.shape.cuppingScore.default(null),
    tastingNotes: lotFieldsSchema.shape.tastingNotes.default([]),
    description: lotFieldsSchema.shape.description.default(''),
    priceBreaks: lotFieldsSchema.shape.priceBreaks.default([]),
    reorderPointGrams: lotFieldsSchema.shape.reorderPointGrams.default(0),
    isListed: lotFieldsSchema.shape.isListed.default(true),
  })
  .superRefine(refineConsistency);
export type LotCreate = z.infer<typeof lotCreateSchema>;

/** Body of `PATCH /api/lots/:code` (staff): any descriptor but the code; the merged lot is checked again. */
export const lotUpdateSchema = lotFieldsSchema
  .omit({ code: true })
  .extend({ supplierLeadTimeDays })
  .partial()
  .refine((patch) => Object.keys(patch).length > 0, { message: 'change at least one field' })
  .superRefine(refineConsistency);
export type LotUpdate = z.infer<typeof lotUpdateSchema>;

/** What staff see of a lot after creating or changing it: the public detail plus the Roastery's fields. */
export const lotStaffDetailSchema = lotDetailSchema.extend({
  reorderPointGrams: z.number().int(),
  supplierLeadTimeDays: z.number().int(),
  isListed: z.boolean(),
});
export type LotStaffDetail = z.infer<typeof lotStaffDetailSchema>;

/** Answer to `POST /api/lots/:code/photos` and `/spec-sheet`. */
export const lotFileSchema = z.object({
  id: z.string(),
  kind: z.enum(['photo', 'spec_sheet']),
  url: z.string(),
  contentType: z.string(),
  byteSize: z.number().int(),
});
export type LotFile = z.infer<typeof lotFileSchema>;

/** Body of `POST /api/lots/:code/stock-adjustments`: arrivals add, samples and losses take away, counts go either way. */
export const stockAdjustmentSchema = z
  .object({
    deltaGrams: z
      .number()
      .int('must be whole grams')
      .min(-10_000_000)
      .max(10_000_000)
      .refine((grams) => grams !== 0, 'must not be zero'),
    reason: z.enum(stockAdjustmentReasons),
    note: z.string().trim().max(500).default(''),
  })
  .superRefine((adjustment, context) => {
    if (adjustment.reason === 'arrival' && adjustment.deltaGrams < 0) {
      context.addIssue({ code: 'custom', path: ['deltaGrams'], message: 'an arrival adds stock' });
    }
    if ((adjustment.reason === 'sample' || adjustment.reason === 'loss') && adjustment.deltaGrams > 0) {
      context.addIssue({ code: 'custom', path: ['deltaGrams'], message: `a ${adjustment.reason} takes stock away` });
    }
  });
export type StockAdjustment = z.infer<typeof stockAdjustmentSchema>;

export const stockAdjustmentResponseSchema = z.object({ stockGrams: z.number().int() });
export type StockAdjustmentResponse = z.infer<typeof stockAdjustmentResponseSchema>;

/** `GET /api/lots/:code/stock-movements` (staff): the lot's stock history, newest first. */
export const stockMovementSchema = z.object({
  id: z.string(),
  deltaGrams: z.number().int(),
  reason: z.enum(stockMovementReasons),
  note: z.string(),
  orderId: z.string().nullable(),
  batchId: z.string().nullable(),
  actorName: z.string().nullable(),
  createdAt: z.string(),
});
export const stockMovementListResponseSchema = z.object({ items: z.array(stockMovementSchema) });
export type StockMovementListResponse = z.infer<typeof stockMovementListResponseSchema>;
