import { z } from 'zod';

const addressLine = (what: string, max: number) =>
  z
    .string({ error: `Enter the ${what}.` })
    .trim()
    .min(1, `Enter the ${what}.`)
    .max(max, `Use at most ${max} characters.`);

/** The fields of a postal address, in the order a form and a label show them. */
export const postalAddressFields = ['name', 'line1', 'line2', 'city', 'region', 'postalCode', 'country'] as const;
export type PostalAddressField = (typeof postalAddressFields)[number];

/** A postal address as a customer enters it: at checkout, for a subscription, in the address book. */
export const postalAddressInputSchema = z.object({
  name: addressLine('name of the person receiving the parcel', 100),
  line1: addressLine('street address', 200),
  line2: z
    .string()
    .trim()
    .max(200, 'Use at most 200 characters.')
    .nullish()
    .transform((line) => line || null),
  city: addressLine('city or town', 100),
  region: addressLine('state or region', 100),
  postalCode: addressLine('postal code', 20),
  /** ISO 3166-1 alpha-2. */
  country: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{2}$/, 'Use the two-letter country code, like US.')
    .default('US'),
});
export type PostalAddressInput = z.infer<typeof postalAddressInputSchema>;

/**
 * A postal address as Restday keeps and sends it: an address-book entry, or the copy an order or a
 * subscription holds (later edits to the address book do not move a paid order). Without a second
 * line it reads `line2: null`; copies written before that rule may lack the key, and read the same.
 */
export const postalAddressSchema = z.object({
  name: z.string(),
  line1: z.string(),
  line2: z
    .string()
    .nullish()
    .transform((line) => line ?? null),
  city: z.string(),
  region: z.string(),
  postalCode: z.string(),
  country: z.string(),
});
export type PostalAddress = z.infer<typeof postalAddressSchema>;
/** What a stored copy may hold (a missing second line included), as the database column types it. */
export type StoredPostalAddress = z.input<typeof postalAddressSchema>;
