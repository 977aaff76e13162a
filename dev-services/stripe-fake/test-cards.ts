// Stripe's published test card numbers and what each does (Stripe docs, Testing). Any other number
// is refused, as Stripe's test mode refuses real cards.

export interface CardDecline {
  code: string;
  declineCode?: string;
  message: string;
}

interface TestCard {
  brand: string;
  /** Why a charge fails; absent when it succeeds. */
  decline?: CardDecline;
}

const declined = (declineCode: string, message: string): CardDecline => ({ code: 'card_declined', declineCode, message });

const testCards: Record<string, TestCard> = {
  '4242424242424242': { brand: 'visa' },
  '4000056655665556': { brand: 'visa' },
  '5555555555554444': { brand: 'mastercard' },
  '378282246310005': { brand: 'amex' },
  '4000000000000002': { brand: 'visa', decline: declined('generic_decline', 'Your card was declined.') },
  '4000000000009995': { brand: 'visa', decline: declined('insufficient_funds', 'Your card has insufficient funds.') },
  '4000000000000069': { brand: 'visa', decline: { code: 'expired_card', message: 'Your card has expired.' } },
  // Saves to a customer, then every charge to it fails: the card for failed renewals.
  '4000000000000341': { brand: 'visa', decline: declined('generic_decline', 'Your card was declined.') },
};

export const succeedingTestCard = '4242424242424242';
export const decliningTestCard = '4000000000000002';

export function normalizeCardNumber(input: string): string {
  return input.replace(/[\s-]/g, '');
}

function passesLuhn(digits: string): boolean {
  let sum = 0;
  for (let index = 0; index < digits.length; index++) {
    let digit = Number(digits[digits.length - 1 - index]);
    if (index % 2 === 1) {
      digit *= 2;
      if (digit > 9) digit -= 9;
    }
    sum += digit;
  }
  return sum % 10 === 0;
}

export type CardCheck = { ok: true; brand: string; last4: string } | { ok: false; decline: CardDecline };

/** Whether a number can be saved at all (a known test card); charging it is `chargeOutcome`. */
export function checkCardNumber(input: string): CardCheck {
  const number = normalizeCardNumber(input);
  if (!/^\d{13,19}$/.test(number) || !passesLuhn(number)) {
    return { ok: false, decline: { code: 'incorrect_number', message: 'Your card number is incorrect.' } };
  }
  const card = testCards[number];
  if (!card) {
    return { ok: false, decline: declined('test_mode_live_card', 'Your card was declined: this is a test payment, so only test card numbers work.') };
  }
  return { ok: true, brand: card.brand, last4: number.slice(-4) };
}

/** The decline a charge to this card meets, or null when it is paid. */
export function chargeOutcome(input: string): CardDecline | null {
  const check = checkCardNumber(input);
  if (!check.ok) return check.decline;
  return testCards[normalizeCardNumber(input)]?.decline ?? null;
}
