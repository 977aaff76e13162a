import { z } from 'zod';
import { postalAddressInputSchema, postalAddressSchema } from './address';
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

/** A shipping address as a customer enters it (`POST /api/account/addresses`, `PUT /api/account/addresses/:id`). */
export const addressInputSchema = postalAddressInputSchema.extend({
  /** The address checkout offers first; at most one per account. */
  isDefault: z.boolean().default(false),
});
export type AddressInput = z.infer<typeof addressInputSchema>;

export const addressSchema = postalAddressSchema.extend({ id: z.uuid(), isDefault: z.boolean() });
export type Address = z.infer<typeof addressSchema>;

/** `GET /api/account/addresses` → the default address first. */
export const addressListResponseSchema = z.object({ items: z.array(addressSchema) });
export type AddressListResponse = z.infer<typeof addressListResponseSchema>;
