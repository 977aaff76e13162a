import { z } from 'zod';
import { instant, roastDatesSchema } from './dates';
import { brewMethods, deliveryStatuses, grinds, orderStatuses, roastedBagSizes, roastLevels, subscriptionStatuses } from '../domain/vocabulary';
import { postalAddressSchema } from './address';

export const subscriberSorts = ['newest', 'oldest', 'name', 'next-roast'] as const;
export type SubscriberSort = (typeof subscriberSorts)[number];

/** The `lot` filter's value for subscribers to the Roaster's Rotation (they have no lot of their own). */
export const rotationLotFilter = 'rotation';

/**
 * Query string of `GET /api/roastery/subscribers` and `…/subscribers.csv` (staff). Without
 * `status`, every subscription except `incomplete` ones (checkouts never paid). `lot` is a lot code
 * or `rotation`; `q` matches the customer's name or e-mail.
 */
export const subscriberListQuerySchema = z.object({
  status: z.enum(subscriptionStatuses, { error: 'Choose a status: incomplete, active, paused, past_due or cancelled.' }).optional(),
  level: z.enum(roastLevels, { error: 'Choose a roast level: light, medium, medium-dark, dark or French.' }).optional(),
  cadence: z.coerce
    .number({ error: 'Choose a cadence of 1, 2, 3 or 4 weeks.' })
    .int('Choose a cadence of 1, 2, 3 or 4 weeks.')
    .min(1, 'Choose a cadence of 1, 2, 3 or 4 weeks.')
    .max(4, 'Choose a cadence of 1, 2, 3 or 4 weeks.')
    .optional(),
  lot: z.string().trim().min(1, 'Choose a lot code, or rotation.').max(40, 'Use at most 40 characters.').optional(),
  q: z.string().trim().max(100, 'Use at most 100 characters.').optional(),
  sort: z.enum(subscriberSorts, { error: 'Sort by newest, oldest, name or next-roast.' }).default('newest'),
  page: z.coerce.number({ error: 'Use a page number.' }).int('Use a whole page number.').min(1, 'Pages start at 1.').default(1),
  pageSize: z.coerce
    .number({ error: 'Use a page size.' })
    .int('Use a whole page size.')
    .min(1, 'Use a page size of at least 1.')
    .max(200, 'Use a page size of at most 200.')
    .default(50),
});
export type SubscriberListQuery = z.infer<typeof subscriberListQuerySchema>;

/**
 * One row of the Subscribers table. `coffee` is the lot's name or "Roaster's Rotation";
 * `nextRoastDate` is the next delivery's (scheduled or held) as Deliveries shows it, null when none is due.
 */
export const subscriberSummarySchema = z.object({
  id: z.uuid(),
  customerName: z.string(),
  email: z.string(),
  status: z.enum(subscriptionStatuses),
  coffee: z.string(),
  lotCode: z.string().nullable(),
  roastLevel: z.enum(roastLevels),
  bagSize: z.enum(roastedBagSizes),
  bagsPerDelivery: z.number().int(),
  grind: z.enum(grinds),
  brewMethod: z.enum(brewMethods),
  cadenceWeeks: z.number().int(),
  priceCents: z.number().int(),
  nextRoastDate: z.string().nullable(),
  createdAt: instant,
});
export type SubscriberSummary = z.infer<typeof subscriberSummarySchema>;

export const subscriberListResponseSchema = z.object({
  items: z.array(subscriberSummarySchema),
  /** Subscriptions matching the filters, across every page. */
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type SubscriberListResponse = z.infer<typeof subscriberListResponseSchema>;

/** The order a paid delivery became. */
export const subscriberOrderSchema = z.object({
  id: z.uuid(),
  status: z.enum(orderStatuses),
  totalCents: z.number().int(),
  placedAt: instant,
  paidAt: instant.nullable(),
  roastDate: z.string().nullable(),
  shipDate: z.string().nullable(),
  carrier: z.string().nullable(),
  trackingNumber: z.string().nullable(),
});
export type SubscriberOrder = z.infer<typeof subscriberOrderSchema>;

/**
 * One materialized delivery, by roast date. For the Roaster's Rotation, `lotCode`/`coffee` are the
 * lot picked for its roast day (null until staff pick one).
 */
export const subscriberDeliverySchema = z.object({
  id: z.uuid(),
  sequence: z.number().int(),
  ...roastDatesSchema.shape,
  status: z.enum(deliveryStatuses),
  lotCode: z.string().nullable(),
  coffee: z.string().nullable(),
  order: subscriberOrderSchema.nullable(),
});
export type SubscriberDelivery = z.infer<typeof subscriberDeliverySchema>;

/** `GET /api/roastery/subscribers/:id` (staff): the subscription, its customer and address, its deliveries and every order it made. */
export const subscriberDetailSchema = subscriberSummarySchema.omit({ customerName: true, email: true }).extend({
  customer: z.object({ id: z.uuid(), name: z.string(), email: z.string() }),
  currency: z.string(),
  pausedUntil: z.string().nullable(),
  /** The subscriber cancelled: it ends with the paid period (always sent; optional for older readers). */
  cancelAtPeriodEnd: z.boolean().optional(),
  currentPeriodEnd: instant.nullable(),
  cancelledAt: instant.nullable(),
  shippingAddress: postalAddressSchema,
  deliveries: z.array(subscriberDeliverySchema),
  orders: z.array(subscriberOrderSchema.extend({ bags: z.number().int() })),
});
export type SubscriberDetail = z.infer<typeof subscriberDetailSchema>;

/** Columns of `GET /api/roastery/subscribers.csv`, in order. */
export const subscriberCsvColumns = [
  'subscription_id',
  'created_at',
  'status',
  'customer_name',
  'customer_email',
  'coffee',
  'lot_code',
  'roast_level',
  'bag_size',
  'bags_per_delivery',
  'grind',
  'brew_method',
  'cadence_weeks',
  'price_cents',
  'next_roast_date',
] as const;
