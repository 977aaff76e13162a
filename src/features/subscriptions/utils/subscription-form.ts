import type { z } from 'zod';
import { subscriptionCheckoutRequestSchema } from '@shared/schemas/subscriptions';

/** What a subscriber chooses about the coffee itself; the same rules as checkout and changes. */
export const subscriptionChoiceSchema = subscriptionCheckoutRequestSchema.pick({
  roastLevel: true,
  bagSize: true,
  bagsPerDelivery: true,
  grind: true,
  brewMethod: true,
  cadenceWeeks: true,
});
export type SubscriptionChoice = z.output<typeof subscriptionChoiceSchema>;
export type SubscriptionChoiceFields = z.input<typeof subscriptionChoiceSchema>;

export const subscriptionChoiceKeys = ['roastLevel', 'bagSize', 'bagsPerDelivery', 'grind', 'brewMethod', 'cadenceWeeks'] as const;

/** The Roasted to Order builder: everything but where it ships (and whether to keep that address). */
export const subscriptionBuilderSchema = subscriptionCheckoutRequestSchema.omit({ shippingAddress: true, saveAddress: true });
export type SubscriptionBuild = z.output<typeof subscriptionBuilderSchema>;
