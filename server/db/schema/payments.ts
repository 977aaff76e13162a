import { index, jsonb, pgTable, text } from 'drizzle-orm/pg-core';
import { instant } from './common';

/** Idempotency ledger for Stripe webhooks: one row per event id, processedAt set when handled. */
export const paymentEvents = pgTable(
  'payment_events',
  {
    id: text('id').primaryKey(),
    type: text('type').notNull(),
    receivedAt: instant('received_at').notNull().defaultNow(),
    processedAt: instant('processed_at'),
    payload: jsonb('payload').$type<Record<string, unknown>>().notNull(),
  },
  (t) => [index('payment_events_type_idx').on(t.type)],
);
