import Stripe from 'stripe';
import { describe, expect, it } from 'vitest';
import { signatureHeader } from '../../dev-services/stripe-fake/signature';
import { chargeOutcome, checkCardNumber } from '../../dev-services/stripe-fake/test-cards';
import { defaultRetryPolicy, retryDelayMs } from '../../dev-services/stripe-fake/webhook-sender';

const stripe = new Stripe('sk_test_unit');

describe('the Stripe fake signs webhooks', () => {
  const payload = JSON.stringify({ id: 'evt_unit', object: 'event', type: 'checkout.session.completed' }, null, 2);
  const secret = 'whsec_unit_secret';

  it('exactly as stripe-node computes a Stripe-Signature header', () => {
    const timestamp = 1_800_000_000;
    expect(signatureHeader(payload, secret, timestamp)).toBe(stripe.webhooks.generateTestHeaderString({ payload, secret, timestamp }));
  });

  it('so that constructEvent accepts it within 300 s and refuses it after', () => {
    const now = Math.floor(Date.now() / 1000);
    expect(stripe.webhooks.constructEvent(payload, signatureHeader(payload, secret, now), secret, 300).id).toBe('evt_unit');
    expect(() => stripe.webhooks.constructEvent(payload, signatureHeader(payload, secret, now - 301), secret, 300)).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
    expect(() => stripe.webhooks.constructEvent(payload, signatureHeader(payload, 'whsec_other', now), secret, 300)).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
  });
});

describe('the Stripe fake retries a webhook the endpoint did not accept', () => {
  it('after 1 s, then twice as long each time, never longer than a minute', () => {
    expect([1, 2, 3, 4, 5, 6, 7, 8].map((failed) => retryDelayMs(defaultRetryPolicy, failed))).toEqual([
      1000, 2000, 4000, 8000, 16_000, 32_000, 60_000, 60_000,
    ]);
  });
});

describe("the Stripe fake's test cards (Stripe docs, Testing)", () => {
  it('pays with 4242 4242 4242 4242 and declines 4000 0000 0000 0002', () => {
    expect(chargeOutcome('4242 4242 4242 4242')).toBeNull();
    expect(chargeOutcome('4000 0000 0000 0002')).toMatchObject({ code: 'card_declined', declineCode: 'generic_decline' });
    expect(chargeOutcome('4000000000009995')).toMatchObject({ declineCode: 'insufficient_funds' });
  });

  it('saves 4000 0000 0000 0341 to a customer, then fails every charge to it', () => {
    expect(checkCardNumber('4000000000000341')).toMatchObject({ ok: true, last4: '0341' });
    expect(chargeOutcome('4000000000000341')).toMatchObject({ code: 'card_declined' });
  });

  it('refuses a mistyped number and a number that is not a test card', () => {
    expect(checkCardNumber('4242 4242 4242 4241')).toMatchObject({ ok: false, decline: { code: 'incorrect_number' } });
    // Passes the Luhn check, but is no test card: test mode takes test cards only.
    expect(checkCardNumber('4111 1111 1111 1111')).toMatchObject({ ok: false, decline: { code: 'card_declined' } });
  });
});
