import { dictionary } from '@zxcvbn-ts/language-common';
import { AppError } from '../../lib/app-error';

/**
 * Common passwords: the `passwords-common` list of @zxcvbn-ts/language-common 4.1.3 (MIT), about
 * 49,000 passwords ranked by frequency in Mark Burnett's public ten-million-password corpus (2015),
 * lower-cased by the list's makers. Checked on the server only: the list is too large for the client.
 */
const commonPasswords: ReadonlySet<string> = new Set(dictionary['passwords-common']);

export const commonPasswordCount = commonPasswords.size;

/** Words a guesser tries first against this shop's accounts (ASVS 5.0 V6.2.11). */
const serviceWords = ['restday', 'roastery', 'coffee', 'greencoffee'];

const lettersOnly = (text: string) => text.toLowerCase().replace(/[^\p{L}]/gu, '');

export interface PasswordOwner {
  email: string;
  name?: string;
}

/** Why a password that meets the length rule is still refused, or undefined when it is fine. */
function passwordProblem(password: string, owner: PasswordOwner): string | undefined {
  const lower = password.toLowerCase();
  if (commonPasswords.has(lower)) {
    return 'This password appears on lists of common passwords that attackers try first. Choose another.';
  }
  // "Restday2024!" or "Jane.Doe1" are a known word dressed up with digits and symbols.
  const [localPart = ''] = owner.email.toLowerCase().split('@');
  const contextWords = [...serviceWords, lettersOnly(localPart), lettersOnly(owner.name ?? '')].filter((word) => word.length >= 3);
  const letters = lettersOnly(password);
  if (lower === owner.email.toLowerCase() || contextWords.includes(letters)) {
    return 'This password is too easy to guess from your name, your e-mail address or the shop. Choose another.';
  }
  return undefined;
}

/** Throws a 400 naming `field` when the password is common or guessable from its context. */
export function assertAcceptablePassword(password: string, owner: PasswordOwner, field = 'password'): void {
  const problem = passwordProblem(password, owner);
  if (problem) throw new AppError(400, 'weak_password', problem, { [field]: problem });
}
