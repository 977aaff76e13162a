// Request parameters as the Stripe SDK form-encodes them (every value a string, arrays as
// `items[0][…]`), checked the way Stripe checks them: unknown parameters are refused by name.
import { z } from 'zod';

const integerText = z.string().regex(/^-?\d+$/, 'must be an integer');

export const formInt = (min = 0) => integerText.transform(Number).pipe(z.number().int().min(min).max(Number.MAX_SAFE_INTEGER));
export const formBool = z.enum(['true', 'false']).transform((value) => value === 'true');

/** `a[0]=x&a[1]=y` arrives as an array, or as an object keyed "0", "1" past the parser's array limit. */
export const formArray = <T extends z.ZodType>(item: T) =>
  z.preprocess((value) => {
    if (value && typeof value === 'object' && !Array.isArray(value)) {
      return Object.entries(value)
        .sort(([a], [b]) => Number(a) - Number(b))
        .map(([, entry]) => entry as unknown);
    }
    return value;
  }, z.array(item));

/** Metadata is a map of strings; an empty string clears it. */
export const metadataParam = z.union([z.literal('').transform(() => ({})), z.record(z.string().max(40), z.string().max(500))]);

export const currencyParam = z
  .string()
  .regex(/^[a-zA-Z]{3}$/, 'must be a three-letter ISO currency code')
  .transform((code) => code.toLowerCase());

export const expandParam = formArray(z.string()).optional();

export const recurringParam = z.strictObject({
  interval: z.enum(['day', 'week', 'month', 'year']),
  interval_count: formInt(1).optional(),
});

const productDataParam = z.strictObject({
  name: z.string().min(1).max(250),
  description: z.string().max(1000).optional(),
  metadata: metadataParam.optional(),
});

export const checkoutSessionCreateParams = z.strictObject({
  mode: z.enum(['payment', 'subscription']),
  line_items: formArray(
    z.strictObject({
      price_data: z.strictObject({
        currency: currencyParam,
        unit_amount: formInt(0),
        product: z.string().optional(),
        product_data: productDataParam.optional(),
        recurring: recurringParam.optional(),
      }),
      quantity: formInt(1),
    }),
  ).refine((items) => items.length > 0, 'at least one line item is required'),
  success_url: z.url(),
  cancel_url: z.url().optional(),
  client_reference_id: z.string().min(1).max(200).optional(),
  customer: z.string().optional(),
  customer_email: z.email().optional(),
  metadata: metadataParam.optional(),
  expires_at: formInt().optional(),
  payment_intent_data: z.strictObject({ metadata: metadataParam.optional(), description: z.string().optional() }).optional(),
  subscription_data: z.strictObject({ metadata: metadataParam.optional(), description: z.string().optional() }).optional(),
  expand: expandParam,
});
export type CheckoutSessionCreateParams = z.output<typeof checkoutSessionCreateParams>;

export const customerCreateParams = z.strictObject({
  email: z.email().optional(),
  name: z.string().max(256).optional(),
  description: z.string().optional(),
  metadata: metadataParam.optional(),
  expand: expandParam,
});
export type CustomerCreateParams = z.output<typeof customerCreateParams>;

export const subscriptionUpdateParams = z.strictObject({
  items: formArray(
    z.strictObject({
      id: z.string().optional(),
      deleted: formBool.optional(),
      quantity: formInt(1).optional(),
      price_data: z
        .strictObject({
          currency: currencyParam,
          unit_amount: formInt(0),
          product: z.string(),
          recurring: recurringParam,
        })
        .optional(),
      metadata: metadataParam.optional(),
    }),
  ).optional(),
  cancel_at_period_end: formBool.optional(),
  pause_collection: z
    .union([
      z.literal('').transform(() => null),
      z.strictObject({ behavior: z.enum(['keep_as_draft', 'mark_uncollectible', 'void']), resumes_at: formInt().optional() }),
    ])
    .optional(),
  metadata: metadataParam.optional(),
  proration_behavior: z.enum(['create_prorations', 'none', 'always_invoice']).optional(),
  /** A Unix time (or `now`): the next invoice waits until then, as at the end of a trial. */
  trial_end: z.union([z.literal('now'), formInt(1)]).optional(),
  default_payment_method: z.string().optional(),
  expand: expandParam,
});
export type SubscriptionUpdateParams = z.output<typeof subscriptionUpdateParams>;

export const subscriptionCancelParams = z.strictObject({
  invoice_now: formBool.optional(),
  prorate: formBool.optional(),
  expand: expandParam,
});

export const refundCreateParams = z.strictObject({
  payment_intent: z.string().optional(),
  charge: z.string().optional(),
  amount: formInt(1).optional(),
  reason: z.enum(['duplicate', 'fraudulent', 'requested_by_customer']).optional(),
  metadata: metadataParam.optional(),
  expand: expandParam,
});
export type RefundCreateParams = z.output<typeof refundCreateParams>;

export const expandOnlyParams = z.strictObject({ expand: expandParam });
