import { sql } from 'drizzle-orm';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { startCluster, testClusterOptions } from '../../dev-services/postgres';
import { createDatabase, isDatabaseUnavailable } from '../../server/db/client';
import { waitFor } from '../api/outbox-support';

// Stops the real test cluster mid-run, so this file restarts it (on the same port) whatever happens.
const { port } = startCluster(testClusterOptions());
const restartCluster = () => startCluster({ ...testClusterOptions(), port });
afterAll(() => {
  restartCluster();
});

describe('what counts as "database unavailable" (503, not 500)', () => {
  it('a transaction whose connection is killed mid-way fails, and so does its ROLLBACK: the error reads as unavailable', async () => {
    const database = createDatabase({ url: inject('databaseUrl'), poolMax: 1, connectTimeoutMs: 2000, onIdleError: () => {} });
    const killer = createDatabase({ url: inject('databaseUrl'), poolMax: 1, connectTimeoutMs: 2000 });
    try {
      const failure = await database.db
        .transaction(async (tx) => {
          const [row] = (await tx.execute<{ pid: number }>(sql`select pg_backend_pid() as pid`)).rows;
          await killer.db.execute(sql`select pg_terminate_backend(${row!.pid})`);
          await tx.execute(sql`select 1`);
        })
        .then(
          () => undefined,
          (error: unknown) => error,
        );
      expect(failure).toBeInstanceOf(Error);
      expect(isDatabaseUnavailable(failure), String(failure)).toBe(true);
      // The pool dropped the broken client: the next transaction runs on a fresh connection.
      const rows = await database.db.transaction(async (tx) => (await tx.execute<{ ok: number }>(sql`select 1 as ok`)).rows);
      expect(rows).toEqual([{ ok: 1 }]);
    } finally {
      await killer.close();
      await database.close();
    }
  });

  it('a client that is no longer queryable, and a pool already ended, read as unavailable; a bad query does not', async () => {
    const database = createDatabase({ url: inject('databaseUrl'), poolMax: 1, connectTimeoutMs: 2000, onIdleError: () => {} });
    const client = await database.pool.connect();
    const killer = createDatabase({ url: inject('databaseUrl'), poolMax: 1, connectTimeoutMs: 2000 });
    const { rows } = await client.query<{ pid: number }>('select pg_backend_pid() as pid');
    await killer.db.execute(sql`select pg_terminate_backend(${rows[0]!.pid})`);
    await killer.close();
    const ended = new Promise((resolve) => client.once('end', resolve));
    const killed = await client.query('select 1').then(
      () => undefined,
      (error: unknown) => error,
    );
    await ended;
    const notQueryable = await client.query('select 1').then(
      () => undefined,
      (error: unknown) => error,
    );
    client.release(true);
    expect(isDatabaseUnavailable(killed), String(killed)).toBe(true);
    expect(String(notQueryable)).toMatch(/not queryable/);
    expect(isDatabaseUnavailable(notQueryable)).toBe(true);
    const badQuery = await database.pool.query('select 1 / 0').then(
      () => undefined,
      (error: unknown) => error,
    );
    expect(isDatabaseUnavailable(badQuery)).toBe(false);
    await database.close();
    const afterEnd = await database.pool.query('select 1').then(
      () => undefined,
      (error: unknown) => error,
    );
    expect(isDatabaseUnavailable(afterEnd), String(afterEnd)).toBe(true);
  });
});

describe('the database client when connections break', () => {
  it('a transaction caught between two queries by a PostgreSQL restart fails its next query instead of crashing the process', async () => {
    const dropped: string[] = [];
    const database = createDatabase({ url: inject('databaseUrl'), poolMax: 1, connectTimeoutMs: 2000, onIdleError: (error) => dropped.push(error.message) });
    const client = await database.pool.connect();
    try {
      await client.query('begin');
      restartCluster().stop();
      await waitFor(
        async () => dropped,
        (messages) => messages.length > 0,
        5000,
        'the dropped connection to be reported',
      );
      await expect(client.query('select 1')).rejects.toThrow();
    } finally {
      client.release(true);
      restartCluster();
    }
    expect((await database.pool.query<{ ok: number }>('select 1 as ok')).rows).toEqual([{ ok: 1 }]);
    await database.close();
  });

  it('a transaction whose BEGIN fails gives its connection back, so the next transaction still gets one', async () => {
    const database = createDatabase({ url: inject('databaseUrl'), poolMax: 1, connectTimeoutMs: 1000 });
    // Leave the pool's only connection inside an aborted transaction: the next BEGIN on it fails (25P02).
    const client = await database.pool.connect();
    await client.query('begin');
    await expect(client.query('select 1 / 0')).rejects.toThrow('division by zero');
    client.release();

    await expect(database.db.transaction((tx) => tx.execute(sql`select 1`))).rejects.toThrow();
    const rows = await database.db.transaction(async (tx) => (await tx.execute<{ ok: number }>(sql`select 1 as ok`)).rows);
    expect(rows).toEqual([{ ok: 1 }]);
    await database.close();
  });
});
