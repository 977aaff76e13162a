import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { drizzle } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import pg from 'pg';

const migrationsFolder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../drizzle');

/** Applies drizzle-kit's committed migrations; already-applied ones are skipped. */
export async function runMigrations(databaseUrl: string): Promise<void> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    // Quiet the "already exists, skipping" notices of the migrations table on every start.
    await client.query("set client_min_messages = 'warning'");
    await migrate(drizzle(client), { migrationsFolder });
  } finally {
    await client.end();
  }
}
