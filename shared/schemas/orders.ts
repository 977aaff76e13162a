import { z } from 'zod';
import { postalAddressInputSchema, postalAddressSchema } from './address';
import { instant, isoDate, roastDatesOrNullSchema } from './dates';
import { bagSizes, brewMethods, grinds, orderKinds, orderStatuses, roastLevels } from '../domain/vocabulary';

/** `status` follows an order's life (awaiting payment first, refunded last); roast-date sorts put orders without a roast date last. */
export const orderSorts = ['newest', 'oldest', 'total-high', 'total-low', 'roast-date-soonest', 'roast-date-latest', 'status'] as const;
export type OrderSort = (typeof orderSorts)[number];

/**
 * Query string of `GET /api/orders` and `GET /api/orders.csv`. Customers always see only their
 * own orders; staff see everyone's. `from`/`to` bound the day the order was placed (shop's dates,
 * both inclusive); `roastDate` is the roast day of roasted orders; `q` searches name, e-mail and reference.
 */
export const orderListQuerySchema = z
  .object({
    /** Staff: words in the customer's name or e-mail, or the start of the order reference ("3F2A9C1E"). */
    q: z
      .string()
      .trim()
      .max(100, 'Search with at most 100 characters.')
      .optional()
      .transform((text) => text || undefined),
    status: z.enum(orderStatuses).optional(),
    kind: z.enum(orderKinds).optional(),
    roastDate: isoDate('roast date').optional(),
    from: isoDate('date').optional(),
    to: isoDate('date').optional(),
    sort: z.enum(orderSorts).default('newest'),
    page: z.coerce.number().int().min(1).default(1),
    pageSize: z.coerce.number().int().min(1).max(200).default(50),
  })
  .refine((query) => !query.from || !query.to || query.from <= query.to, {
    message: 'The first day must not be after the last.',
    path: ['to'],
  });
export type OrderListQuery = z.infer<typeof orderListQuerySchema>;

export const orderCustomerSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  email: z.string(),
});

/** One row of an order list. `placedAt` is the UTC instant the order was created. */
export const orderSummarySchema = z.object({
  id: z.uuid(),
  kind: z.enum(orderKinds),
  status: z.enum(orderStatuses),
  placedAt: instant,
  customer: orderCustomerSchema,
  bagCount: z.number().int(),
  totalCents: z.number().int(),
  roastDate: z.string().nullable(),
  shipDate: z.string().nullable(),
});
export type OrderSummary = z.infer<typeof orderSummarySchema>;

export const orderListResponseSchema = z.object({
  items: z.array(orderSummarySchema),
  /** Orders matching the filters, across every page. */
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type OrderListResponse = z.infer<typeof orderListResponseSchema>;

export const orderItemSchema = z.object({
  id: z.uuid(),
  /** Null for a Roaster's Rotation line until its lot is picked. */
  lotCode: z.string().nullable(),
  lotName: z.string().nullable(),
  size: z.enum(bagSizes),
  quantity: z.number().int(),
  fillGrams: z.number().int(),
  roastLevel: z.enum(roastLevels).nullable(),
  grind: z.enum(grinds).nullable(),
  brewMethod: z.enum(brewMethods).nullable(),
  unitPriceCents: z.number().int(),
  lineTotalCents: z.number().int(),
});
export type OrderItem = z.infer<typeof orderItemSchema>;

/** `GET /api/orders/:id` (the customer's own, or any for staff). */
export const orderDetailSchema = z.object({
  id: z.uuid(),
  kind: z.enum(orderKinds),
  status: z.enum(orderStatuses),
  placedAt: instant,
  customer: orderCustomerSchema,
  items: z.array(orderItemSchema),
  subtotalCents: z.number().int(),
  /** Taken off the subtotal (a subscription delivery's discount); total = subtotal − discount + shipping. */
  discountCents: z.number().int(),
  /** How the order page names the discount line ("Subscription discount"); null with no discount. */
  discountLabel: z.string().nullable(),
  shippingCents: z.number().int(),
  totalCents: z.number().int(),
  refundedCents: z.number().int(),
  currency: z.string(),
  shippingAddress: postalAddressSchema,
  ...roastDatesOrNullSchema.shape,
  /** The day the parcel should land: ship date + transit days (weekends and carrier holidays not counted). */
  expectedArrival: z.string().nullable(),
  /** Roasted coffee: true when it lands on or after its ready-from date; null for green coffee or no dates yet. */
  readyOnArrival: z.boolean().nullable(),
  carrier: z.string().nullable(),
  trackingNumber: z.string().nullable(),
  paidAt: instant.nullable(),
  shippedAt: instant.nullable(),
  cancelledAt: instant.nullable(),
  /** Staff only (absent for the customer): the staff's own note on the order. */
  staffNote: z.string().nullable().optional(),
});
export type OrderDetail = z.infer<typeof orderDetailSchema>;

/** The e-mails about one order that staff can send again (`POST /api/orders/:id/resend/:template`). */
export const resendableTemplates = ['order-confirmed', 'roasted', 'shipped'] as const;
export type ResendableTemplate = (typeof resendableTemplates)[number];

export const orderResendParamsSchema = z.object({
  id: z.uuid('No such order.'),
  template: z.enum(resendableTemplates, { error: `Choose one of: ${resendableTemplates.join(', ')}.` }),
});

/** Body of `PATCH /api/orders/:id/address` (staff): where the order ships now; only before it ships. */
export const orderAddressCorrectionSchema = postalAddressInputSchema;

/** Body of `PUT /api/orders/:id/note` (staff); an empty note removes it. */
export const orderNoteSchema = z.object({
  note: z
    .string({ error: 'Write the note as text.' })
    .trim()
    .max(2000, 'Use at most 2,000 characters.')
    .transform((note) => note || null),
});
export type OrderNoteInput = z.input<typeof orderNoteSchema>;

/** Columns of `GET /api/orders.csv`, in order. */
export const orderCsvColumns = [
  'order_id',
  'placed_at',
  'kind',
  'status',
  'customer_name',
  'customer_email',
  'bags',
  'subtotal_cents',
  'shipping_cents',
  'total_cents',
  'refunded_cents',
  'roast_date',
  'ship_date',
  'carrier',
  'tracking_number',
] as const;
