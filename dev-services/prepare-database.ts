// Brings the project's own database up to date: cluster running, database present, migrated, demo data in.
import { createDatabaseIfMissing, devClusterOptions, startCluster, type RunningCluster } from './postgres';
import { createDatabase } from '../server/db/client';
import { runMigrations } from '../server/db/migrate';
import { seedDemo } from '../server/db/seed/index';

export interface PreparedDatabase {
  url: string;
  /** Set when the URL points at the project's own cluster (not a DATABASE_URL from outside). */
  cluster?: RunningCluster;
}

export async function prepareDatabase(options: { seed: boolean }): Promise<PreparedDatabase> {
  let prepared: PreparedDatabase;
  if (process.env.DATABASE_URL) {
    prepared = { url: process.env.DATABASE_URL };
  } else {
    const cluster = startCluster(devClusterOptions());
    createDatabaseIfMissing(cluster, 'restday');
    prepared = { url: cluster.urlFor('restday'), cluster };
  }
  await runMigrations(prepared.url);
  if (options.seed) {
    const database = createDatabase({ url: prepared.url, poolMax: 2, connectTimeoutMs: 5000 });
    try {
      const { seeded } = await seedDemo(database.db, { now: new Date() });
      if (seeded) console.log('Demo scenario seeded (Wrenfield Roastworks, all invented).');
    } finally {
      await database.close();
    }
  }
  return prepared;
}
