/**
 * What each e-mail needs, one zod schema per template. `queueEmail` checks a payload against its
 * schema before writing the outbox row, and the relay parses it again (the row is JSON) before it
 * renders, so a template only ever sees a well-formed payload.
 *
 * Conventions: money in integer minor units with a lower-case ISO 4217 currency (default `usd`);
 * days as `YYYY-MM-DD` in the shop's time zone; instants as a Date or an ISO 8601 string with an
 * offset (they come back from the JSON row as strings); links absolute http(s) URLs.
 *
 * These names and shapes are a contract other modules code against: add optional fields freely,
 * never rename or remove one.
 */
import { z } from 'zod';
import { isCurrencyCode, type CurrencyCode } from '../shared/domain/money';
import { postalAddressSchema } from '../shared/schemas/address';
import { isoDate } from '../shared/schemas/dates';
import { bagSizes, brewMethods, grinds, orderKinds, roastLevels, roastedBagSizes } from '../shared/domain/vocabulary';

/** What a subscriber did to their subscription (the `subscription-changed` e-mail). */
export const subscriptionChangeKinds = ['changed', 'skipped', 'unskipped', 'paused', 'resumed', 'cancelled'] as const;

const text = (max = 300) => z.string().trim().max(max);
/** The recipient's name as the greeting uses it; empty greets them without a name. */
const name = text(200);
const id = text(100).min(1);
const day = isoDate('date');
const instant = z
  .union([z.date(), z.iso.datetime({ offset: true })])
  .transform((value) => (value instanceof Date ? value : new Date(value)))
  .refine((value) => !Number.isNaN(value.getTime()), 'must be a valid instant');
const link = z.url({ protocol: /^https?$/ });
const minor = z.number().int().min(0).max(Number.MAX_SAFE_INTEGER);
const currency = z
  .string()
  .trim()
  .toLowerCase()
  .refine(isCurrencyCode, 'must be a currency Restday knows, e.g. usd')
  .transform((code) => code as CurrencyCode)
  .default('usd');

/** One line of an order as the customer reads it. */
export const emailLineSchema = z.object({
  /** Lot name, or "Roaster's Rotation". */
  description: text(),
  size: z.enum(bagSizes),
  quantity: z.number().int().positive(),
  lineTotalCents: minor.optional(),
  roastLevel: z.enum(roastLevels).optional(),
  grind: z.enum(grinds).optional(),
});

export const emailPayloadSchemas = {
  'order-confirmed': z.object({
    name,
    orderId: id,
    kind: z.enum(orderKinds).default('green'),
    lines: z.array(emailLineSchema).max(100).default([]),
    subtotalCents: minor.optional(),
    shippingCents: minor.optional(),
    totalCents: minor,
    currency,
    shipTo: postalAddressSchema.optional(),
    /** Roasted orders: the roast day and the day it ships. */
    roastDate: day.optional(),
    shipDate: day.optional(),
  }),
  'subscription-started': z.object({
    name,
    subscriptionId: id,
    /** Lot name, or "Roaster's Rotation". */
    coffee: text(),
    size: z.enum(roastedBagSizes),
    roastLevel: z.enum(roastLevels).optional(),
    grind: z.enum(grinds),
    brewMethod: z.enum(brewMethods),
    cadenceWeeks: z.number().int().min(1).max(4),
    /** Price of each delivery. */
    priceCents: minor,
    currency,
    firstRoastDate: day.optional(),
  }),
  roasted: z.object({
    name,
    orderId: id,
    roastDate: day,
    lines: z.array(emailLineSchema).max(100).default([]),
    shipDate: day.optional(),
    readyFrom: day.optional(),
  }),
  shipped: z.object({
    name,
    orderId: id,
    kind: z.enum(orderKinds).default('roasted'),
    carrier: text(60).min(1),
    trackingNumber: text(80).min(1),
    trackingUrl: link.optional(),
    /** Roasted coffee: the first day it is at its best (the rest-day). Green coffee has none. */
    readyFrom: day.optional(),
    bestBefore: day.optional(),
    /** The day the parcel should land (ship day + transit days). */
    expectedArrival: day.optional(),
    /** Roasted coffee: true when it lands rested (arrival on or after the ready-from date). */
    readyOnArrival: z.boolean().optional(),
  }),
  'rest-day': z.object({
    name,
    orderId: id,
    readyFrom: day,
    brewMethod: z.enum(brewMethods),
    coffee: text().optional(),
    bestBefore: day.optional(),
  }),
  'renewal-reminder': z.object({
    name,
    subscriptionId: id,
    coffee: text(),
    renewsOn: day,
    amountCents: minor,
    currency,
  }),
  'subscription-changed': z.object({
    name,
    subscriptionId: id,
    /** Lot name, or "Roaster's Rotation". */
    coffee: text(),
    change: z.enum(subscriptionChangeKinds),
    /** What changed, one line each ("Roast level: Dark"). */
    summary: z.array(text()).max(20).default([]),
    /** What the change did, as Deliveries told the subscriber (leads the e-mail when given). */
    notice: text(600).optional(),
    /** The next delivery that will roast, after the change. */
    nextDelivery: z.object({ roastDate: day, shipDate: day, readyFrom: day }).optional(),
    pausedUntil: day.optional(),
    /** Cancelled at the period's end: the last day the subscription runs. */
    endsOn: day.optional(),
  }),
  'payment-failed': z.object({
    name,
    amountCents: minor,
    currency,
    subscriptionId: id.optional(),
    orderId: id.optional(),
    /** Where the customer updates their card (e.g. a Stripe billing-portal or Restday account URL). */
    updatePaymentUrl: link.optional(),
    /** The day the payment is tried again, when Stripe will retry. */
    nextAttemptOn: day.optional(),
  }),
  'password-reset': z.object({
    name,
    resetUrl: link,
    expiresAt: instant,
  }),
  'staff-invitation': z.object({
    invitedByName: name,
    role: z.enum(['packer', 'staff', 'owner']),
    acceptUrl: link,
    expiresAt: instant,
  }),
  /** A closed roast day moved the customer's coffee: one e-mail per customer, each moved order or delivery with its new dates. */
  'roast-day-moved': z.object({
    name,
    /** The roast day the shop closed. */
    closedDate: day,
    items: z
      .array(
        z.object({
          /** Absent for a subscription delivery not yet paid (no order yet). */
          orderId: id.optional(),
          /** Lot name, or "Roaster's Rotation". */
          coffee: text(),
          roastDate: day,
          shipDate: day,
          readyFrom: day,
          bestBefore: day,
        }),
      )
      .min(1)
      .max(50),
  }),
} as const;

export type EmailTemplateName = keyof typeof emailPayloadSchemas;
export const emailTemplateNames = Object.keys(emailPayloadSchemas) as EmailTemplateName[];

/** What a caller passes to `queueEmail` (instants as Date or ISO string; defaults may be left out). */
export type EmailPayloads = { [T in EmailTemplateName]: z.input<(typeof emailPayloadSchemas)[T]> };
/** What a template receives: parsed, defaults filled, instants as Date. */
export type ParsedEmailPayloads = { [T in EmailTemplateName]: z.output<(typeof emailPayloadSchemas)[T]> };

export function isEmailTemplateName(name: string): name is EmailTemplateName {
  return Object.hasOwn(emailPayloadSchemas, name);
}

export function parseEmailPayload<T extends EmailTemplateName>(template: T, payload: unknown): ParsedEmailPayloads[T] {
  return emailPayloadSchemas[template].parse(payload) as ParsedEmailPayloads[T];
}
