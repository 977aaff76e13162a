// Saved test cards and the charges made on them.
import { newId } from '../store';
import type { Charge, Metadata, PaymentIntent, PaymentMethod } from '../stripe-objects';
import { chargeOutcome, checkCardNumber, normalizeCardNumber } from '../test-cards';
import type { AccountContext } from './context';

export interface CardDetails {
  number: string;
  expMonth: number;
  expYear: number;
  cvc: string;
}

export function savePaymentMethod({ state, now }: AccountContext, card: CardDetails, customer: string | null): PaymentMethod {
  const check = checkCardNumber(card.number);
  if (!check.ok) throw new Error('savePaymentMethod needs a known test card');
  const method: PaymentMethod = {
    id: newId('pm'),
    object: 'payment_method',
    type: 'card',
    card: { brand: check.brand, last4: check.last4, exp_month: card.expMonth, exp_year: card.expYear },
    customer,
    created: now(),
    livemode: false,
  };
  state.paymentMethods[method.id] = method;
  state.cardNumbers[method.id] = normalizeCardNumber(card.number);
  return method;
}

/** Charges a saved card: a payment intent and a charge, succeeded or failed. */
export function charge(
  { state, now }: AccountContext,
  amount: number,
  currency: string,
  paymentMethod: PaymentMethod,
  customer: string | null,
  metadata: Metadata,
) {
  const decline = chargeOutcome(state.cardNumbers[paymentMethod.id] ?? '');
  const intent: PaymentIntent = {
    id: newId('pi'),
    object: 'payment_intent',
    amount,
    amount_received: decline ? 0 : amount,
    currency,
    customer,
    latest_charge: null,
    last_payment_error: decline
      ? { type: 'card_error', code: decline.code, message: decline.message, ...(decline.declineCode ? { decline_code: decline.declineCode } : {}) }
      : null,
    metadata,
    payment_method: paymentMethod.id,
    status: decline ? 'requires_payment_method' : 'succeeded',
    created: now(),
    livemode: false,
  };
  const chargeObject: Charge = {
    id: newId('ch'),
    object: 'charge',
    amount,
    amount_captured: decline ? 0 : amount,
    amount_refunded: 0,
    captured: !decline,
    currency,
    customer,
    failure_code: decline?.code ?? null,
    failure_message: decline?.message ?? null,
    metadata: {},
    paid: !decline,
    payment_intent: intent.id,
    payment_method: paymentMethod.id,
    refunded: false,
    status: decline ? 'failed' : 'succeeded',
    created: now(),
    livemode: false,
  };
  intent.latest_charge = chargeObject.id;
  state.paymentIntents[intent.id] = intent;
  state.charges[chargeObject.id] = chargeObject;
  return { intent, decline };
}
