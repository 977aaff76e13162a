import { isEmailTemplateName, renderEmail, type EmailContext } from '../../../emails/index';
import { backoffDelayMs } from '@shared/domain/backoff';
import type { OutboxItem, OutboxListQuery } from '@shared/schemas/outbox';
import { publicBaseUrl, type Config } from '../../config';
import { MailError, type Mailer } from '../../integrations/mailer';
import type { Clock } from '../../lib/clock';
import type { Logger } from '../../lib/logger';
import type { ClaimedEmail, OutboxRepo } from './outbox.repo';

export function createOutboxService(repo: OutboxRepo) {
  return {
    async list(query: OutboxListQuery): Promise<OutboxItem[]> {
      const rows = await repo.list(query);
      return rows.map((row) => ({
        id: row.id,
        template: row.template,
        to: row.to,
        subject: row.subject,
        status: row.status,
        attempts: row.attempts,
        createdAt: row.createdAt.toISOString(),
        ...(row.status === 'pending' ? { sendAfter: row.sendAfter.toISOString() } : {}),
        ...(row.sentAt ? { sentAt: row.sentAt.toISOString() } : {}),
        ...(row.lastError && row.status !== 'sent' ? { lastError: row.lastError } : {}),
      }));
    },
  };
}

export type OutboxService = ReturnType<typeof createOutboxService>;

/** How the relay paces itself. */
export interface RelayPolicy {
  /** Attempts before a row is given up as failed (the dead letter). */
  maxAttempts: number;
  /** Wait before the second attempt; doubles each attempt, up to maxDelayMs, with ±20 % jitter. */
  baseDelayMs: number;
  maxDelayMs: number;
  /**
   * How long a claim holds a row: longer than one SMTP exchange can take (see the mailer's timeouts).
   * Rows are claimed one at a time, so a slow server never eats into the lease of rows still waiting.
   */
  leaseSeconds: number;
}

/** About 3 hours of retrying (30 s, 1, 2, 4, 8, 16, 32 min, then hourly) before the dead letter. */
export const defaultRelayPolicy: RelayPolicy = {
  maxAttempts: 10,
  baseDelayMs: 30_000,
  maxDelayMs: 60 * 60_000,
  leaseSeconds: 120,
};

export interface RelayResult {
  sent: number;
  retrying: number;
  failed: number;
}

export interface OutboxRelayDeps {
  repo: OutboxRepo;
  mailer: Mailer;
  clock: Clock;
  logger: Logger;
  config: Pick<Config, 'SHOP_POSTAL_ADDRESS' | 'PUBLIC_URL' | 'MAIL_FROM' | 'HOST' | 'PORT'>;
  policy?: Partial<RelayPolicy>;
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

function displayNameOf(from: string): string | undefined {
  return /^\s*"?([^"<]+?)"?\s*</.exec(from)?.[1]?.trim() || undefined;
}

function describe(error: unknown): string {
  const text = error instanceof Error ? error.message : String(error);
  return text.length > 500 ? `${text.slice(0, 500)}…` : text;
}

/**
 * The outbox relay: claims due rows, renders each with its template and hands it to SMTP, then marks
 * it sent. A failure is retried with backoff (the row goes back to pending with a later sendAfter)
 * until maxAttempts, when the row is marked failed. Any number of relays may run at once; a row is
 * only ever held by one (see OutboxRepo.claimDue).
 */
export function createOutboxRelay(deps: OutboxRelayDeps) {
  const policy = { ...defaultRelayPolicy, ...deps.policy };
  const { repo, mailer, clock, logger, config } = deps;
  let shopCache: { at: number; shopName: string; timeZone: string } | undefined;

  async function context(): Promise<EmailContext> {
    if (!shopCache || Date.now() - shopCache.at > 60_000) {
      const shop = await repo.shopDetails();
      shopCache = {
        at: Date.now(),
        shopName: shop?.shopName ?? displayNameOf(config.MAIL_FROM) ?? 'Restday',
        timeZone: shop?.timeZone ?? 'UTC',
      };
    }
    return {
      shop: { name: shopCache.shopName, postalAddress: config.SHOP_POSTAL_ADDRESS },
      baseUrl: publicBaseUrl(config),
      timeZone: shopCache.timeZone,
    };
  }

  /** Real time or the clock's, whichever is later: the claim query compares sendAfter the same way. */
  const nowMs = () => Math.max(clock.now().getTime(), Date.now());

  function retryDelayMs(attempt: number): number {
    const plain = backoffDelayMs(policy.baseDelayMs, policy.maxDelayMs, attempt);
    return Math.round(plain * (0.8 + Math.random() * 0.4));
  }

  /** The database may be restarting right after SMTP accepted: keep trying to record it for a while. */
  async function recordSent(row: ClaimedEmail): Promise<void> {
    for (let attempt = 1; ; attempt++) {
      try {
        // A record of when the mail left, on the wall clock like the row's createdAt: the test
        // clock only decides when a row is due (sendAfter), never what the record says happened.
        const held = await repo.markSent(row.id, row.attempts, new Date());
        if (!held) logger.warn({ outboxId: row.id }, 'outbox row was taken over by another relay after its lease ran out; it may be sent twice');
        return;
      } catch (error) {
        if (attempt >= 8) {
          logger.error({ err: error, outboxId: row.id }, 'e-mail was sent but could not be marked sent; it will be sent again when its lease runs out');
          return;
        }
        await sleep(backoffDelayMs(500, 5_000, attempt));
      }
    }
  }

  async function deliver(row: ClaimedEmail, shop: EmailContext, result: RelayResult): Promise<void> {
    let rendered;
    try {
      if (!isEmailTemplateName(row.template)) throw new Error(`no template is called "${row.template}"`);
      rendered = renderEmail(row.template, row.payload, shop);
    } catch (error) {
      // A payload that does not fit its template never will: straight to the dead letter.
      await repo.markFailed(row.id, row.attempts, `cannot render: ${describe(error)}`);
      logger.error({ outboxId: row.id, template: row.template, err: error }, 'outbox e-mail cannot be rendered; marked failed');
      result.failed += 1;
      return;
    }

    try {
      await mailer.send({ to: row.toAddress, subject: row.subject || rendered.subject, html: rendered.html, text: rendered.text, messageKey: row.id });
    } catch (error) {
      const permanent = error instanceof MailError && error.permanent;
      if (permanent || row.attempts >= policy.maxAttempts) {
        await repo.markFailed(row.id, row.attempts, describe(error));
        logger.warn({ outboxId: row.id, attempts: row.attempts, err: error }, 'outbox e-mail failed for good');
        result.failed += 1;
      } else {
        await repo.markRetry(row.id, row.attempts, describe(error), new Date(nowMs() + retryDelayMs(row.attempts)));
        logger.info({ outboxId: row.id, attempts: row.attempts, err: error }, 'outbox e-mail not sent; will retry');
        result.retrying += 1;
      }
      return;
    }
    await recordSent(row);
    logger.debug({ outboxId: row.id, template: row.template }, 'outbox e-mail sent');
    result.sent += 1;
  }

  return {
    policy,
    /** One pass: sends what is due now, one claimed row at a time, and says what happened. */
    async relayOnce(options: { maxRows?: number } = {}): Promise<RelayResult> {
      const result: RelayResult = { sent: 0, retrying: 0, failed: 0 };
      const maxRows = options.maxRows ?? 200;
      for (let handled = 0; handled < maxRows; handled++) {
        const [row] = await repo.claimDue({ now: clock.now(), leaseSeconds: policy.leaseSeconds, limit: 1 });
        if (!row) break;
        await deliver(row, await context(), result);
      }
      return result;
    },
  };
}

export type OutboxRelay = ReturnType<typeof createOutboxRelay>;
