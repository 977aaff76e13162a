import { z } from 'zod';
import { isIsoDate } from '../domain/shop-time';

/** The days Restday plans and reports on; outside them a date is a typo, and loops over days stay short. */
export const earliestDate = '2000-01-01';
export const latestDate = '2100-12-31';

/** A calendar day (`YYYY-MM-DD`) that exists, between 2000 and 2100: the one schema for a date in the API. */
export const isoDate = (what: string) =>
  z
    .string({ error: `Enter a ${what}.` })
    .refine(isIsoDate, { message: `Use a ${what} like 2026-12-01.`, abort: true })
    .refine((date) => date >= earliestDate && date <= latestDate, `Use a ${what} between 2000 and 2100.`);

/** A UTC instant as the API writes it: ISO 8601 with an offset (`2026-12-03T16:15:00.000Z`). */
export const instant = z.iso.datetime({ offset: true });

/**
 * The four shop days a bag of roasted coffee is planned by: roasted, shipped, ready to brew (rested
 * enough), best before.
 */
export const roastDatesSchema = z.object({
  roastDate: z.string(),
  shipDate: z.string(),
  readyFrom: z.string(),
  bestBefore: z.string(),
});

/** The same block where it may not be planned yet (green coffee, or no roast day): each day or null. */
export const roastDatesOrNullSchema = z.object({
  roastDate: z.string().nullable(),
  shipDate: z.string().nullable(),
  readyFrom: z.string().nullable(),
  bestBefore: z.string().nullable(),
});

/** For checks across fields: both are days the schema above accepts (else that field's own message stands). */
export function areValidDates(...dates: readonly (string | undefined)[]): boolean {
  return dates.every((date) => date !== undefined && isIsoDate(date) && date >= earliestDate && date <= latestDate);
}
