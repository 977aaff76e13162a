import { PASSWORD_MIN_LENGTH, PASSWORD_SUGGESTED_LENGTH } from '@shared/schemas/auth';

/** What a new password needs (length, nothing else) and what makes it stronger. */
export function NewPasswordHint() {
  return (
    <>
      At least {PASSWORD_MIN_LENGTH} characters. {PASSWORD_SUGGESTED_LENGTH} or more is better: a few unrelated words make a strong password you can remember.
      Pasting from a password manager works.
    </>
  );
}
