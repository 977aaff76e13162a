import { z } from 'zod';
import { currentPasswordSchema, emailSchema, newPasswordSchema, personNameSchema } from './auth';

/** `PATCH /api/account/profile` → 200 {user} */
export const profileUpdateSchema = z.object({ name: personNameSchema });
export type ProfileUpdate = z.infer<typeof profileUpdateSchema>;

/** `PUT /api/account/email` → 200 {user}; the current password proves it is really the account's holder. */
export const emailChangeSchema = z.object({
  email: emailSchema,
  currentPassword: currentPasswordSchema,
});
export type EmailChange = z.infer<typeof emailChangeSchema>;

/**
 * `PUT /api/account/password` → 204. Every session of the account ends, this one included; the
 * response sets a fresh session cookie so the person who changed it stays signed in.
 */
export const passwordChangeSchema = z.object({
  currentPassword: currentPasswordSchema,
  newPassword: newPasswordSchema,
});
export type PasswordChange = z.infer<typeof passwordChangeSchema>;

const addressLine = (what: string, max: number) =>
  z.string({ error: `Enter the ${what}.` }).trim().min(1, `Enter the ${what}.`).max(max, `Use at most ${max} characters.`);

/** A shipping address as a customer enters it (`POST /api/account/addresses`, `PUT /api/account/addresses/:id`). */
export const addressInputSchema = z.object({
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
  /** The address checkout offers first; at most one per account. */
  isDefault: z.boolean().default(false),
});
export type AddressInput = z.infer<typeof addressInputSchema>;

export const addressSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  line1: z.string(),
  line2: z.string().nullable(),
  city: z.string(),
  region: z.string(),
  postalCode: z.string(),
  country: z.string(),
  isDefault: z.boolean(),
});
export type Address = z.infer<typeof addressSchema>;

/** `GET /api/account/addresses` → the default address first. */
export const addressListResponseSchema = z.object({ items: z.array(addressSchema) });
export type AddressListResponse = z.infer<typeof addressListResponseSchema>;
