import { randomUUID } from 'node:crypto';
import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { errorHandler } from '../../server/middleware/error-handler';
import { AppError } from '../../server/lib/app-error';
import { systemClock } from '../../server/lib/clock';
import { createLogger } from '../../server/lib/logger';
import { createAuditRepo } from '../../server/modules/audit/audit.repo';
import { createAuditTrail } from '../../server/modules/audit/audit-trail';
import { createThrottleRepo } from '../../server/modules/auth/throttle.repo';
import { createAuthThrottles } from '../../server/modules/auth/throttles';
import { getTestDb } from '../setup/test-db';
import { testConfig } from './outbox-support';

/**
 * The real sign-in throttles on the real throttle table, in front of a stand-in route whose answer
 * each test scripts: what the throttle counts must depend on the answer, not on how it came about.
 */
function throttledSignIn(answers: () => number) {
  const config = testConfig({ AUTH_THROTTLE_PER_ACCOUNT: '5', AUTH_THROTTLE_PER_IP: '8' });
  const logger = createLogger(config);
  const throttles = createAuthThrottles({
    config,
    repo: createThrottleRepo(getTestDb()),
    clock: systemClock,
    logger,
    audit: createAuditTrail({ repo: createAuditRepo(getTestDb()), logger, clock: systemClock }),
  });
  const app = express();
  app.use((req, _res, next) => {
    (req as unknown as { log: typeof logger }).log = logger;
    next();
  });
  app.post('/sign-in', express.json(), ...throttles.signIn, (_req, res, next) => {
    const status = answers();
    if (status === 200) return void res.json({ ok: true });
    next(status === 503 ? new AppError(503, 'database_unavailable', 'down') : new AppError(status, 'invalid_credentials', 'wrong'));
  });
  app.use(errorHandler);
  // A fresh address per test: its own bucket (the per-address limit is 8).
  const ip = `10.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`;
  app.set('trust proxy', true);
  return (email: string) => request(app).post('/sign-in').set('X-Forwarded-For', ip).send({ email, password: 'whatever' });
}

describe('sign-in throttles count only the client’s failures', () => {
  it('30 answers of 503 during an outage leave the bucket empty: the right password works at once', async () => {
    let answer = 503;
    const signIn = throttledSignIn(() => answer);
    const email = `outage-${randomUUID().slice(0, 8)}@example.test`;
    const during = [];
    for (let attempt = 0; attempt < 30; attempt += 1) during.push((await signIn(email)).status);
    expect(during.every((status) => status === 503)).toBe(true);
    answer = 200;
    expect((await signIn(email)).status).toBe(200);
  });

  it('wrong passwords still fill the account bucket: the sixth try is 429', async () => {
    const signIn = throttledSignIn(() => 401);
    const email = `guess-${randomUUID().slice(0, 8)}@example.test`;
    const statuses = [];
    for (let attempt = 0; attempt < 6; attempt += 1) statuses.push((await signIn(email)).status);
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
  });
});
