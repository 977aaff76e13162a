import { z } from 'zod';
import { currencies, type CurrencyCode } from '../domain/money';

/**
 * `GET /api/shipping` (public): the shop's shipping bands and rules as the cart needs them, to
 * price parcels with `planShipping` exactly as checkout will. Read from the owner's settings.
 */
export const shippingRulesSchema = z.object({
  currency: z.enum(currencies as [CurrencyCode, ...CurrencyCode[]]),
  /** Lightest first; a parcel is priced by the lightest band whose `maxGrams` covers it. */
  bands: z.array(z.object({ maxGrams: z.number().int().positive(), cents: z.number().int().min(0) })).min(1),
  /** Bag, valve and label, per bag. */
  bagTareGrams: z.number().int().min(0),
  /** Box and padding, per parcel. */
  boxTareGrams: z.number().int().min(0),
});
export type ShippingRules = z.infer<typeof shippingRulesSchema>;
