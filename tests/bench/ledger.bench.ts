// Benchmark (a script, not a test): the owner's Ledger (GET /api/owner/ledger?weeks=12 and
// ?weeks=104) and green planning (GET /api/roastery/planning) on a generated two-year history of
// 100,000 orders and 2,000 subscriptions with their deliveries, each against the bare SQL aggregate
// over the same rows, measured in turn on the same database (warm-up, then the median of the runs).
// Run: npm run bench:ledger   (uses the throwaway test cluster and a `restday_bench_ledger` database)
import type { AddressInfo } from 'node:net';
import { ledgerWeekStarts } from '@shared/domain/ledger';
import { addDays, instantAt, localDateOf } from '@shared/domain/shop-time';
import { roastLevels } from '@shared/domain/vocabulary';
import { defaultShopSettings } from '@shared/schemas/settings';
import { createDatabaseIfMissing, startCluster, testClusterOptions } from '../../dev-services/postgres';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { createDatabase, type Db, type Database } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { lots, users } from '../../server/db/schema/index';
import { systemClock } from '../../server/lib/clock';
import { createLogger } from '../../server/lib/logger';
import { hashPassword } from '../../server/lib/password-hashing';
import { saveShopSettings } from '../../server/modules/settings/settings.repo';
import { medianMsInTurn } from './median-in-turn';

const orderCount = 100_000;
const subscriptionCount = 2_000;
const oneOffRoastedCount = 5_000;
const lotCount = 20;
const runs = { warmUpRuns: 3, samples: 15 };
const password = 'bench only passphrase 7';
const { timeZone } = defaultShopSettings;

/**
 * The history, set-based: customers, subscriptions with a delivery (and its paid order) every
 * cadence from their start until today or their cancellation and one still to come, one-off roasted
 * orders, green orders (a few refunded) with their sale movements to make 100,000 orders, and
 * two years of batches. Pseudo-random but fixed: every choice is a hash of the row's number.
 */
async function seedHistory(db: Db, database: Database): Promise<string> {
  await saveShopSettings(db, defaultShopSettings, 'Invented Bench Roastery');
  await db.insert(lots).values(
    Array.from({ length: lotCount }, (_, index) => ({
      code: `BL-${String(index + 1).padStart(3, '0')}`,
      name: `Invented ledger lot ${index + 1}`,
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
      stockGrams: 60_000 + index * 7_000,
      pricePerKgCents: 2_200,
      supplierLeadTimeDays: 14 + (index % 4) * 7,
    })),
  );
  const passwordHash = await hashPassword(password);
  const [owner] = await db
    .insert(users)
    .values({ email: 'bench-owner@example.test', name: 'Invented Bench Owner', role: 'owner', passwordHash })
    .returning({ email: users.email });

  const client = await database.pool.connect();
  try {
    await client.query('begin');
    await client.query('set local statement_timeout = 0');
    // h(n, salt): a fixed pseudo-random whole number from 0 up, per row and purpose.
    await client.query(`create temporary table bench_lot as select id, row_number() over (order by code) - 1 as n from lots`);
    await client.query(
      `insert into users (email, name, password_hash, role, created_at, updated_at)
       select 'bench-customer-' || g || '@example.test', 'Invented Customer ' || g, $1, 'customer', now() - interval '800 days', now() - interval '800 days'
       from generate_series(1, 3000) g`,
      [passwordHash],
    );
    await client.query(
      `create temporary table bench_customer as
       select id, row_number() over (order by email) as n from users where role = 'customer'`,
    );
    const address = JSON.stringify({ name: 'Invented Customer', line1: '1 Ledger Road', city: 'Larch Bend', region: 'MT', postalCode: '59701', country: 'US' });
    await client.query(
      `with plan as (
         select g,
                30 + abs(hashtext(g || 'start')) % 700 as started_days_ago,
                1 + abs(hashtext(g || 'cadence')) % 4 as cadence,
                abs(hashtext(g || 'status')) % 10 as status_roll,
                abs(hashtext(g || 'lot')) % 25 as lot_roll,
                1 + abs(hashtext(g || 'bags')) % 2 as bags
         from generate_series(1, $1::int) g
       )
       insert into subscriptions (user_id, status, lot_id, roast_level, bag_size, bags_per_delivery, cadence_weeks, paused_until, paused_at,
                                  shipping_address, price_cents, cancelled_at, anchor_date, created_at, updated_at)
       select c.id,
              (case when p.status_roll = 0 then 'cancelled' when p.status_roll = 1 then 'paused' else 'active' end)::subscription_status,
              (select l.id from bench_lot l where l.n = p.lot_roll),
              (array['light', 'medium', 'medium', 'medium-dark', 'dark'])[1 + abs(hashtext(p.g || 'level')) % 5]::roast_level,
              (array['12oz', '12oz', '1lb', '2lb'])[1 + abs(hashtext(p.g || 'size')) % 4]::bag_size,
              p.bags, p.cadence,
              case when p.status_roll = 1 then current_date + 21 end,
              case when p.status_roll = 1 then now() - interval '10 days' end,
              $2::jsonb, 1800 * p.bags,
              case when p.status_roll = 0 then now() - make_interval(days => (p.started_days_ago * (abs(hashtext(p.g || 'end')) % 90) / 100)) end,
              (now() - make_interval(days => p.started_days_ago))::date,
              now() - make_interval(days => p.started_days_ago), now()
       from plan p join bench_customer c on c.n = p.g`,
      [subscriptionCount, address],
    );
    // A delivery every cadence from the anchor: shipped up to yesterday (or the cancellation), and the next one scheduled.
    await client.query(
      `insert into deliveries (subscription_id, sequence, roast_date, ship_date, ready_from, best_before, status, nominal_date)
       select s.id, k + 1, d, d + 1, d + 2, d + 28,
              (case when d < current_date then 'shipped' else 'scheduled' end)::delivery_status, d
       from subscriptions s
       cross join lateral generate_series(0, 200) k
       cross join lateral (select s.anchor_date + k * 7 * s.cadence_weeks as d) day
       where d < coalesce(s.cancelled_at::date, current_date + 7 * s.cadence_weeks)
         and (s.status <> 'paused' or d < current_date)`,
    );
    await client.query(
      `insert into orders (user_id, kind, status, subscription_id, delivery_id, subtotal_cents, total_cents, shipping_address,
                           roast_date, ship_date, paid_at, shipped_at, created_at, updated_at)
       select s.user_id, 'roasted', 'shipped', s.id, d.id, s.price_cents, s.price_cents, s.shipping_address,
              d.roast_date, d.ship_date, (d.roast_date - 3) + time '15:00', (d.ship_date) + time '17:00',
              (d.roast_date - 3) + time '15:00', (d.ship_date) + time '17:00'
       from deliveries d join subscriptions s on s.id = d.subscription_id
       where d.status = 'shipped'`,
    );
    await client.query(`update deliveries d set order_id = o.id from orders o where o.delivery_id = d.id`);
    const { rows } = await client.query<{ count: string }>(`select count(*) as count from orders`);
    const greenCount = orderCount - oneOffRoastedCount - Number(rows[0]!.count);
    if (greenCount < 0) throw new Error(`the subscriptions alone made ${rows[0]!.count} orders`);
    // One-off roasted orders over two years; the last few days' still to roast.
    await client.query(
      `create temporary table bench_order as
       select g, 'roasted'::order_kind as kind,
              now() - make_interval(secs => (abs(hashtext(g || 'paid')) % (730 * 86400))::double precision) as paid_at,
              abs(hashtext(g || 'status')) % 50 as status_roll
       from generate_series(1, $1::int) g
       union all
       select $1 + g, 'green'::order_kind,
              now() - make_interval(secs => (abs(hashtext(g || 'gpaid')) % (730 * 86400))::double precision),
              abs(hashtext(g || 'gstatus')) % 50
       from generate_series(1, $2::int) g`,
      [oneOffRoastedCount, greenCount],
    );
    await client.query(
      `create temporary table bench_line as
       select g, kind, paid_at, status_roll,
              ids.lots[1 + abs(hashtext(g || 'olot')) % ${lotCount}] as lot_id,
              case when kind = 'green' then (array['8oz', '1lb', '1lb', '2lb', '5lb'])[1 + abs(hashtext(g || 'osize')) % 5]
                   else (array['12oz', '1lb', '2lb'])[1 + abs(hashtext(g || 'osize')) % 3] end::bag_size as size,
              1 + abs(hashtext(g || 'qty')) % 2 as quantity,
              ids.customers[1 + abs(hashtext(g || 'cust')) % 3000] as user_id,
              gen_random_uuid() as order_id
       from bench_order
       cross join (select (select array_agg(id order by n) from bench_lot) as lots, (select array_agg(id order by n) from bench_customer) as customers) ids`,
    );
    await client.query(
      `alter table bench_line add column fill integer, add column unit integer, add column roast_date date;
       update bench_line set fill = case size when '8oz' then 227 when '12oz' then 341 when '1lb' then 454 when '2lb' then 908 when '5lb' then 2268 end;
       update bench_line set unit = (fill * 22 / 10)::int,
                             roast_date = case when kind = 'roasted' then ((paid_at at time zone '${timeZone}')::date + 2) end`,
    );
    await client.query(
      `insert into orders (id, user_id, kind, status, subtotal_cents, shipping_cents, total_cents, shipping_address, roast_date, ship_date,
                           paid_at, shipped_at, refunded_cents, refunded_at, created_at, updated_at)
       select order_id, user_id, kind,
              (case when status_roll = 0 then 'refunded'
                    when kind = 'roasted' and roast_date >= current_date then 'paid'
                    else 'shipped' end)::order_status,
              unit * quantity, 800, unit * quantity + 800, $1::jsonb, roast_date, roast_date + 1,
              paid_at, case when status_roll <> 0 and (roast_date is null or roast_date < current_date) then paid_at + interval '1 day' end,
              case when status_roll = 0 then unit * quantity + 800 else 0 end,
              case when status_roll = 0 then paid_at + interval '3 days' end,
              paid_at, paid_at
       from bench_line`,
      [address],
    );
    await client.query(
      `insert into order_items (order_id, lot_id, kind, size, quantity, fill_grams, roast_level, grind, brew_method, unit_price_cents, line_total_cents)
       select order_id, lot_id, kind, size, quantity, fill,
              case when kind = 'roasted' then 'medium'::roast_level end,
              case when kind = 'roasted' then 'whole-bean'::grind end,
              case when kind = 'roasted' then 'filter'::brew_method end,
              unit, unit * quantity
       from bench_line`,
    );
    await client.query(
      `insert into order_items (order_id, lot_id, kind, size, quantity, fill_grams, roast_level, grind, brew_method, unit_price_cents, line_total_cents)
       select o.id, s.lot_id, 'roasted', s.bag_size, s.bags_per_delivery,
              case s.bag_size when '12oz' then 341 when '1lb' then 454 else 908 end,
              s.roast_level, s.grind, s.brew_method, s.price_cents / s.bags_per_delivery, s.price_cents
       from orders o join subscriptions s on s.id = o.subscription_id`,
    );
    await client.query(
      `insert into stock_movements (lot_id, delta_grams, reason, order_id, created_at)
       select lot_id, -(quantity * fill), 'sale', order_id, paid_at from bench_line where kind = 'green'`,
    );
    // Two batches per lot on every Monday, Wednesday and Friday of the two years.
    await client.query(
      `insert into batches (roast_date, lot_id, roast_level, green_grams_in, roasted_grams_out, loss_pct, within_expected, created_at)
       select day, l.id, 'medium', 9000, 9000 - out, round(out / 90.0, 2), out between 1260 and 1440, day + time '12:00'
       from generate_series(current_date - 730, current_date - 1, interval '1 day') day
       cross join bench_lot l
       cross join generate_series(1, 2) batch
       cross join lateral (select 1250 + abs(hashtext(day::text || l.n || batch)) % 250 as out) loss
       where extract(isodow from day) in (1, 3, 5)`,
    );
    await client.query('commit');
  } catch (error) {
    await client.query('rollback');
    throw error;
  } finally {
    client.release();
  }
  return owner!.email;
}

/** The span the Ledger reads, worked out as the service does: whole ISO weeks to this one, in the shop's time zone. */
function ledgerSpan(weeks: number): [string, string, string, string, string] {
  const weekStarts = ledgerWeekStarts(localDateOf(new Date(), timeZone), weeks);
  const from = weekStarts[0]!;
  const end = addDays(weekStarts.at(-1)!, 7);
  return [from, end, instantAt(from, '00:00', timeZone).toISOString(), instantAt(end, '00:00', timeZone).toISOString(), timeZone];
}

/**
 * What the Ledger reads, as one plain statement: the ISO weeks of the span in the shop's time zone,
 * and per week the paid sales by kind, refunds, green sold and roasted, the subscriptions on the books
 * and their monthly recurring revenue; and the span's batches by lot and level.
 */
const ledgerSql = `
  with weeks as (
    select w::date as week_start, w::timestamp at time zone $5 as starts, (w + interval '7 days')::timestamp at time zone $5 as ends
    from generate_series($1::date, $2::date - 1, interval '7 days') w
  ), paid as (
    select date_trunc('week', o.paid_at at time zone $5)::date as week_start,
           sum(o.total_cents) filter (where o.kind = 'green') as green,
           sum(o.total_cents) filter (where o.kind = 'roasted' and o.subscription_id is null) as roasted,
           sum(o.total_cents) filter (where o.subscription_id is not null) as subscription,
           count(*) as orders
    from orders o where o.paid_at >= $3::timestamptz and o.paid_at < $4::timestamptz group by 1
  ), refunds as (
    select date_trunc('week', o.refunded_at at time zone $5)::date as week_start, sum(o.refunded_cents) as cents
    from orders o where o.refunded_at >= $3::timestamptz and o.refunded_at < $4::timestamptz group by 1
  ), sold as (
    select date_trunc('week', o.paid_at at time zone $5)::date as week_start, sum(oi.quantity * oi.fill_grams) as grams
    from orders o join order_items oi on oi.order_id = o.id
    where o.kind = 'green' and o.paid_at >= $3::timestamptz and o.paid_at < $4::timestamptz group by 1
  ), roasted as (
    select date_trunc('week', b.roast_date)::date as week_start, sum(b.green_grams_in) as grams
    from batches b where b.roast_date >= $1::date and b.roast_date < $2::date group by 1
  ), subscribed as (
    select w.week_start,
           count(*) filter (where s.created_at >= w.starts) as started,
           count(*) filter (where s.paused_at >= w.starts and s.paused_at < w.ends) as paused,
           count(*) filter (where s.cancelled_at >= w.starts and s.cancelled_at < w.ends) as cancelled,
           count(*) filter (where s.cancelled_at is null or s.cancelled_at >= w.ends) as active,
           sum(round(s.price_cents * 52.0 / 12 / s.cadence_weeks)) filter (
             where (s.cancelled_at is null or s.cancelled_at >= w.ends)
               and not (s.paused_at < w.ends and s.paused_until > w.week_start + 6)) as recurring
    from weeks w join subscriptions s on s.status <> 'incomplete' and s.created_at < w.ends
    group by 1
  ), loss as (
    select l.code, b.roast_level, count(*) as batches, sum(b.green_grams_in) as green, sum(b.roasted_grams_out) as roasted
    from batches b join lots l on l.id = b.lot_id
    where b.roast_date >= $1::date and b.roast_date < $2::date group by 1, 2
  )
  select w.week_start, p.green, p.roasted, p.subscription, p.orders, r.cents as refunds, so.grams as sold, ro.grams as roasted_green,
         su.started, su.paused, su.cancelled, su.active, su.recurring, (select json_agg(loss) from loss) as loss
  from weeks w
  left join paid p using (week_start) left join refunds r using (week_start) left join sold so using (week_start)
  left join roasted ro using (week_start) left join subscribed su using (week_start)
  order by w.week_start`;

/**
 * What green planning reads, aggregated as plainly as SQL allows: per lot and coming week, the green
 * that the active subscriptions' deliveries on their grid need (by the level's default loss and the
 * overage) beside the kept skips, plus paid roasted orders still to roast, against stock and the
 * last 28 days' green sales.
 */
const planningSql = `
  with weeks as (
    select current_date + 7 * k as starts, current_date + 7 * (k + 1) as ends from generate_series(0, $1::int - 1) k
  ), loss(level, pct) as (
    values ('light'::roast_level, 12.5), ('medium', 15), ('medium-dark', 17), ('dark', 19), ('french', 22)
  ), due as (
    select s.lot_id, s.anchor_date + 7 * s.cadence_weeks * k as roast_date,
           s.bags_per_delivery * case s.bag_size when '12oz' then 341 when '1lb' then 454 else 908 end as roasted_grams, s.roast_level, s.id
    from subscriptions s cross join lateral generate_series(0, 200) k
    where s.status in ('active', 'paused', 'past_due') and s.anchor_date + 7 * s.cadence_weeks * k >= current_date
      and s.anchor_date + 7 * s.cadence_weeks * k < current_date + 7 * $1::int
      and (s.paused_until is null or s.anchor_date + 7 * s.cadence_weeks * k >= s.paused_until)
  ), kept as (
    select d.subscription_id, d.roast_date from deliveries d where d.roast_date >= current_date - 28 and d.status = 'skipped'
  ), subscription_need as (
    select due.lot_id, w.starts, sum(due.roasted_grams * 1.02 / (1 - loss.pct / 100)) as grams
    from due join weeks w on due.roast_date >= w.starts and due.roast_date < w.ends join loss on loss.level = due.roast_level
    where not exists (select 1 from kept where kept.subscription_id = due.id and kept.roast_date = due.roast_date)
    group by 1, 2
  ), paid_need as (
    select oi.lot_id, w.starts, sum(oi.quantity * oi.fill_grams * 1.02 / (1 - loss.pct / 100)) as grams
    from orders o join order_items oi on oi.order_id = o.id join weeks w on o.roast_date >= w.starts and o.roast_date < w.ends
    join loss on loss.level = oi.roast_level
    where o.kind = 'roasted' and o.status in ('paid', 'held') and oi.kind = 'roasted' group by 1, 2
  ), sold as (
    select m.lot_id, -sum(m.delta_grams) as grams from stock_movements m
    where m.reason = 'sale' and m.created_at >= now() - interval '28 days' group by 1
  )
  select l.code, l.stock_grams, sold.grams as sold_grams, w.starts, sn.grams as subscription_grams, pn.grams as paid_grams
  from lots l cross join weeks w
  left join subscription_need sn on sn.lot_id = l.id and sn.starts = w.starts
  left join paid_need pn on pn.lot_id = l.id and pn.starts = w.starts
  left join sold on sold.lot_id = l.id
  order by l.code, w.starts`;

const cluster = startCluster(testClusterOptions());
try {
  const databaseName = 'restday_bench_ledger';
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
  const seedingStarted = performance.now();
  const ownerEmail = await seedHistory(database.db, database);
  await database.pool.query('vacuum analyze');
  const counts = (
    await database.pool.query<{ orders: string; subscriptions: string; deliveries: string; batches: string }>(
      `select (select count(*) from orders) as orders, (select count(*) from subscriptions) as subscriptions,
              (select count(*) from deliveries) as deliveries, (select count(*) from batches) as batches`,
    )
  ).rows[0]!;
  console.log(
    `Generated ${Number(counts.orders).toLocaleString('en-US')} orders, ${Number(counts.subscriptions).toLocaleString('en-US')} subscriptions, ` +
      `${Number(counts.deliveries).toLocaleString('en-US')} deliveries and ${Number(counts.batches).toLocaleString('en-US')} batches ` +
      `in ${((performance.now() - seedingStarted) / 1000).toFixed(1)} s`,
  );

  const server = createApp({ config, database, logger: createLogger(config), clock: systemClock }).listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const signIn = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-Restday-Client': 'web' },
    body: JSON.stringify({ email: ownerEmail, password }),
  });
  if (!signIn.ok) throw new Error(`sign-in answered ${signIn.status}`);
  const cookie = signIn.headers
    .getSetCookie()
    .map((value) => value.split(';')[0])
    .join('; ');

  const endpoint = (path: string, check: (body: unknown) => void) => async () => {
    const response = await fetch(`${base}${path}`, { headers: { cookie } });
    if (!response.ok) throw new Error(`${path} answered ${response.status}`);
    check(await response.json());
  };
  type LedgerBody = { sales: { totalCents: number }[] };
  type BareLedgerRow = { green: string | null; roasted: string | null; subscription: string | null };

  // The bare side's own connection. Its one long statement is estimated dear enough for PostgreSQL to
  // JIT-compile it (0.8 s here, more than the query takes); the app's smaller statements never are.
  const bare = await database.pool.connect();
  await bare.query('set jit = off');
  const results: string[] = [];
  for (const weeks of [12, 104]) {
    let endpointCents = 0;
    let bareCents = 0;
    const [bareMs, endpointMs] = await medianMsInTurn(
      async () => {
        const { rows } = await bare.query<BareLedgerRow>(ledgerSql, ledgerSpan(weeks));
        bareCents = rows.reduce((sum, row) => sum + Number(row.green ?? 0) + Number(row.roasted ?? 0) + Number(row.subscription ?? 0), 0);
      },
      endpoint(`/api/owner/ledger?weeks=${weeks}`, (body) => {
        endpointCents = (body as LedgerBody).sales.reduce((sum, week) => sum + week.totalCents, 0);
      }),
      runs,
    );
    if (endpointCents !== bareCents) throw new Error(`weeks=${weeks}: the Ledger's sales add up to ${endpointCents} cents, the bare SQL's to ${bareCents}`);
    results.push(
      `GET /api/owner/ledger?weeks=${weeks}: median ${endpointMs.toFixed(1)} ms; bare SQL aggregate: median ${bareMs.toFixed(1)} ms; ratio ${(endpointMs / bareMs).toFixed(2)}×`,
    );
  }
  let plannedLots = 0;
  const [bareMs, endpointMs] = await medianMsInTurn(
    () => bare.query(planningSql, [8]),
    endpoint('/api/roastery/planning', (body) => {
      plannedLots = (body as { lots: unknown[] }).lots.length;
    }),
    runs,
  );
  if (plannedLots !== lotCount) throw new Error(`planning answered ${plannedLots} lots, expected ${lotCount}`);
  results.push(
    `GET /api/roastery/planning: median ${endpointMs.toFixed(1)} ms; bare SQL aggregate: median ${bareMs.toFixed(1)} ms; ratio ${(endpointMs / bareMs).toFixed(2)}×`,
  );
  for (const line of results) console.log(line);
  console.log(`(target ≤ 3×; ${runs.samples} runs each, in turn, after ${runs.warmUpRuns} warm-up runs)`);
  bare.release();
  server.close();
  await database.close();
} finally {
  if (cluster.startedHere) cluster.stop();
}
