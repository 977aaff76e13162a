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
  '*.currentPassword',
  '*.newPassword',
  '*.resetUrl',
  '*.acceptUrl',
];

/** JSON lines to stdout, or to `destination` (tests read the lines back). */
export function createLogger(config: Pick<Config, 'LOG_LEVEL' | 'NODE_ENV'>, destination?: pino.DestinationStream): Logger {
  return pino(
    {
      level: config.LOG_LEVEL,
      base: { service: 'restday' },
      // ISO 8601 in UTC ("time":"2026-12-01T14:03:00.000Z"): audit lines read the same in any zone.
      timestamp: pino.stdTimeFunctions.isoTime,
      redact: { paths: redactedPaths, censor: '[redacted]' },
    },
    destination,
  );
}
