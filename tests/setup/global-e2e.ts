import { createServer } from 'node:net';
import type { TestProject } from 'vitest/node';
import { buildClientIfStale } from '../../dev-services/build-client';
import { createDatabaseIfMissing, startCluster, testClusterOptions } from '../../dev-services/postgres';
import { createDatabase } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { seedDemo } from '../../server/db/seed/index';
import { loadConfig } from '../../server/config';
import { startServer, type RunningServer } from '../../server/index';
import { createLogger } from '../../server/lib/logger';
import { ensureChromium } from './chromium';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      probe.close(() => (typeof address === 'object' && address ? resolve(address.port) : reject(new Error('no port'))));
    });
  });
}

/** The whole product as a browser meets it: built client, seeded database, real server. */
export default async function setup(project: TestProject) {
  ensureChromium();
  buildClientIfStale();

  const cluster = startCluster(testClusterOptions());
  const stopCluster = () => {
    if (cluster.startedHere) cluster.stop();
  };
  let server: RunningServer;
  try {
    createDatabaseIfMissing(cluster, 'restday_e2e', { recreate: true });
    const databaseUrl = cluster.urlFor('restday_e2e');
    await runMigrations(databaseUrl);
    const seeding = createDatabase({ url: databaseUrl, poolMax: 2, connectTimeoutMs: 5000 });
    await seedDemo(seeding.db, { now: new Date() });
    await seeding.close();

    const config = loadConfig({ NODE_ENV: 'test', LOG_LEVEL: 'warn', DATABASE_URL: databaseUrl, PORT: String(await freePort()) });
    server = await startServer(config, createLogger(config));
  } catch (error) {
    // Teardown only runs after a successful set-up, so a failed one cleans up here.
    stopCluster();
    throw error;
  }
  project.provide('baseUrl', server.url);

  return async () => {
    await server.stop();
    stopCluster();
  };
}
