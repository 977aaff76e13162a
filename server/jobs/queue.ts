import PgBoss from 'pg-boss';
import type { Logger } from '../lib/logger';

export type QueueState = 'up' | 'down' | 'stopped';

export interface Queue {
  boss: PgBoss;
  state(): Promise<QueueState>;
  stop(): Promise<void>;
}

/** Jobs live in PostgreSQL (pg-boss), so any number of app servers and workers share one queue. */
export async function startQueue(databaseUrl: string, logger: Logger): Promise<Queue> {
  const boss = new PgBoss({ connectionString: databaseUrl, max: 4, application_name: 'restday-queue' });
  boss.on('error', (error) => logger.warn({ err: error }, 'job queue error'));
  await boss.start();
  let running = true;
  return {
    boss,
    async state() {
      if (!running) return 'stopped';
      try {
        await boss.getDb().executeSql('select 1', []);
        return 'up';
      } catch {
        return 'down';
      }
    },
    async stop() {
      running = false;
      await boss.stop({ graceful: true, timeout: 5000 });
    },
  };
}
