// Benchmark (a script, not a test): GET /api/lots throughput and p99 latency under autocannon
// (50 connections, 10 s), beside a bare Express hello-world route measured in the same run.
// autocannon fires from a worker thread, so the load generator does not share the servers' event
// loop, and the two routes run in A-B-B-A order, so a machine busy with other work in one half of
// the run weighs on both sides alike.
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
import { startLotListCache } from '../../server/modules/lots/lot-list-cache';

const connections = 50;
const durationSeconds = 10;

async function listen(app: express.Express) {
  const server = app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  return { server, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
}

type Load = { requestsPerSecond: number; p99Ms: number };

async function load(url: string): Promise<Load> {
  const result = await autocannon({ url, connections, duration: durationSeconds, workers: 1 });
  if (result.non2xx > 0 || result.errors > 0) throw new Error(`${url}: ${result.non2xx} non-2xx, ${result.errors} errors`);
  return { requestsPerSecond: result.requests.average, p99Ms: result.latency.p99 };
}

const mean = (loads: Load[], pick: (load: Load) => number) => loads.reduce((sum, load) => sum + pick(load), 0) / loads.length;
const describe = (loads: Load[]) =>
  `${mean(loads, (load) => load.requestsPerSecond).toFixed(0)} req/s, p99 ${mean(loads, (load) => load.p99Ms).toFixed(0)} ms ` +
  `(rounds: ${loads.map((load) => `${load.requestsPerSecond.toFixed(0)} req/s, p99 ${load.p99Ms} ms`).join('; ')})`;

const cluster = startCluster(testClusterOptions());
try {
  createDatabaseIfMissing(cluster, 'restday_bench', { recreate: true });
  const databaseUrl = cluster.urlFor('restday_bench');
  await runMigrations(databaseUrl);
  const config = loadConfig({
    NODE_ENV: 'production',
    PUBLIC_URL: 'http://127.0.0.1',
    SESSION_SECRET: 'bench-only-secret-0123456789abcdef0123',
    LOG_LEVEL: 'silent',
    DATABASE_URL: databaseUrl,
  });
  const database = createDatabase({ url: databaseUrl, poolMax: config.DATABASE_POOL_MAX, connectTimeoutMs: 2000 });
  await seedDemo(database.db, { now: new Date() });

  const hello = express();
  hello.get('/hello', (_req, res) => {
    res.json({ hello: 'world' });
  });
  const baseline = await listen(hello);
  // As a server process runs it: the lot list held in memory, dropped on each lots_changed notice.
  const lotListCache = startLotListCache({ databaseUrl, logger: createLogger(config) });
  const restday = await listen(createApp({ config, database, logger: createLogger(config), clock: systemClock, lotListCache }));

  const bare: Load[] = [];
  const lots: Load[] = [];
  bare.push(await load(`${baseline.url}/hello`));
  lots.push(await load(`${restday.url}/api/lots`));
  lots.push(await load(`${restday.url}/api/lots`));
  bare.push(await load(`${baseline.url}/hello`));
  const ratio = mean(lots, (load) => load.requestsPerSecond) / mean(bare, (load) => load.requestsPerSecond);
  console.log(`GET /api/lots: ${describe(lots)}`);
  console.log(`bare Express hello-world: ${describe(bare)}`);
  console.log(`throughput ratio ${ratio.toFixed(2)} (${connections} connections, ${durationSeconds} s a round, A-B-B-A)`);
  baseline.server.close();
  restday.server.close();
  await lotListCache.stop();
  await database.close();
} finally {
  if (cluster.startedHere) cluster.stop();
}
