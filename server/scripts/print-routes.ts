// `npm run routes`: every API route, read from the app's own router. Builds the app without
// listening; the database pool connects lazily, so no database is needed.
import { createApp } from '../app';
import { loadConfig } from '../config';
import { createDatabase } from '../db/client';
import { createAdjustableClock, systemClock } from '../lib/clock';
import { createLogger } from '../lib/logger';
import { routeTable } from '../lib/route-table';

const config = loadConfig({ ...process.env, LOG_LEVEL: 'silent' });
const database = createDatabase({ url: config.DATABASE_URL, poolMax: 1, connectTimeoutMs: 1000 });
const app = createApp({ config, database, logger: createLogger(config), clock: config.RESTDAY_TEST_CLOCK ? createAdjustableClock() : systemClock });
const routes = await routeTable(app);
await database.close();

if (process.argv.includes('--json')) {
  console.log(JSON.stringify(routes, null, 2));
} else {
  const width = (key: keyof (typeof routes)[number]) => Math.max(...routes.map((route) => route[key].length));
  const [method, routePath, access] = [width('method'), width('path'), width('access')];
  for (const route of routes) console.log(`${route.method.padEnd(method)}  ${route.path.padEnd(routePath)}  ${route.access.padEnd(access)}  ${route.file}`);
}
