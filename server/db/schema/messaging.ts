import { sql } from 'drizzle-orm';
import { check, index, integer, jsonb, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { instant } from './common';
import { outboxStatusEnum } from './enums';

/**
 * Transactional outbox for customer e-mail. A row is written in the same transaction as the state
 * change it reports; a job sends it after commit. dedupeKey (e.g. `order-shipped:<orderId>`) is
 * unique, so the same message is never queued twice.
 */
export const emailOutbox = pgTable(
  'email_outbox',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    template: text('template').notNull(),
    toAddress: text('to_address').notNull(),
    subject: text('subject').notNull(),
    payload: jsonb('payload').$type<Record<string, unknown>>().notNull().default({}),
    dedupeKey: text('dedupe_key').notNull(),
    status: outboxStatusEnum('status').notNull().default('pending'),
    attempts: integer('attempts').notNull().default(0),
    lastError: text('last_error'),
    /** Not before this instant (e.g. the rest-day e-mail waits for the ready-from date). */
    sendAfter: instant('send_after').notNull().defaultNow(),
    sentAt: instant('sent_at'),
    createdAt: instant('created_at').notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('email_outbox_dedupe_key_key').on(t.dedupeKey),
    index('email_outbox_status_send_after_idx').on(t.status, t.sendAfter),
    index('email_outbox_created_at_idx').on(t.createdAt),
    check('email_outbox_attempts_non_negative', sql`${t.attempts} >= 0`),
  ],
);
