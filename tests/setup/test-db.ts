import { afterAll, inject } from 'vitest';
import { createDatabase, type Database, type Db } from '../../server/db/client';

let database: Database | undefined;

/** The test run's own migrated database (never the demo data), one pool per test file. */
export function getTestDatabase(): Database {
  database ??= createDatabase({ url: inject('databaseUrl'), poolMax: 5, connectTimeoutMs: 2000 });
  return database;
}

export function getTestDb(): Db {
  return getTestDatabase().db;
}

afterAll(async () => {
  await database?.close();
  database = undefined;
});
