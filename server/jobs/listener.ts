import pg from 'pg';
import { backoffDelayMs } from '@shared/domain/backoff';
import type { Logger } from '../lib/logger';

export interface Listener {
  stop(): Promise<void>;
}

/**
 * One dedicated connection that LISTENs on the given channels and calls their handlers. When the
 * connection drops (PostgreSQL restarting), it reconnects with backoff and calls `onReconnect`, so
 * callers can catch up on anything they missed (notifications are not queued for absent listeners).
 */
export function startListener(options: {
  databaseUrl: string;
  logger: Logger;
  channels: Record<string, (payload: string) => void>;
  onReconnect?: () => void;
  /** Called when the connection drops: until `onReconnect`, notifications may be missed. */
  onDisconnect?: () => void;
}): Listener {
  const { logger } = options;
  let client: pg.Client | undefined;
  let stopped = false;
  let retryTimer: NodeJS.Timeout | undefined;
  let failures = 0;

  const connect = async () => {
    if (stopped) return;
    const next = new pg.Client({ connectionString: options.databaseUrl, application_name: 'restday-listener', connectionTimeoutMillis: 5000 });
    let dropped = false;
    const drop = (error?: Error) => {
      if (dropped) return;
      dropped = true;
      if (client === next) client = undefined;
      next.removeAllListeners('notification');
      options.onDisconnect?.();
      void next.end().catch(() => undefined);
      if (stopped) return;
      failures += 1;
      if (failures === 1 || failures % 20 === 0) logger.warn({ err: error }, 'database listener disconnected; reconnecting');
      retryTimer = setTimeout(() => void connect(), backoffDelayMs(500, 5000, failures));
      retryTimer.unref();
    };
    next.on('error', drop);
    next.on('end', () => drop());
    next.on('notification', (message) => {
      const handler = options.channels[message.channel];
      if (handler) handler(message.payload ?? '');
    });
    try {
      await next.connect();
      for (const channel of Object.keys(options.channels)) await next.query(`LISTEN ${pg.escapeIdentifier(channel)}`);
      if (stopped) {
        await next.end();
        return;
      }
      client = next;
      if (failures > 0) logger.info('database listener reconnected');
      failures = 0;
      options.onReconnect?.();
    } catch (error) {
      drop(error as Error);
    }
  };
  void connect();

  return {
    async stop() {
      stopped = true;
      if (retryTimer) clearTimeout(retryTimer);
      const current = client;
      client = undefined;
      await current?.end().catch(() => undefined);
    },
  };
}
