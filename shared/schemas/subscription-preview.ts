import { z } from 'zod';
import { instant, roastDatesSchema } from './dates';
import { brewMethods, roastedBagSizes, roastLevels, shipPolicies, type RoastedBagSize } from '../domain/vocabulary';

/** Most bags in one delivery (the subscriptions table allows 1–10). */
const maxBags = 10;
const cadenceMessage = 'Choose how often: every 1, 2, 3 or 4 weeks.';

/**
 * Query string of `GET /api/subscriptions/preview` (public): what a Roasted to Order choice costs
 * and when its first deliveries roast. `lotCode` omitted (or empty) is the Roaster's Rotation.
 * Grind is not asked: it changes neither the price nor the dates.
 */
export const subscriptionPreviewQuerySchema = z.object({
  lotCode: z
    .string()
    .trim()
    .max(40, 'Use at most 40 characters.')
    .optional()
    .transform((code) => code || null),
  roastLevel: z.enum(roastLevels, { error: 'Choose a roast level: light, medium, medium-dark, dark or French.' }),
  bagSize: z.enum(roastedBagSizes, { error: 'Choose a bag size: 12oz, 1lb or 2lb.' }),
  bagsPerDelivery: z.coerce
    .number({ error: 'Enter how many bags each delivery brings.' })
    .int('Enter a whole number of bags.')
    .min(1, 'Each delivery brings at least one bag.')
    .max(maxBags, `Each delivery brings at most ${maxBags} bags.`),
  brewMethod: z.enum(brewMethods, { error: 'Choose filter or espresso.' }),
  cadenceWeeks: z.coerce.number({ error: cadenceMessage }).int(cadenceMessage).min(1, cadenceMessage).max(4, cadenceMessage),
});
export type SubscriptionPreviewQuery = z.infer<typeof subscriptionPreviewQuerySchema>;

/** How many deliveries the preview lists. */
export const previewDeliveryCount = 3;

/** One delivery of the preview; days in the shop's time zone, `cutoffAt` a UTC instant (a later payment misses it). */
export const previewDeliverySchema = roastDatesSchema.extend({
  /** The day the parcel should land (ship date + transit days). */
  expectedArrival: z.string(),
  cutoffAt: instant,
});
export type PreviewDelivery = z.infer<typeof previewDeliverySchema>;

/**
 * 200 answer. `priceCents` is what each delivery is charged: the bags after the subscription
 * discount, plus shipping (the same figure as a subscription's `priceCents`). `regularPriceCents`
 * is the same delivery without the discount; `shippingCents` is the shipping inside both.
 * `deliveries` are the first three, if paid now.
 */
export const subscriptionPreviewSchema = z.object({
  priceCents: z.number().int(),
  regularPriceCents: z.number().int(),
  discountPct: z.number(),
  shippingCents: z.number().int(),
  /** One bag of each size after the subscription discount, before shipping, for the size picker. */
  bagPriceCents: z.object(Object.fromEntries(roastedBagSizes.map((size) => [size, z.number().int()])) as Record<RoastedBagSize, z.ZodNumber>),
  currency: z.string(),
  /** The shop's ship policy, so the builder can say whether the bag lands ready to brew. */
  shipPolicy: z.enum(shipPolicies),
  deliveries: z.array(previewDeliverySchema),
});
export type SubscriptionPreview = z.infer<typeof subscriptionPreviewSchema>;
