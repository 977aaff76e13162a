import { z } from 'zod';
import { parseClock } from '../domain/journal';
import { journalEntryProblems } from '../domain/roast-metrics';
import { homeRoastDevices, roastLevels } from '../domain/vocabulary';
import { instant, isoDate } from './dates';

const seconds = (what: string) =>
  z
    .number({ error: `Enter the time to ${what}.` })
    .int(`Enter the time to ${what} in whole seconds.`)
    .min(1, `The time to ${what} must be after the start.`)
    .max(3600, 'A home roast lasts under an hour; check the time.');

const journalEntryFields = z.object({
  lotCode: z.string({ error: 'Choose a lot.' }).trim().min(1, 'Choose a lot.').max(40),
  device: z.enum(homeRoastDevices, { error: 'Choose the device you roasted on.' }),
  /** The day of the roast; today in the shop's time zone when left out. */
  roastedOn: isoDate('roast date').optional(),
  greenGrams: z
    .number({ error: 'Enter the green weight in grams.' })
    .int('Enter whole grams.')
    .min(1, 'Enter more than 0 g.')
    .max(5000, 'A home batch is under 5 kg.'),
  roastedGrams: z
    .number({ error: 'Enter the roasted weight in grams.' })
    .int('Enter whole grams.')
    .min(1, 'Enter more than 0 g.')
    .max(5000, 'A home batch is under 5 kg.'),
  yellowSeconds: seconds('yellow').optional(),
  firstCrackSeconds: seconds('first crack').optional(),
  endSeconds: seconds('the end'),
  levelReached: z.enum(roastLevels, { error: 'Choose a roast level.' }).optional(),
  notes: z.string().max(2000, 'Keep notes under 2,000 characters.').optional(),
});

/** Adds the trade engine's checks (roasted lighter than green, yellow → first crack → end in order) to the right fields. */
function refuseImpossibleRoast(entry: z.infer<typeof journalEntryFields>, context: z.RefinementCtx): void {
  for (const [path, message] of Object.entries(journalEntryProblems(entry))) context.addIssue({ code: 'custom', path: [path], message });
}

/** `POST /api/journal` and `PUT /api/journal/:id`: one home roast, times in seconds from the charge. */
export const journalEntryInputSchema = journalEntryFields.superRefine(refuseImpossibleRoast);
export type JournalEntryInput = z.infer<typeof journalEntryInputSchema>;

const optionalClock = (what: string) =>
  z
    .string()
    .trim()
    .refine((text) => text === '' || parseClock(text) !== undefined, `Write the time to ${what} as m:ss, like 3:05.`)
    .transform((text) => (text === '' ? undefined : parseClock(text)));

/** The journal form: the same entry, times typed as m:ss and weights as text; parses to the API body. */
export const journalFormSchema = z
  .object({
    lotCode: journalEntryFields.shape.lotCode,
    device: journalEntryFields.shape.device,
    roastedOn: isoDate('roast date'),
    greenGrams: z.coerce.number<string>({ error: 'Enter the green weight in grams.' }).pipe(journalEntryFields.shape.greenGrams),
    roastedGrams: z.coerce.number<string>({ error: 'Enter the roasted weight in grams.' }).pipe(journalEntryFields.shape.roastedGrams),
    yellowSeconds: optionalClock('yellow'),
    firstCrackSeconds: optionalClock('first crack'),
    endSeconds: z
      .string()
      .trim()
      .refine((text) => parseClock(text) !== undefined, 'Write the end time as m:ss, like 3:25.')
      .transform((text) => parseClock(text) as number),
    levelReached: z.union([z.enum(roastLevels), z.literal('')]).transform((level) => (level === '' ? undefined : level)),
    notes: journalEntryFields.shape.notes,
  })
  .superRefine(refuseImpossibleRoast);
export type JournalFormValues = z.input<typeof journalFormSchema>;

export const guideComparisonSchema = z.object({
  suggestedLevel: z.enum(roastLevels),
  level: z.enum(roastLevels),
  levelComparedWithSuggestion: z.enum(['lighter', 'same', 'darker']),
  guide: z
    .object({ afterFirstCrackSeconds: z.object({ min: z.number().int(), max: z.number().int() }), position: z.enum(['short', 'within', 'past']) })
    .optional(),
  message: z.string(),
});

/** What Restday works out from one roast: the `POST /api/journal` answer, and part of every listed entry. */
export const journalMetricsSchema = z.object({
  lossPct: z.number(),
  developmentSeconds: z.number().int().optional(),
  developmentTimeRatio: z.number().optional(),
  estimatedLevel: z.enum(roastLevels),
  comparison: guideComparisonSchema,
});

export const journalEntryCreatedSchema = journalMetricsSchema.extend({ id: z.uuid() });
export type JournalEntryCreated = z.infer<typeof journalEntryCreatedSchema>;

export const journalEntrySchema = journalMetricsSchema.extend({
  id: z.uuid(),
  lotCode: z.string(),
  lotName: z.string(),
  device: z.enum(homeRoastDevices),
  roastedOn: z.string(),
  greenGrams: z.number().int(),
  roastedGrams: z.number().int(),
  yellowSeconds: z.number().int().optional(),
  firstCrackSeconds: z.number().int().optional(),
  endSeconds: z.number().int(),
  levelReached: z.enum(roastLevels).optional(),
  notes: z.string(),
  createdAt: instant,
});
export type JournalEntry = z.infer<typeof journalEntrySchema>;

/** `GET /api/journal?lotCode&device`: the customer's own roasts, newest first. */
export const journalListQuerySchema = z.object({
  lotCode: z.string().trim().min(1).max(40).optional(),
  device: z.enum(homeRoastDevices, { error: 'Choose one of the devices.' }).optional(),
});
export type JournalListQuery = z.infer<typeof journalListQuerySchema>;

export const journalListResponseSchema = z.object({
  items: z.array(journalEntrySchema),
  /** Lots the customer may log a roast of: the ones they bought first, then every listed lot. */
  lots: z.array(z.object({ code: z.string(), name: z.string(), bought: z.boolean() })),
});
export type JournalListResponse = z.infer<typeof journalListResponseSchema>;

export const journalEntryParamsSchema = z.object({ id: z.uuid('No such journal entry.') });
