import { z } from 'zod';
import { greenBagSizes } from '../domain/vocabulary';
import { postalAddressInputSchema } from './address';

/** Where a checkout ships: an address as the customer enters it (the address-book default flag does not apply). */
export const shippingAddressSchema = postalAddressInputSchema;
export type ShippingAddress = z.infer<typeof shippingAddressSchema>;

/** A checkout's "Save for next time": true keeps the shipping address in the address book (once). */
export const saveAddressField = z.boolean({ error: 'Answer true or false.' }).optional();

/** Most bags of one size of one lot in a single order. */
export const maxBagsPerLine = 50;
/** Most lines in a single order. */
export const maxLinesPerOrder = 20;

export const greenCheckoutItemSchema = z.object({
  lotCode: z.string({ error: 'Choose a lot.' }).trim().min(1, 'Choose a lot.').max(40, 'Use at most 40 characters.'),
  size: z.enum(greenBagSizes, { error: 'Choose a bag size: 8oz, 1lb, 2lb or 5lb.' }),
  quantity: z
    .number({ error: 'Enter how many bags.' })
    .int('Enter a whole number of bags.')
    .min(1, 'Order at least one bag.')
    .max(maxBagsPerLine, `Order at most ${maxBagsPerLine} bags of one size.`),
});
export type GreenCheckoutItem = z.infer<typeof greenCheckoutItemSchema>;

/** `POST /api/checkout/green` (signed-in customers). Each lot and size may appear once. */
export const greenCheckoutRequestSchema = z.object({
  items: z
    .array(greenCheckoutItemSchema, { error: 'Add at least one bag to the cart.' })
    .min(1, 'Add at least one bag to the cart.')
    .max(maxLinesPerOrder, `Use at most ${maxLinesPerOrder} lines in one order.`)
    .refine(
      (items) => new Set(items.map((item) => `${item.lotCode}|${item.size}`)).size === items.length,
      'Each lot and size may appear only once; add to its quantity instead.',
    ),
  shippingAddress: shippingAddressSchema,
  saveAddress: saveAddressField,
});
export type GreenCheckoutRequest = z.infer<typeof greenCheckoutRequestSchema>;

/**
 * Optional `Idempotency-Key` header of `POST /api/checkout/green`: one key per checkout the buyer
 * means to make (the client makes one when the checkout page opens). The same key again answers with
 * the order it placed and the same payment page, never a second order or reservation.
 */
export const checkoutRequestHeadersSchema = z.object({
  'idempotency-key': z
    .string()
    .regex(/^[A-Za-z0-9_-]{8,100}$/, 'Send the Idempotency-Key header as 8 to 100 letters, digits, dashes or underscores.')
    .optional(),
});

/** 201: the order exists (pending payment, stock reserved); the browser goes to `checkoutUrl` to pay. */
export const greenCheckoutResponseSchema = z.object({
  orderId: z.uuid(),
  checkoutUrl: z.url(),
});
export type GreenCheckoutResponse = z.infer<typeof greenCheckoutResponseSchema>;

/** `POST /api/orders/:id/pay` and `POST /api/subscriptions/:id/pay` (own, awaiting payment): the payment page to go on to. */
export const checkoutUrlResponseSchema = z.object({ checkoutUrl: z.url() });
export type CheckoutUrlResponse = z.infer<typeof checkoutUrlResponseSchema>;
