import { z } from 'zod';
import { isRoastGuideDevice, roastGuideDevices } from '../domain/home-roast-guide';
import { processes, roastLevels } from '../domain/vocabulary';

const booleanFlag = z
  .enum(['true', 'false', '1', '0'])
  .transform((value) => value === 'true' || value === '1');

/** Query string of `GET /api/lots`. */
export const lotListQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  origin: z.string().trim().max(60).optional(),
  process: z.enum(processes).optional(),
  level: z.enum(roastLevels).optional(),
  inStock: booleanFlag.optional(),
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
