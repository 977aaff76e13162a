import type { Express } from 'express';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { createAdjustableClock } from '../../server/lib/clock';
import { createLogger } from '../../server/lib/logger';
import { getTestDatabase } from './test-db';

/** createApp() on the test database, as API tests use it through supertest. */
export function createTestApp(): Express {
  const config = loadConfig({ NODE_ENV: 'test', LOG_LEVEL: 'silent', STATIC_DIR: 'dist' });
  return createApp({ config, database: getTestDatabase(), logger: createLogger(config), clock: createAdjustableClock() });
}
