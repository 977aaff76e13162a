import { sql } from 'drizzle-orm';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { startCluster, testClusterOptions } from '../../dev-services/postgres';
import { createDatabase } from '../../server/db/client';
import { waitFor } from '../api/outbox-support';

// Stops the real test cluster mid-run, so this file restarts it (on the same port) whatever happens.
const { port } = startCluster(testClusterOptions());
const restartCluster = () => startCluster({ ...testClusterOptions(), port });
afterAll(() => {
  restartCluster();
});

describe('the database client when connections break', () => {
  it('a transaction caught between two queries by a PostgreSQL restart fails its next query instead of crashing the process', async () => {
    const dropped: string[] = [];
    const database = createDatabase({ url: inject('databaseUrl'), poolMax: 1, connectTimeoutMs: 2000, onIdleError: (error) => dropped.push(error.message) });
    const client = await database.pool.connect();
    try {
      await client.query('begin');
      restartCluster().stop();
      await waitFor(async () => dropped, (messages) => messages.length > 0, 5000, 'the dropped connection to be reported');
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
