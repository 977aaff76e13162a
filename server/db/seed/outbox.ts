// The demo e-mails: queued as the outbox repo queues them, already sent when their time has passed.
import { parseEmailPayload, renderSubject, type EmailPayloads, type EmailTemplateName } from '../../../emails/index';
import type * as schema from '../schema/index';
import type { Random } from './random';
import type { Insert } from './scenario-values';

export type DemoOutbox = {
  rows: Insert<typeof schema.emailOutbox>[];
  /** Like the outbox repo's queueEmail: the payload must fit its template (a misfit fails the seed, not the relay). */
  queue<T extends EmailTemplateName>(template: T, userId: string, key: string, payload: EmailPayloads[T], createdAt: Date, sendAfter?: Date): void;
};

export function demoOutbox(rng: Random, now: Date, emailOf: (userId: string) => string): DemoOutbox {
  const rows: Insert<typeof schema.emailOutbox>[] = [];
  return {
    rows,
    queue(template, userId, key, payload, createdAt, sendAfter = createdAt) {
      const parsed = parseEmailPayload(template, payload);
      const sent = sendAfter.getTime() <= now.getTime();
      rows.push({
        id: rng.uuid(),
        template,
        toAddress: emailOf(userId),
        subject: renderSubject(template, parsed),
        payload,
        dedupeKey: `${template}:${key}`,
        status: sent ? 'sent' : 'pending',
        attempts: sent ? 1 : 0,
        sendAfter,
        sentAt: sent ? new Date(sendAfter.getTime() + 60_000) : null,
        createdAt,
      });
    },
  };
}

/** A delivery that failed to send once, for the Outbox screen (invented). */
export function markOneRetrying(outbox: DemoOutbox): void {
  const retrying = outbox.rows.find((m) => m.status === 'pending');
  if (retrying) Object.assign(retrying, { attempts: 2, lastError: 'connect ECONNREFUSED 127.0.0.1:1025 (demo: mail server was down)' });
}
