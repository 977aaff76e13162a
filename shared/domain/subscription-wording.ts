/**
 * What a subscriber is told about a change to their deliveries, in the same words on Deliveries
 * and in the e-mail. Every day they read is written out ("Monday, January 13, 2031"), never ISO.
 */
import type { IsoDate } from './shop-time';

const longDay = new Intl.DateTimeFormat('en-US', { weekday: 'long', month: 'long', day: 'numeric', year: 'numeric', timeZone: 'UTC' });

/** A shop-local day as a person reads it: "Monday, January 13, 2031". */
export function writtenDay(day: IsoDate): string {
  // Noon UTC of that day, formatted in UTC, is that day whatever the reader's own zone.
  return longDay.format(new Date(`${day}T12:00:00Z`));
}

export interface SkipOutcome {
  roastDate: IsoDate;
  /** The delivery a paid one's payment now pays for; absent when the skipped one was not paid. */
  paymentMovesTo?: IsoDate;
}

export function skipNotice({ roastDate, paymentMovesTo }: SkipOutcome): string {
  const skipped = `Skipped the delivery roasting ${writtenDay(roastDate)}.`;
  return paymentMovesTo
    ? `${skipped} It is already paid, so your payment moves to the delivery of ${writtenDay(paymentMovesTo)}.`
    : `${skipped} It will not be roasted, shipped or charged.`;
}

export interface UnskipOutcome {
  roastDate: IsoDate;
  /** The later delivery whose payment came back to this one; absent when none did. */
  paymentMovesFrom?: IsoDate;
}

export function unskipNotice({ roastDate, paymentMovesFrom }: UnskipOutcome): string {
  const back = `The delivery roasting ${writtenDay(roastDate)} is back on.`;
  return paymentMovesFrom
    ? `${back} Your payment moves back to it from the delivery of ${writtenDay(paymentMovesFrom)}.`
    : `${back} It is charged like any other delivery.`;
}

export interface PauseOutcome {
  until: IsoDate;
  /** Paid deliveries inside the pause that still roast and ship. */
  shipping: readonly IsoDate[];
  /** Paid deliveries inside the pause whose payment moved to a delivery after it. */
  held: readonly { from: IsoDate; to: IsoDate }[];
}

export function pauseNotice({ until, shipping, held }: PauseOutcome): string {
  const parts = [`Paused until ${writtenDay(until)}.`];
  for (const day of shipping) parts.push(`The paid delivery roasting ${writtenDay(day)} still roasts and ships.`);
  for (const { from, to } of held)
    parts.push(`The paid delivery roasting ${writtenDay(from)} is held: your payment moves to the delivery of ${writtenDay(to)}.`);
  return parts.join(' ');
}

/** The question Deliveries asks when a pause would cover a delivery already paid for. */
export function paidDeliveryInPauseQuestion(roastDate: IsoDate): string {
  return `The delivery roasting ${writtenDay(roastDate)} is already paid. Ship it as planned, or hold it for the first delivery after the pause?`;
}
