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

/**
 * drizzle-orm 0.45 sends BEGIN before the try/finally that gives the client back, so a BEGIN that
 * fails (a connection that died while pooled, one left in an aborted transaction) keeps its client
 * checked out for good: the pool runs dry and `close()` never returns (drizzle-team/drizzle-orm#6241).
 * Here each transaction runs on a client this code checks out and always releases, destroying it
 * when BEGIN itself failed.
 */
function withReleasingTransactions(db: Db, pool: pg.Pool): Db {
  const transaction: Db['transaction'] = async (work, config) => {
    const client = await pool.connect();
    let began = false;
    let failure: Error | undefined;
    try {
      return await drizzle(client, { schema }).transaction((tx) => {
        began = true;
        return work(tx);
      }, config);
    } catch (error) {
      failure = error instanceof Error ? error : new Error(String(error));
      throw error;
    } finally {
      // pg-pool drops a client whose connection broke; one whose BEGIN failed must be dropped by hand.
      client.release(began ? undefined : failure);
    }
  };
  db.transaction = transaction;
  return db;
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
  // The pool's listener only covers idle clients. A checked-out client between two queries of a
  // transaction has none, so PostgreSQL restarting then would crash the process; with this, its next
  // query fails instead (a 503, retried by the caller).
  pool.on('connect', (client) => client.on('error', (error) => options.onIdleError?.(error)));
  return {
    db: withReleasingTransactions(drizzle(pool, { schema }), pool),
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

/**
 * What node-postgres says when a request reaches a connection that already broke: its own words
 * (no SQLSTATE), seen on the query after a drop and on the ROLLBACK a failed transaction then sends.
 */
const brokenConnectionMessages =
  /timeout exceeded when trying to connect|Connection terminated|is not queryable|Client was closed|Cannot use a pool after calling end/i;

/** Connection-level failures: the database is down or restarting, not the request's fault. */
export function isDatabaseUnavailable(error: unknown): boolean {
  let current: unknown = error;
  for (let depth = 0; current && depth < 5; depth++) {
    const candidate = current as { code?: string; message?: string; cause?: unknown };
    if (candidate.code && unavailableCodes.has(candidate.code)) return true;
    if (typeof candidate.message === 'string' && brokenConnectionMessages.test(candidate.message)) return true;
    current = candidate.cause;
  }
  return false;
}
