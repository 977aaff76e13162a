import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import * as schema from './schema/index';

export type Db = NodePgDatabase<typeof schema>;
/** The handle inside `db.transaction(async (tx) => …)`. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
/** Repos take either, so a service can run several of them in one transaction. */
export type DbOrTx = Db | Tx;

export interface Database {
  db: Db;
  pool: pg.Pool;
  /** True when a trivial query answers within the connect timeout. */
  ping(): Promise<boolean>;
  close(): Promise<void>;
}

export interface DatabaseOptions {
  url: string;
  poolMax: number;
  connectTimeoutMs: number;
  onIdleError?: (error: Error) => void;
}

export function createDatabase(options: DatabaseOptions): Database {
  const pool = new pg.Pool({
    connectionString: options.url,
    max: options.poolMax,
    // A down database must fail a request fast (503), never hang it.
    connectionTimeoutMillis: options.connectTimeoutMs,
    idleTimeoutMillis: 30_000,
    statement_timeout: 15_000,
  });
  // Without a listener an idle client's error (say, PostgreSQL restarting) would crash the process.
  pool.on('error', (error) => options.onIdleError?.(error));
  return {
    db: drizzle(pool, { schema }),
    pool,
    async ping() {
      try {
        await pool.query('select 1');
        return true;
      } catch {
        return false;
      }
    },
    close: () => pool.end(),
  };
}

const unavailableCodes = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'ENOTFOUND', 'EPIPE', '57P01', '57P02', '57P03', '08006', '08001', '08003']);

/** Connection-level failures: the database is down or restarting, not the request's fault. */
export function isDatabaseUnavailable(error: unknown): boolean {
  let current: unknown = error;
  for (let depth = 0; current && depth < 5; depth++) {
    const candidate = current as { code?: string; message?: string; cause?: unknown };
    if (candidate.code && unavailableCodes.has(candidate.code)) return true;
    if (typeof candidate.message === 'string' && /timeout exceeded when trying to connect|Connection terminated/i.test(candidate.message)) {
      return true;
    }
    current = candidate.cause;
  }
  return false;
}
