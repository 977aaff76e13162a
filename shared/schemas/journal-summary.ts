import { z } from 'zod';
import { roastLevels } from '../domain/vocabulary';

// Apart from the journal's own shapes, so the lot page reads it without the journal's checks.
const levelRow = z.object({ level: z.enum(roastLevels), roasts: z.number().int() });

/**
 * `GET /api/roastery/lots/:code/journal-summary` (staff) and `GET /api/lots/:code/home-roasts`
 * (public): anonymous figures, null below the minimum roasts and customers.
 */
export const lotRoastSummaryResponseSchema = z.object({
  lotCode: z.string(),
  suggestedLevel: z.enum(roastLevels),
  /** The fewest roasts, by the fewest customers, any figure is shown from. */
  minimum: z.object({ roasts: z.number().int(), customers: z.number().int() }),
  summary: z
    .object({
      roasts: z.number().int(),
      customers: z.number().int(),
      medianLossPct: z.number(),
      medianDevelopmentSeconds: z.number().int().nullable(),
      levels: z.array(levelRow),
      disagreement: z.object({ roasts: z.number().int(), customers: z.number().int(), mostly: z.enum(['lighter', 'darker']) }).nullable(),
    })
    .nullable(),
});
export type LotRoastSummaryResponse = z.infer<typeof lotRoastSummaryResponseSchema>;
