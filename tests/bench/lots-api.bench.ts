// Benchmark (a script, not a test): GET /api/lots throughput and p99 latency under autocannon
// (50 connections, 10 s), beside a bare Express hello-world route measured in the same run.
// Run: npm run bench:api   (uses the throwaway test cluster, a `restday_bench` database, demo data)
import type { AddressInfo } from 'node:net';
import autocannon from 'autocannon';
import express from 'express';
import { createDatabaseIfMissing, startCluster, testClusterOptions } from '../../dev-services/postgres';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { createDatabase } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { seedDemo } from '../../server/db/seed/index';
import { systemClock } from '../../server/lib/clock';
import { createLogger } from '../../server/lib/logger';

const connections = 50;
const durationSeconds = 10;

async function listen(app: express.Express) {
  const server = app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  return { server, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
}

async function load(url: string) {
  const result = await autocannon({ url, connections, duration: durationSeconds });
  if (result.non2xx > 0 || result.errors > 0) throw new Error(`${url}: ${result.non2xx} non-2xx, ${result.errors} errors`);
  return { requestsPerSecond: result.requests.average, p99Ms: result.latency.p99 };
}

const cluster = startCluster(testClusterOptions());
try {
  createDatabaseIfMissing(cluster, 'restday_bench', { recreate: true });
  const databaseUrl = cluster.urlFor('restday_bench');
  await runMigrations(databaseUrl);
  const config = loadConfig({ NODE_ENV: 'production', PUBLIC_URL: 'http://127.0.0.1', SESSION_SECRET: 'bench-only-secret-0123456789abcdef0123', LOG_LEVEL: 'silent', DATABASE_URL: databaseUrl });
  const database = createDatabase({ url: databaseUrl, poolMax: config.DATABASE_POOL_MAX, connectTimeoutMs: 2000 });
  await seedDemo(database.db, { now: new Date() });

  const hello = express();
  hello.get('/hello', (_req, res) => {
    res.json({ hello: 'world' });
  });
  const baseline = await listen(hello);
  const restday = await listen(createApp({ config, database, logger: createLogger(config), clock: systemClock }));

  const bare = await load(`${baseline.url}/hello`);
  const lots = await load(`${restday.url}/api/lots`);
  console.log(
    `GET /api/lots: ${lots.requestsPerSecond.toFixed(0)} req/s, p99 ${lots.p99Ms} ms; ` +
      `bare Express hello-world: ${bare.requestsPerSecond.toFixed(0)} req/s, p99 ${bare.p99Ms} ms; ` +
      `throughput ratio ${(lots.requestsPerSecond / bare.requestsPerSecond).toFixed(2)} (${connections} connections, ${durationSeconds} s each)`,
  );
  baseline.server.close();
  restday.server.close();
  await database.close();
} finally {
  if (cluster.startedHere) cluster.stop();
}
