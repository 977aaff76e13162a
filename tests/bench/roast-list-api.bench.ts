// Benchmark (a script, not a test): GET /api/roastery/days/:date/roast-list on a roast day of
// 10,000 order lines over 20 lots, against the bare SQL query that reads the same rows, both
// measured in the same run on the same database (warm-up, then the median of many requests).
// Run: npm run bench:roast-list-api   (uses the throwaway test cluster and a `restday_bench_roast_list` database)
import type { AddressInfo } from 'node:net';
import { bagFillGrams } from '@shared/domain/units';
import { roastedBagSizes, roastLevels } from '@shared/domain/vocabulary';
import { createDatabaseIfMissing, startCluster, testClusterOptions } from '../../dev-services/postgres';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { createDatabase, type Db } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { batches, lots, orderItems, orders, rotationPicks, users } from '../../server/db/schema/index';
import { systemClock } from '../../server/lib/clock';
import { createLogger } from '../../server/lib/logger';
import { hashPassword } from '../../server/lib/password-hashing';
import { saveShopSettings } from '../../server/modules/settings/settings.repo';
import { medianMsInTurn } from './median-in-turn';
import { defaultShopSettings } from '@shared/schemas/settings';

const roastDate = '2026-12-09';
const lineCount = 10_000;
const lotCount = 20;
const warmUpRuns = 30;
const samples = 201;
const password = 'bench only passphrase 7';

/** A fixed, reproducible day (xorshift32), invented for the benchmark. */
function random(seed: number) {
  let state = seed;
  return (modulo: number) => {
    state ^= state << 13;
    state ^= state >>> 17;
    state ^= state << 5;
    return Math.floor(((state >>> 0) / 2 ** 32) * modulo);
  };
}

async function insertChunked<T>(rows: T[], insert: (chunk: T[]) => Promise<unknown>) {
  for (let start = 0; start < rows.length; start += 1_000) await insert(rows.slice(start, start + 1_000));
}

/** 20 lots, 300 customers, orders of 1–4 lines making exactly 10,000 lines, some Roaster's Rotation, and a batch history. */
async function seedRoastDay(db: Db): Promise<string> {
  const next = random(20_261_209);
  await saveShopSettings(db, defaultShopSettings, 'Invented Bench Roastery');
  const lotRows = await db
    .insert(lots)
    .values(
      Array.from({ length: lotCount }, (_, index) => ({
        code: `BN-${String(index + 1).padStart(3, '0')}`,
        name: `Invented bench lot ${index + 1}`,
        origin: 'Testland',
        region: 'Bench Valley',
        producer: 'Invented Bench Growers',
        variety: 'Typica',
        process: 'washed' as const,
        altitudeM: 1_700,
        cropYear: 2026,
        moisturePct: 10.8,
        suggestedLevel: 'medium' as const,
        allowedLevels: [...roastLevels],
        stockGrams: 20_000 + next(200_000),
        pricePerKgCents: 2_200,
      })),
    )
    .returning({ id: lots.id });
  const lotIds = lotRows.map((row) => row.id);
  await db.insert(rotationPicks).values({ roastDate, lotId: lotIds[0]! });
  const history = [];
  for (const lotId of lotIds.slice(0, 10)) {
    for (let batch = 0; batch < 4; batch += 1) {
      history.push({
        roastDate: '2026-11-30',
        lotId,
        roastLevel: 'medium' as const,
        greenGramsIn: 9_000,
        roastedGramsOut: 7_650 - next(90),
        lossPct: 15,
        withinExpected: true,
      });
    }
  }
  await db.insert(batches).values(history);

  const passwordHash = await hashPassword(password);
  const [staff] = await db
    .insert(users)
    .values({ email: 'bench-staff@example.test', name: 'Invented Bench Roaster', role: 'staff', passwordHash })
    .returning({ email: users.email });
  const customers = await db
    .insert(users)
    .values(Array.from({ length: 300 }, (_, index) => ({ email: `bench-customer-${index}@example.test`, name: `Invented Customer ${index}`, passwordHash })))
    .returning({ id: users.id });

  const address = { name: 'Invented Customer', line1: '1 Bench Road', city: 'Larch Bend', region: 'MT', postalCode: '59701', country: 'US' };
  const linesPerOrder: number[] = [];
  for (let remaining = lineCount; remaining > 0;) {
    const count = Math.min(remaining, 1 + next(4));
    linesPerOrder.push(count);
    remaining -= count;
  }
  const orderRows: { id: string }[] = [];
  await insertChunked(linesPerOrder, async (chunk) => {
    orderRows.push(
      ...(await db
        .insert(orders)
        .values(
          chunk.map(() => ({
            userId: customers[next(customers.length)]!.id,
            kind: 'roasted' as const,
            status: next(10) === 0 ? ('held' as const) : ('paid' as const),
            subtotalCents: 0,
            totalCents: 0,
            shippingAddress: address,
            roastDate,
            paidAt: new Date('2026-12-07T15:00:00Z'),
          })),
        )
        .returning({ id: orders.id })),
    );
  });
  const itemRows = orderRows.flatMap((order, index) =>
    Array.from({ length: linesPerOrder[index]! }, () => {
      const size = roastedBagSizes[next(roastedBagSizes.length)]!;
      return {
        orderId: order.id,
        // About one line in twenty is Roaster's Rotation (the day's pick).
        lotId: next(20) === 0 ? null : lotIds[next(lotCount)]!,
        kind: 'roasted' as const,
        size,
        quantity: 1 + next(3),
        fillGrams: bagFillGrams(size),
        roastLevel: roastLevels[next(roastLevels.length)]!,
        grind: 'whole-bean' as const,
        brewMethod: 'filter' as const,
        unitPriceCents: 0,
        lineTotalCents: 0,
      };
    }),
  );
  await insertChunked(itemRows, (chunk) => db.insert(orderItems).values(chunk));
  return staff!.email;
}

const cluster = startCluster(testClusterOptions());
try {
  const databaseName = 'restday_bench_roast_list';
  createDatabaseIfMissing(cluster, databaseName, { recreate: true });
  const databaseUrl = cluster.urlFor(databaseName);
  await runMigrations(databaseUrl);
  const config = loadConfig({
    NODE_ENV: 'production',
    PUBLIC_URL: 'http://127.0.0.1',
    SESSION_SECRET: 'bench-only-secret-0123456789abcdef0123',
    LOG_LEVEL: 'silent',
    DATABASE_URL: databaseUrl,
  });
  const database = createDatabase({ url: databaseUrl, poolMax: config.DATABASE_POOL_MAX, connectTimeoutMs: 2000 });
  const staffEmail = await seedRoastDay(database.db);
  await database.pool.query('analyze');

  const server = createApp({ config, database, logger: createLogger(config), clock: systemClock }).listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const signIn = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-Restday-Client': 'web' },
    body: JSON.stringify({ email: staffEmail, password }),
  });
  if (!signIn.ok) throw new Error(`sign-in answered ${signIn.status}`);
  const cookie = signIn.headers
    .getSetCookie()
    .map((value) => value.split(';')[0])
    .join('; ');

  let listedBags = 0;
  const endpoint = async () => {
    const response = await fetch(`${base}/api/roastery/days/${roastDate}/roast-list`, { headers: { cookie } });
    if (!response.ok) throw new Error(`roast list answered ${response.status}`);
    const list = (await response.json()) as { lines: { bags: number }[] };
    listedBags = list.lines.reduce((total, line) => total + line.bags, 0);
  };
  // The rows the endpoint reads, one per order line, read as plainly as SQL allows and left as they are.
  let bareRows = 0;
  let bareBags = 0;
  const bareQuery = async () => {
    const result = await database.pool.query<{ lot_id: string | null; roast_level: string; fill_grams: number; quantity: number }>(
      `select oi.lot_id, oi.roast_level, oi.fill_grams, oi.quantity
       from orders o
       join order_items oi on oi.order_id = o.id
       where o.roast_date = $1 and o.kind = 'roasted' and o.status in ('paid', 'held') and oi.kind = 'roasted'`,
      [roastDate],
    );
    bareRows = result.rows.length;
    bareBags = result.rows.reduce((total, row) => total + row.quantity, 0);
  };

  const [bareMs, endpointMs] = await medianMsInTurn(bareQuery, endpoint, { warmUpRuns, samples });
  if (bareRows !== lineCount) throw new Error(`the bare query read ${bareRows} rows, expected ${lineCount}`);
  if (listedBags !== bareBags) throw new Error(`the roast list holds ${listedBags} bags, the rows ${bareBags}`);
  console.log(
    `GET /api/roastery/days/:date/roast-list, ${lineCount.toLocaleString('en-US')} order lines over ${lotCount} lots: median ${endpointMs.toFixed(2)} ms; ` +
      `bare SQL reading the same ${bareRows.toLocaleString('en-US')} rows: median ${bareMs.toFixed(2)} ms; ` +
      `ratio ${(endpointMs / bareMs).toFixed(2)}× (target ≤ 2×; ${samples} runs each, in turn, after ${warmUpRuns} warm-up runs)`,
  );
  server.close();
  await database.close();
} finally {
  if (cluster.startedHere) cluster.stop();
}
