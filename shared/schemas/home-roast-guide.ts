import { z } from 'zod';
import type { HomeRoastGuide } from '../domain/home-roast-guide';
import { homeRoastDevices, roastLevels } from '../domain/vocabulary';

const range = z.object({ min: z.number().int(), max: z.number().int() });

/** `GET /api/lots/:code/roast-guide` → the Home Roast Guide the trade engine computes. */
export const homeRoastGuideSchema = z.object({
  device: z.enum(homeRoastDevices),
  deviceName: z.string(),
  level: z.enum(roastLevels),
  greenGrams: z.number().int(),
  batchGrams: range,
  batches: z.number().int(),
  batchLoads: z.array(z.number().int()),
  expectedLossPct: z.object({ min: z.number(), max: z.number(), default: z.number() }),
  expectedRoastedGrams: z.object({ min: z.number().int(), max: z.number().int(), default: z.number().int() }),
  firstCrackSeconds: z.number().int(),
  phases: z.array(z.object({ name: z.string(), cue: z.string() })),
  afterFirstCrackSeconds: range,
  levels: z.array(z.object({ level: z.enum(roastLevels), afterFirstCrackSeconds: range, suggested: z.boolean() })),
  notes: z.array(z.string()),
  cautions: z.array(z.string()),
  source: z.string(),
}) satisfies z.ZodType<HomeRoastGuide>;
export type HomeRoastGuideResponse = z.infer<typeof homeRoastGuideSchema>;
