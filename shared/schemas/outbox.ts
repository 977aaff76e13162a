import { z } from 'zod';
import { instant } from './dates';

export const outboxStatuses = ['pending', 'sending', 'sent', 'failed'] as const;
export type OutboxStatus = (typeof outboxStatuses)[number];

/** Query string of `GET /api/roastery/outbox`. */
export const outboxListQuerySchema = z.object({
  status: z.enum(outboxStatuses).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});
export type OutboxListQuery = z.infer<typeof outboxListQuerySchema>;

/** One e-mail in the Outbox. `failed` is the dead letter: the relay gave up after its last attempt. */
export const outboxItemSchema = z.object({
  id: z.string(),
  template: z.string(),
  to: z.string(),
  subject: z.string(),
  status: z.enum(outboxStatuses),
  attempts: z.number().int(),
  createdAt: instant,
  /** When the next attempt is due (pending rows). */
  sendAfter: instant.optional(),
  sentAt: instant.optional(),
  /** Why the last attempt failed (pending after a failure, and failed rows). */
  lastError: z.string().optional(),
});
export type OutboxItem = z.infer<typeof outboxItemSchema>;

export const outboxListResponseSchema = z.object({ items: z.array(outboxItemSchema) });
export type OutboxListResponse = z.infer<typeof outboxListResponseSchema>;
