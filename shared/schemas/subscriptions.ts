import { z } from 'zod';
import { instant, isoDate, roastDatesSchema } from './dates';
import { brewMethods, deliveryStatuses, grinds, roastedBagSizes, roastLevels, subscriptionStatuses } from '../domain/vocabulary';
import { postalAddressSchema } from './address';
import { saveAddressField, shippingAddressSchema } from './checkout';

/** Most bags in one delivery. */
export const maxBagsPerDelivery = 10;
/** Most deliveries `GET /api/subscriptions/:id/deliveries` lists at once. */
export const maxDeliveriesListed = 26;

const roastLevelField = z.enum(roastLevels, { error: 'Choose a roast level: light, medium, medium-dark, dark or French.' });
const bagSizeField = z.enum(roastedBagSizes, { error: 'Choose a bag size: 12oz, 1lb or 2lb.' });
const bagsPerDeliveryField = z
  .number({ error: 'Enter how many bags each delivery brings.' })
  .int('Enter a whole number of bags.')
  .min(1, 'Each delivery brings at least one bag.')
  .max(maxBagsPerDelivery, `Each delivery brings at most ${maxBagsPerDelivery} bags.`);
const grindField = z.enum(grinds, { error: 'Choose whole bean or a grind for a brew method.' });
const brewMethodField = z.enum(brewMethods, { error: 'Choose filter or espresso.' });
const cadenceWeeksField = z
  .number({ error: 'Choose how often: every 1, 2, 3 or 4 weeks.' })
  .int('Choose how often: every 1, 2, 3 or 4 weeks.')
  .min(1, 'Choose how often: every 1, 2, 3 or 4 weeks.')
  .max(4, 'Choose how often: every 1, 2, 3 or 4 weeks.');

/**
 * `POST /api/checkout/subscription` (signed-in customers): Roasted to Order. `lotCode` null is the
 * Roaster's Rotation, which allows every level; a lot allows only its own levels (422 otherwise).
 */
export const subscriptionCheckoutRequestSchema = z.object({
  lotCode: z.string({ error: "Choose a lot, or null for the Roaster's Rotation." }).trim().min(1, 'Choose a lot.').max(40).nullable(),
  roastLevel: roastLevelField,
  bagSize: bagSizeField,
  bagsPerDelivery: bagsPerDeliveryField,
  grind: grindField,
  brewMethod: brewMethodField,
  cadenceWeeks: cadenceWeeksField,
  shippingAddress: shippingAddressSchema,
  saveAddress: saveAddressField,
});
export type SubscriptionCheckoutRequest = z.infer<typeof subscriptionCheckoutRequestSchema>;

/** 201: the subscription exists (status `incomplete`); the browser goes to `checkoutUrl` to pay. */
export const subscriptionCheckoutResponseSchema = z.object({
  subscriptionId: z.uuid(),
  checkoutUrl: z.url(),
});
export type SubscriptionCheckoutResponse = z.infer<typeof subscriptionCheckoutResponseSchema>;

/**
 * One delivery on Deliveries. `locked` once its cutoff (`cutoffAt`, UTC) has passed: it keeps the
 * coffee, level, size and grind it had then, and changes reach the next one. `lotCode`/`coffee` are
 * null for a Roaster's Rotation delivery whose lot is not picked yet; `orderId` once it is paid.
 */
export const subscriptionDeliverySchema = roastDatesSchema.extend({
  /** The day the parcel should land (ship date + transit days, weekends and carrier holidays not counted). */
  expectedArrival: z.string(),
  /** True when it lands on or after its ready-from date: ready to brew on arrival. */
  readyOnArrival: z.boolean(),
  status: z.enum(deliveryStatuses),
  locked: z.boolean(),
  cutoffAt: instant,
  lotCode: z.string().nullable(),
  coffee: z.string().nullable(),
  roastLevel: z.enum(roastLevels),
  bagSize: z.enum(roastedBagSizes),
  bagsPerDelivery: z.number().int(),
  grind: z.enum(grinds),
  brewMethod: z.enum(brewMethods),
  orderId: z.uuid().nullable(),
  /** Already paid for: skipping it moves its payment to the next delivery, a pause asks whether to ship or hold it. */
  paid: z.boolean(),
});
export type SubscriptionDelivery = z.infer<typeof subscriptionDeliverySchema>;

/**
 * `GET /api/subscriptions/:id`, and the answer of every change. `coffee` is the lot's name or
 * "Roaster's Rotation"; `priceCents` is one delivery, shipping included; `endsOn` is the shop-local
 * day the last paid period ends once `cancelAtPeriodEnd`; `nextDelivery` is the first delivery not
 * yet roasted that is neither skipped nor paused (null when none is due).
 */
export const subscriptionSchema = z.object({
  id: z.uuid(),
  status: z.enum(subscriptionStatuses),
  lotCode: z.string().nullable(),
  coffee: z.string(),
  roastLevel: z.enum(roastLevels),
  bagSize: z.enum(roastedBagSizes),
  bagsPerDelivery: z.number().int(),
  grind: z.enum(grinds),
  brewMethod: z.enum(brewMethods),
  cadenceWeeks: z.number().int(),
  pausedUntil: z.string().nullable(),
  cancelAtPeriodEnd: z.boolean(),
  endsOn: z.string().nullable(),
  priceCents: z.number().int(),
  currency: z.string(),
  shippingAddress: postalAddressSchema,
  nextDelivery: subscriptionDeliverySchema.nullable(),
  createdAt: instant,
});
export type Subscription = z.infer<typeof subscriptionSchema>;

/** The answer of every self-service change: the subscription, and what the change did in the subscriber's words (Deliveries shows it). */
export const subscriptionChangeResponseSchema = subscriptionSchema.extend({ notice: z.string() });
export type SubscriptionChangeResponse = z.infer<typeof subscriptionChangeResponseSchema>;

/** `GET /api/subscriptions`: the signed-in customer's own, newest first. */
export const subscriptionListResponseSchema = z.object({ items: z.array(subscriptionSchema) });
export type SubscriptionListResponse = z.infer<typeof subscriptionListResponseSchema>;

/** `PATCH /api/subscriptions/:id` → 200 Subscription. Reaches the next delivery whose cutoff has not passed. */
export const subscriptionUpdateSchema = z
  .object({
    roastLevel: roastLevelField.optional(),
    bagSize: bagSizeField.optional(),
    bagsPerDelivery: bagsPerDeliveryField.optional(),
    grind: grindField.optional(),
    brewMethod: brewMethodField.optional(),
    cadenceWeeks: cadenceWeeksField.optional(),
    shippingAddress: shippingAddressSchema.optional(),
  })
  .refine((update) => Object.values(update).some((value) => value !== undefined), 'Change at least one thing.');
export type SubscriptionUpdate = z.infer<typeof subscriptionUpdateSchema>;

/**
 * `POST /api/subscriptions/:id/skip` → 200 SubscriptionChangeResponse. Without `roastDate`, the next
 * delivery that is not locked; any upcoming one by its roast date (also as
 * `POST /api/subscriptions/:id/deliveries/:date/skip`). Skipping one already skipped changes nothing;
 * a locked one is 409 `delivery_locked`. A paid one's payment moves to the next delivery, and the
 * notice says which.
 */
export const subscriptionSkipSchema = z.object({ roastDate: isoDate('roast date').optional() }).default({});
export type SubscriptionSkip = z.infer<typeof subscriptionSkipSchema>;

/** The `:date` of `/api/subscriptions/:id/deliveries/:date/(skip|unskip)`: the delivery's roast date. */
export const subscriptionDeliveryParamsSchema = z.object({ id: z.uuid('No such subscription.'), date: isoDate('roast date') });

/** What to do with a delivery already paid for that falls inside a pause: roast and ship it as planned, or hold it for the first delivery after the pause. */
export const paidDeliveryChoices = ['ship', 'hold'] as const;
export type PaidDeliveryChoice = (typeof paidDeliveryChoices)[number];

/**
 * `POST /api/subscriptions/:id/pause` → 200 SubscriptionChangeResponse: no delivery roasts before
 * `until` (a future shop-local day). When a paid delivery whose cutoff is ahead lies inside the
 * pause, `paidDelivery` is required (409 `paid_delivery_in_pause` naming it otherwise).
 */
export const subscriptionPauseSchema = z.object({
  until: isoDate('day to resume'),
  paidDelivery: z.enum(paidDeliveryChoices, { error: 'Choose ship or hold for the paid delivery.' }).optional(),
});
export type SubscriptionPause = z.infer<typeof subscriptionPauseSchema>;

/** Query string of `GET /api/subscriptions/:id/deliveries`. */
export const subscriptionDeliveriesQuerySchema = z.object({
  count: z.coerce
    .number({ error: 'Ask for a number of deliveries.' })
    .int('Ask for a whole number of deliveries.')
    .min(1, 'Ask for at least one delivery.')
    .max(maxDeliveriesListed, `Ask for at most ${maxDeliveriesListed} deliveries.`)
    .default(6),
});
export type SubscriptionDeliveriesQuery = z.infer<typeof subscriptionDeliveriesQuerySchema>;

/** `GET /api/subscriptions/:id/deliveries`: past deliveries not yet shipped, then upcoming ones, by roast date. */
export const subscriptionDeliveriesResponseSchema = z.object({ items: z.array(subscriptionDeliverySchema) });
export type SubscriptionDeliveriesResponse = z.infer<typeof subscriptionDeliveriesResponseSchema>;
