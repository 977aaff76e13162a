import { pino } from 'pino';
import type { Config } from '../config';

export type Logger = pino.Logger;

/** Secrets never reach the log, whatever a caller passes in. */
const redactedPaths = [
  'req.headers.cookie',
  'req.headers.authorization',
  'req.headers["stripe-signature"]',
  'res.headers["set-cookie"]',
  '*.password',
  '*.token',
  '*.passwordHash',
];

export function createLogger(config: Pick<Config, 'LOG_LEVEL' | 'NODE_ENV'>): Logger {
  return pino({
    level: config.LOG_LEVEL,
    base: { service: 'restday' },
    redact: { paths: redactedPaths, censor: '[redacted]' },
  });
}
