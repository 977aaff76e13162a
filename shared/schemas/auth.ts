import { z } from 'zod';
import { roles } from '../domain/vocabulary';

// Password rules (OWASP ASVS 5.0 V6, NIST SP 800-63B): length is the only rule. No composition
// rules, never trimmed or truncated, any Unicode allowed, pasting allowed. Length counts Unicode
// code points, so "🔥" is one character. The common-password check needs a large list and runs on
// the server only.
export const PASSWORD_MIN_LENGTH = 8;
/** The form suggests this length; it is not enforced. */
export const PASSWORD_SUGGESTED_LENGTH = 15;
/** Far above the 64 characters ASVS asks us to accept; bounds the work one request can cause. */
export const PASSWORD_MAX_LENGTH = 256;

export const passwordLength = (password: string) => [...password].length;

/** A password someone is choosing (sign-up, reset, change, invitation). */
export const newPasswordSchema = z
  .string({ error: 'Choose a password.' })
  .refine((password) => passwordLength(password) >= PASSWORD_MIN_LENGTH, {
    message: `Use at least ${PASSWORD_MIN_LENGTH} characters; a short phrase of ${PASSWORD_SUGGESTED_LENGTH} or more is stronger.`,
  })
  .refine((password) => passwordLength(password) <= PASSWORD_MAX_LENGTH, {
    message: `Use at most ${PASSWORD_MAX_LENGTH} characters.`,
  });

/** A password someone already has: never judged by today's rules, only checked against its hash. */
export const currentPasswordSchema = z
  .string({ error: 'Enter your password.' })
  .min(1, 'Enter your password.')
  .max(4 * PASSWORD_MAX_LENGTH);

/** E-mail addresses are trimmed and stored lower-case, so Sam@Example.test and sam@example.test are one account. */
export const emailSchema = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .min(1, 'Enter your e-mail address.')
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email('Enter an e-mail address like name@example.com.'));

export const personNameSchema = z.string({ error: 'Enter your name.' }).trim().min(1, 'Enter your name.').max(100, 'Use at most 100 characters.');

/** Single-use tokens from e-mailed links (password reset, team invitation). */
export const linkTokenSchema = z.string({ error: 'This link is not complete.' }).regex(/^[\w-]{20,200}$/, 'This link is not complete.');

/** `POST /api/auth/sign-up` */
export const signUpSchema = z.object({
  email: emailSchema,
  password: newPasswordSchema,
  name: personNameSchema,
});
export type SignUpInput = z.infer<typeof signUpSchema>;

/** `POST /api/auth/sign-in` */
export const signInSchema = z.object({
  email: emailSchema,
  password: currentPasswordSchema,
});
export type SignInInput = z.infer<typeof signInSchema>;

/** `POST /api/auth/password-reset` → 202 always, whether or not the address has an account. */
export const passwordResetRequestSchema = z.object({ email: emailSchema });
export type PasswordResetRequest = z.infer<typeof passwordResetRequestSchema>;

/** `POST /api/auth/password-reset/confirm` → 204; every session of the account ends. */
export const passwordResetConfirmSchema = z.object({
  token: linkTokenSchema,
  password: newPasswordSchema,
});
export type PasswordResetConfirm = z.infer<typeof passwordResetConfirmSchema>;

export const userSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: z.enum(roles),
});
export type User = z.infer<typeof userSchema>;

/** Body of sign-up, sign-in, invitation acceptance and profile changes. */
export const userResponseSchema = z.object({ user: userSchema });
export type UserResponse = z.infer<typeof userResponseSchema>;

/** `GET /api/auth/me` → 200 with the user, or `user: null` for a visitor (asking is not an error). */
export const meResponseSchema = z.object({ user: userSchema.nullable() });
export type MeResponse = z.infer<typeof meResponseSchema>;

// E-mailed links carry their token in the URL fragment: browsers never send a fragment to a
// server, so the token reaches no access log and no Referer header.
export const passwordResetLinkPath = '/reset-password';
export const invitationLinkPath = '/join';

export function tokenLink(baseUrl: string, path: string, token: string): string {
  return `${baseUrl.replace(/\/+$/, '')}${path}#token=${encodeURIComponent(token)}`;
}

/** The token of an e-mailed link, read from `location.hash` ("#token=…"). */
export function tokenFromFragment(hash: string): string | undefined {
  return new URLSearchParams(hash.replace(/^#/, '')).get('token') ?? undefined;
}
