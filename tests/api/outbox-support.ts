// Helpers for the outbox tests: the mail catcher's REST API, a relay on the test database, waiting.
import { eq, inArray } from 'drizzle-orm';
import { loadConfig, type Config } from '../../server/config';
import { emailOutbox } from '../../server/db/schema/index';
import { createMailer } from '../../server/integrations/mailer';
import { createAdjustableClock, type Clock } from '../../server/lib/clock';
import { createLogger } from '../../server/lib/logger';
import { createOutboxRepo } from '../../server/modules/outbox/outbox.repo';
import { createOutboxRelay, type RelayPolicy } from '../../server/modules/outbox/outbox.service';
import { getTestDb } from '../setup/test-db';

export interface CaughtEmail {
  id: string;
  subject: string;
  to: { address: string }[];
  html?: string;
  text?: string;
  headers: Record<string, string | string[]>;
}

/** What the mail catcher at `webUrl` holds for `address`. */
export async function inboxOf(webUrl: string, address: string): Promise<CaughtEmail[]> {
  const response = await fetch(`${webUrl}/api/email?${new URLSearchParams({ 'to.address': address })}`);
  if (!response.ok) throw new Error(`mail catcher answered ${response.status}`);
  return (await response.json()) as CaughtEmail[];
}

export async function waitFor<T>(read: () => Promise<T>, done: (value: T) => boolean, timeoutMs = 10_000, what = 'condition'): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await read();
    if (done(value)) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}; last value: ${JSON.stringify(value).slice(0, 500)}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

export function testConfig(overrides: Record<string, string> = {}): Config {
  return loadConfig({ NODE_ENV: 'test', LOG_LEVEL: 'silent', STATIC_DIR: 'dist', ...overrides });
}

/** A relay on the test database, sending through `smtpUrl` with a quick retry policy. */
export function testRelay(options: { smtpUrl: string; clock?: Clock; policy?: Partial<RelayPolicy> }) {
  const config = testConfig({ SMTP_URL: options.smtpUrl });
  const mailer = createMailer(config, { connectMs: 2000, socketMs: 5000 });
  const relay = createOutboxRelay({
    repo: createOutboxRepo(getTestDb()),
    mailer,
    clock: options.clock ?? createAdjustableClock(),
    logger: createLogger(config),
    config,
    policy: { baseDelayMs: 50, maxDelayMs: 200, ...options.policy },
  });
  return { relay, mailer, config };
}

export async function outboxRows(dedupeKeys: string[]) {
  return getTestDb().select().from(emailOutbox).where(inArray(emailOutbox.dedupeKey, dedupeKeys));
}

export async function outboxRow(dedupeKey: string) {
  const [row] = await getTestDb().select().from(emailOutbox).where(eq(emailOutbox.dedupeKey, dedupeKey));
  return row;
}

export const restDayPayload = (orderId: string) => ({
  name: 'Test Customer',
  orderId,
  readyFrom: '2026-12-10',
  brewMethod: 'filter' as const,
  coffee: 'Keraba Ridge',
});
