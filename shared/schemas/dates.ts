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

/** For checks across fields: both are days the schema above accepts (else that field's own message stands). */
export function areValidDates(...dates: readonly (string | undefined)[]): boolean {
  return dates.every((date) => date !== undefined && isIsoDate(date) && date >= earliestDate && date <= latestDate);
}
