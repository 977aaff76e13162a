import type { Express } from 'express';
import { inject } from 'vitest';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { createAdjustableClock, type Clock } from '../../server/lib/clock';
import type { Queue } from '../../server/jobs/queue';
import { createLogger, type Logger } from '../../server/lib/logger';
import { getTestDatabase } from './test-db';

export interface TestAppOptions {
  /** Environment overrides, read as the server reads its environment. */
  env?: Record<string, string>;
  clock?: Clock;
  logger?: Logger;
  /** The job queue, for tests whose requests queue jobs (e.g. a test clock move runs due jobs). */
  queue?: Queue;
}

/** createApp() on the test database, as API tests use it through supertest. */
export function createTestApp(options: TestAppOptions = {}): Express {
  const config = loadConfig({
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
    STATIC_DIR: 'dist',
    // Every API test file connects from 127.0.0.1 and counts in one throttle table; throttling has its own tests.
    AUTH_THROTTLE_PER_IP: '100000',
    // Stripe calls go to the tests' local payment fake, never to Stripe.
    STRIPE_API_URL: inject('stripeFakeUrl'),
    STRIPE_WEBHOOK_SECRET: inject('stripeWebhookSecret'),
    ...options.env,
  });
  return createApp({
    config,
    database: getTestDatabase(),
    logger: options.logger ?? createLogger(config),
    clock: options.clock ?? createAdjustableClock(),
    ...(options.queue ? { queue: options.queue } : {}),
  });
}
