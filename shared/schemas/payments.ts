import { z } from 'zod';

/** The answer to a Stripe webhook delivery (`POST /api/payments/webhook`). */
export const webhookReceiptSchema = z.object({
  received: z.literal(true),
  /** True when the event had been applied before, so this delivery changed nothing. */
  duplicate: z.boolean(),
});
export type WebhookReceipt = z.infer<typeof webhookReceiptSchema>;
