import { and, desc, eq, sql } from 'drizzle-orm';
import type { Db, DbOrTx } from '../../db/client';
import type { OutboxStatus } from '../../db/schema/enums';
import { emailOutbox, shopSettings } from '../../db/schema/index';
import { parseEmailPayload, renderSubject, type EmailPayloads, type EmailTemplateName } from '../../../emails/index';

/** The channel `queueEmail` notifies (on commit) so relays send without waiting for their next poll. */
export const OUTBOX_CHANNEL = 'restday_outbox';

export interface QueuedEmail<T extends EmailTemplateName> {
  template: T;
  to: string;
  payload: EmailPayloads[T];
  /** Unique per message, e.g. `order-confirmed:<orderId>`; queueing the same key again does nothing. */
  dedupeKey: string;
  /** Not before this instant (read against the server's Clock, so the test clock moves it). */
  sendAfter?: Date;
}

/**
 * Writes one e-mail to the transactional outbox, in the caller's transaction when given one: the
 * message leaves only if that transaction commits (the relay sends it after commit). The payload
 * is checked against its template's schema here, so a malformed payload fails the caller, not the
 * relay. A second message with the same dedupeKey is a silent no-op.
 */
export async function queueEmail<T extends EmailTemplateName>(db: DbOrTx, message: QueuedEmail<T>): Promise<void> {
  const payload = parseEmailPayload(message.template, message.payload);
  const to = message.to.trim();
  if (!/^[^\s@<>(),;:"]+@[^\s@<>(),;:"]+$/.test(to)) throw new Error(`queueEmail: "${message.to}" is not an e-mail address`);
  const inserted = await db
    .insert(emailOutbox)
    .values({
      template: message.template,
      toAddress: to,
      subject: renderSubject(message.template, payload),
      // The caller's payload as JSON (a Date becomes its ISO string); the relay parses it again.
      payload: JSON.parse(JSON.stringify(message.payload)) as Record<string, unknown>,
      dedupeKey: message.dedupeKey,
      ...(message.sendAfter ? { sendAfter: message.sendAfter } : {}),
    })
    .onConflictDoNothing({ target: emailOutbox.dedupeKey })
    .returning({ id: emailOutbox.id });
  // NOTIFY is transactional: listeners hear it only when (and if) the caller's transaction commits.
  if (inserted.length > 0) await db.execute(sql`select pg_notify(${OUTBOX_CHANNEL}, '')`);
}

/**
 * Links carrying single-use tokens (password reset, invitation). Once a row is sent or given up
 * on, the outbox forgets them, so a copy of the database never holds a live token.
 */
const tokenLinkKeys = ['resetUrl', 'acceptUrl'] as const;
const payloadWithoutTokenLinks = sql`${emailOutbox.payload} - ${sql.raw(tokenLinkKeys.map((key) => `'${key}'`).join(' - '))}`;

/** A row the relay has claimed: its lease runs until it is marked sent, retried or failed. */
export interface ClaimedEmail {
  id: string;
  template: string;
  toAddress: string;
  subject: string;
  payload: unknown;
  /** This attempt's number (1 for the first); also the fencing token for marking the row. */
  attempts: number;
}

export function createOutboxRepo(db: Db) {
  return {
    /**
     * Claims up to `limit` due rows for this relay: pending rows whose sendAfter has come (by the
     * Clock, or by the database's own time if the test clock lags it), and rows left 'sending' by a
     * relay whose lease ran out (it crashed). SKIP LOCKED lets relays claim side by side without
     * waiting on or ever sharing a row; the lease (real time, never the test clock) is written
     * into send_after while the row is 'sending'.
     */
    async claimDue(options: { now: Date; leaseSeconds: number; limit: number }): Promise<ClaimedEmail[]> {
      const result = await db.execute<{ id: string; template: string; to_address: string; subject: string; payload: unknown; attempts: number }>(sql`
        with due as (
          select id from ${emailOutbox}
          where (status = 'pending' and send_after <= greatest(${options.now.toISOString()}::timestamptz, now()))
             or (status = 'sending' and send_after <= now())
          order by send_after, created_at
          limit ${options.limit}
          for update skip locked
        )
        update ${emailOutbox} as o
        set status = 'sending', attempts = o.attempts + 1, send_after = now() + make_interval(secs => ${options.leaseSeconds})
        from due where o.id = due.id
        returning o.id, o.template, o.to_address, o.subject, o.payload, o.attempts`);
      return result.rows.map((row) => ({
        id: row.id,
        template: row.template,
        toAddress: row.to_address,
        subject: row.subject,
        payload: row.payload,
        attempts: Number(row.attempts),
      }));
    },

    /** True when this claim still held the row (no other relay took it over after a lost lease). */
    async markSent(id: string, attempts: number, sentAt: Date): Promise<boolean> {
      const rows = await db
        .update(emailOutbox)
        .set({ status: 'sent', sentAt, lastError: null, payload: payloadWithoutTokenLinks })
        .where(and(eq(emailOutbox.id, id), eq(emailOutbox.status, 'sending'), eq(emailOutbox.attempts, attempts)))
        .returning({ id: emailOutbox.id });
      return rows.length > 0;
    },

    async markRetry(id: string, attempts: number, error: string, retryAt: Date): Promise<boolean> {
      const rows = await db
        .update(emailOutbox)
        .set({ status: 'pending', sendAfter: retryAt, lastError: error })
        .where(and(eq(emailOutbox.id, id), eq(emailOutbox.status, 'sending'), eq(emailOutbox.attempts, attempts)))
        .returning({ id: emailOutbox.id });
      return rows.length > 0;
    },

    /** The dead letter: the relay gives up on this row; staff see it in the Outbox. */
    async markFailed(id: string, attempts: number, error: string): Promise<boolean> {
      const rows = await db
        .update(emailOutbox)
        .set({ status: 'failed', lastError: error, payload: payloadWithoutTokenLinks })
        .where(and(eq(emailOutbox.id, id), eq(emailOutbox.status, 'sending'), eq(emailOutbox.attempts, attempts)))
        .returning({ id: emailOutbox.id });
      return rows.length > 0;
    },

    /** The Outbox, newest first. */
    async list(filter: { status?: OutboxStatus; limit: number }) {
      return db
        .select({
          id: emailOutbox.id,
          template: emailOutbox.template,
          to: emailOutbox.toAddress,
          subject: emailOutbox.subject,
          status: emailOutbox.status,
          attempts: emailOutbox.attempts,
          lastError: emailOutbox.lastError,
          sendAfter: emailOutbox.sendAfter,
          sentAt: emailOutbox.sentAt,
          createdAt: emailOutbox.createdAt,
        })
        .from(emailOutbox)
        .where(filter.status ? eq(emailOutbox.status, filter.status) : undefined)
        .orderBy(desc(emailOutbox.createdAt), desc(emailOutbox.id))
        .limit(filter.limit);
    },

    /** The shop's name and time zone for the footer and for times in messages (undefined before set-up). */
    async shopDetails(): Promise<{ shopName: string; timeZone: string } | undefined> {
      const [settings] = await db.select({ shopName: shopSettings.shopName, timeZone: shopSettings.timeZone }).from(shopSettings).limit(1);
      return settings;
    },
  };
}

export type OutboxRepo = ReturnType<typeof createOutboxRepo>;
