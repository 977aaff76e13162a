import { z } from 'zod';
import { labelStockIds } from '../domain/label-stock';
import { instant, isoDate, roastDatesOrNullSchema } from './dates';
import { bagSizes, grinds, orderKinds, orderStatuses, roastLevels } from '../domain/vocabulary';

/** Path of `GET /api/roastery/days/:date/pack-list` and `…/labels.pdf`: a ship day in shop time. */
export const packDayParamsSchema = z.object({ date: isoDate('date') });
export type PackDayParams = z.infer<typeof packDayParamsSchema>;

/** `GET …/labels.pdf?stock=` — the label stock to print on; one 4 × 3 in label a page unless asked. */
export const labelsPdfQuerySchema = z.object({
  stock: z.enum(labelStockIds, { error: `Choose one of: ${labelStockIds.join(', ')}.` }).default('single'),
});

/**
 * One bag on the Pack List, with what its label says. Green bags have no roast fields (null).
 * `lotCode` is null only for a Roaster's Rotation line whose roast day has no lot picked yet.
 * `netGrams` is the fill weight; `netLabel` the declared quantity in both units ("Net Wt 12 oz (340 g)").
 * `batchId` is the batch the bag was filled from, once the order is packed.
 */
export const packBagSchema = z.object({
  orderItemId: z.uuid(),
  /** 1, 2, 3 … across the order's bags, for "bag 2 of 3". */
  bagNumber: z.number().int().positive(),
  coffee: z.string(),
  lotCode: z.string().nullable(),
  roastLevel: z.enum(roastLevels).nullable(),
  grind: z.enum(grinds).nullable(),
  size: z.enum(bagSizes),
  netGrams: z.number().int().positive(),
  netLabel: z.string(),
  ...roastDatesOrNullSchema.pick({ roastDate: true, readyFrom: true, bestBefore: true }).shape,
  batchId: z.uuid().nullable(),
});
export type PackBag = z.infer<typeof packBagSchema>;

/** One order on the Pack List, one entry per bag (quantities expanded). Also the answer of pack and ship. */
export const packOrderSchema = z.object({
  orderId: z.uuid(),
  customerName: z.string(),
  kind: z.enum(orderKinds),
  status: z.enum(orderStatuses),
  shipDate: z.string().nullable(),
  packedAt: instant.nullable(),
  shippedAt: instant.nullable(),
  carrier: z.string().nullable(),
  trackingNumber: z.string().nullable(),
  bags: z.array(packBagSchema),
  /**
   * Which bags (by `bagNumber`) go in which parcel: whole bags, the cheapest packing within the
   * shop's weight bands (planShipping). Empty, with `parcelNote` saying why, when a bag is over
   * the heaviest band the owner has set since the order was placed.
   */
  parcels: z.array(
    z.object({
      parcelNumber: z.number().int().positive(),
      bagNumbers: z.array(z.number().int().positive()).min(1),
      /** Fill, bag tare and box tare. */
      grams: z.number().int().positive(),
      bandMaxGrams: z.number().int().positive(),
      cents: z.number().int().min(0),
    }),
  ),
  parcelNote: z.string().nullable(),
});
export type PackOrder = z.infer<typeof packOrderSchema>;

/** `GET /api/roastery/days/:date/pack-list`: the orders that ship on `date` (paid, roasted, packed or shipped). */
export const packListResponseSchema = z.object({
  date: z.string(),
  orders: z.array(packOrderSchema),
});
export type PackListResponse = z.infer<typeof packListResponseSchema>;

/** Body of `POST /api/orders/:id/ship`. The tracking number is kept upper-case without spaces. */
export const shipOrderBodySchema = z.object({
  carrier: z.string({ error: 'Name the carrier.' }).trim().min(1, 'Name the carrier.').max(60, 'Keep the carrier to 60 characters.'),
  trackingNumber: z
    .string({ error: 'Enter the tracking number.' })
    .trim()
    .min(1, 'Enter the tracking number.')
    .max(80, 'Keep the tracking number to 80 characters.')
    .regex(/^[A-Za-z0-9][A-Za-z0-9 -]*$/, 'Use letters, digits, spaces and dashes only.')
    .transform((text) => text.replace(/\s+/g, '').toUpperCase()),
});
export type ShipOrderBody = z.input<typeof shipOrderBodySchema>;

/** Body of `POST /api/roastery/days/:date/ship` (staff): the day's packed orders, one carrier, each its tracking number. */
export const bulkShipBodySchema = z.object({
  carrier: shipOrderBodySchema.shape.carrier,
  shipments: z
    .array(z.object({ orderId: z.uuid('No such order.'), trackingNumber: shipOrderBodySchema.shape.trackingNumber }), { error: 'List the orders to ship.' })
    .min(1, 'List at least one order to ship.')
    .max(200, 'Ship at most 200 orders at once.')
    .refine((shipments) => new Set(shipments.map((each) => each.orderId)).size === shipments.length, 'List each order once.'),
});
export type BulkShipBody = z.infer<typeof bulkShipBodySchema>;

/** Why the owner refunds, in Stripe's own terms. */
export const refundReasons = ['requested_by_customer', 'duplicate', 'fraudulent'] as const;
export type RefundReason = (typeof refundReasons)[number];

/** Body of `POST /api/orders/:id/refund` (owner). No amount: whatever is not refunded yet. */
export const refundOrderBodySchema = z.object({
  amountCents: z
    .number({ error: 'Give the amount in whole cents.' })
    .int('Give the amount in whole cents.')
    .positive('The amount must be more than zero.')
    .optional(),
  reason: z.enum(refundReasons, { error: `Choose one of: ${refundReasons.join(', ')}.` }).optional(),
});
export type RefundOrderBody = z.infer<typeof refundOrderBodySchema>;

/**
 * Optional `Idempotency-Key` header of `POST /api/orders/:id/refund`: one key per refund the owner
 * means to make (e.g. a UUID made when the refund form opens). The same key again answers with the
 * refund already made instead of refunding twice.
 */
export const refundRequestHeadersSchema = z.object({
  'idempotency-key': z
    .string()
    .regex(/^[A-Za-z0-9_-]{8,100}$/, 'Send the Idempotency-Key header as 8 to 100 letters, digits, dashes or underscores.')
    .optional(),
});

/**
 * 202 answer of `POST /api/orders/:id/refund`. Stripe has accepted the refund; the order's own
 * `refundedCents` and `status` change when Stripe's `charge.refunded` webhook arrives, so these are
 * the order's figures as they stand now. `requestedCents` is the amount this request asked for.
 */
export const refundResponseSchema = z.object({
  refundedCents: z.number().int(),
  status: z.enum(orderStatuses),
  requestedCents: z.number().int(),
});
export type RefundResponse = z.infer<typeof refundResponseSchema>;

/** `GET /api/orders/:id/trace` (staff): which batches and lots an order's bags came from. */
export const orderTraceSchema = z.object({
  order: z.object({
    id: z.uuid(),
    kind: z.enum(orderKinds),
    status: z.enum(orderStatuses),
    customerName: z.string(),
    customerEmail: z.string(),
    roastDate: z.string().nullable(),
    shipDate: z.string().nullable(),
    shippedAt: instant.nullable(),
  }),
  /**
   * One row per batch a line drew from. A line with bags not filled from any batch yet (not packed,
   * or green coffee, which is never roasted) has a row with `batchId` and `roastDate` null.
   */
  bags: z.array(
    z.object({
      batchId: z.uuid().nullable(),
      lotCode: z.string().nullable(),
      lotName: z.string().nullable(),
      roastLevel: z.enum(roastLevels).nullable(),
      roastDate: z.string().nullable(),
      size: z.enum(bagSizes),
      bags: z.number().int().positive(),
      grams: z.number().int().positive(),
    }),
  ),
});
export type OrderTrace = z.infer<typeof orderTraceSchema>;

/** `GET /api/roastery/batches/:id/trace` (staff): every order a batch went into, for a recall. */
export const batchTraceSchema = z.object({
  batch: z.object({
    id: z.uuid(),
    roastDate: z.string(),
    lotCode: z.string(),
    lotName: z.string(),
    roastLevel: z.enum(roastLevels),
    greenGramsIn: z.number().int(),
    roastedGramsOut: z.number().int(),
    /** Roasted grams already filled into bags. */
    allocatedGrams: z.number().int(),
  }),
  orders: z.array(
    z.object({
      orderId: z.uuid(),
      customerName: z.string(),
      customerEmail: z.string(),
      status: z.enum(orderStatuses),
      shipDate: z.string().nullable(),
      shippedAt: instant.nullable(),
      bags: z.number().int().positive(),
      grams: z.number().int().positive(),
    }),
  ),
});
export type BatchTrace = z.infer<typeof batchTraceSchema>;
