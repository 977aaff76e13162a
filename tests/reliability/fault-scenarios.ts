// `npm run reliability` (a script, not part of `npm test`): starts the product as `npm start` does, on
// free ports with a throwaway database, puts it under light traffic, injects one fault at a time and
// prints what each did: requests, 5xx other than 503, orders left holding stock, e-mails lost or
// doubled, and how long the shop took to answer normally again.
import { execFileSync, spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import pg from 'pg';
import Stripe from 'stripe';
import { devClusterOptions, startCluster } from '../../dev-services/postgres';
import { stripeFakeControl, payOnTestPaymentPage } from '../../dev-services/stripe-fake/control-client';
import { startStripeFake, type StripeFake } from '../../dev-services/stripe-fake/index';
import { succeedingTestCard } from '../../dev-services/stripe-fake/test-cards';
import { orderReference } from '../../shared/domain/order-reference';
import { freePort } from '../setup/free-port';

const webhookSecret = 'whsec_restday_local_development';
const customer = { email: 'homeroaster@example.test', password: 'restday-demo' };
const address = { name: 'Reliability Run', line1: '4 Larkspur Lane', city: 'Wrenfield', region: 'CO', postalCode: '81640', country: 'US' };

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

async function until(what: string, check: () => Promise<boolean>, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check().catch(() => false))) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await sleep(200);
  }
}

const ports = { server: await freePort(), postgres: await freePort(), smtp: await freePort(), mailWeb: await freePort(), fake: await freePort() };
const work = mkdtempSync(path.join(tmpdir(), 'restday-reliability-'));
const env = { ...process.env, PORT: String(ports.server), RESTDAY_PG_PORT: String(ports.postgres), RESTDAY_PG_DATA: path.join(work, 'postgres') };
const base = `http://127.0.0.1:${ports.server}`;
const mailWeb = `http://127.0.0.1:${ports.mailWeb}`;
const fakeStateFile = path.join(work, 'stripe-fake.json');

const startFake = () => startStripeFake({ port: ports.fake, webhookUrl: `${base}/api/payments/webhook`, webhookSecret, stateFile: fakeStateFile });
let fake: StripeFake = await startFake();
const fakeControl = stripeFakeControl(fake.url);
const stripe = new Stripe('sk_test_restday_local', { host: '127.0.0.1', port: ports.fake, protocol: 'http', maxNetworkRetries: 0 });

console.log(`Starting Restday on ${base} (database 127.0.0.1:${ports.postgres} in ${work})…`);
const product = spawn(process.execPath, ['--import', 'tsx', 'dev-services/start.ts'], {
  env: { ...env, SMTP_URL: `smtp://127.0.0.1:${ports.smtp}`, MAILDEV_WEB_PORT: String(ports.mailWeb), STRIPE_API_URL: fake.url, LOG_LEVEL: 'fatal' },
  stdio: ['ignore', 'ignore', 'inherit'],
});
const cluster = () => startCluster(devClusterOptions(env));
const db = new pg.Pool({ connectionString: `postgres://restday@127.0.0.1:${ports.postgres}/restday`, max: 2, connectionTimeoutMillis: 1000 });
db.on('error', () => {});

async function stopEverything() {
  product.kill('SIGINT');
  await new Promise((resolve) => product.once('exit', resolve));
  await fake.stop().catch(() => {});
  await db.end().catch(() => {});
  rmSync(work, { recursive: true, force: true });
}

interface Tally {
  requests: number;
  unexpected5xx: number;
  statuses: Map<number, number>;
  lotTimesMs: number[];
  orderIds: string[];
}

const newTally = (): Tally => ({ requests: 0, unexpected5xx: 0, statuses: new Map(), lotTimesMs: [], orderIds: [] });

async function call(tally: Tally, url: string, init: RequestInit = {}): Promise<Response | undefined> {
  tally.requests += 1;
  try {
    const response = await fetch(url, { ...init, signal: AbortSignal.timeout(15_000) });
    tally.statuses.set(response.status, (tally.statuses.get(response.status) ?? 0) + 1);
    if (response.status >= 500 && response.status !== 503) tally.unexpected5xx += 1;
    return response;
  } catch {
    tally.statuses.set(0, (tally.statuses.get(0) ?? 0) + 1);
    return undefined;
  }
}

async function signIn(tally: Tally): Promise<string | undefined> {
  const response = await call(tally, `${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-Restday-Client': 'web' },
    body: JSON.stringify(customer),
  });
  if (response?.status !== 200) return undefined;
  return response.headers
    .getSetCookie()
    .map((cookie) => cookie.split(';')[0])
    .join('; ');
}

let lotCode = '';

/** One customer's visit: the lot list, a sign-in, a green checkout of one 8 oz bag and its payment. */
async function customerVisit(tally: Tally, pay: boolean): Promise<void> {
  const started = performance.now();
  const lots = await call(tally, `${base}/api/lots`);
  if (lots?.status === 200) tally.lotTimesMs.push(performance.now() - started);
  const cookie = await signIn(tally);
  if (!cookie) return;
  const checkout = await call(tally, `${base}/api/checkout/green`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-Restday-Client': 'web', cookie },
    body: JSON.stringify({ items: [{ lotCode, size: '8oz', quantity: 1 }], shippingAddress: address }),
  });
  if (checkout?.status !== 201) return;
  const { orderId, checkoutUrl } = (await checkout.json()) as { orderId: string; checkoutUrl: string };
  tally.orderIds.push(orderId);
  if (pay) await payOnTestPaymentPage(checkoutUrl, { number: succeedingTestCard }).catch(() => undefined);
}

/** Visits back to back from `visitors` customers until `stop` resolves. */
async function traffic(tally: Tally, visitors: number, stop: Promise<void>): Promise<void> {
  let running = true;
  void stop.then(() => (running = false));
  await Promise.all(
    Array.from({ length: visitors }, async () => {
      while (running) await customerVisit(tally, true);
    }),
  );
}

/** Time from the end of a fault to the first normal answers: health 200 and a sign-in that works. */
async function recoveryMs(): Promise<number> {
  const started = performance.now();
  const probe = newTally();
  await until('the shop to recover', async () => (await fetch(`${base}/api/health`)).status === 200 && (await signIn(probe)) !== undefined, 120_000);
  return performance.now() - started;
}

interface Row {
  scenario: string;
  requests: number;
  unexpected5xx: number;
  ordersHeld: number;
  emailsLost: number;
  emailsDoubled: number;
  recoverySeconds: number;
  note: string;
}

/**
 * After the fault: orders still awaiting payment with no way to pay (no checkout session) hold stock;
 * a paid order with no confirmation in the mail catcher lost its e-mail; more than one doubled it.
 */
async function outcome(tally: Tally): Promise<Pick<Row, 'ordersHeld' | 'emailsLost' | 'emailsDoubled'>> {
  if (tally.orderIds.length === 0) return { ordersHeld: 0, emailsLost: 0, emailsDoubled: 0 };
  const { rows } = await db.query<{ id: string; status: string; stripe_checkout_session_id: string | null }>(
    'select id, status, stripe_checkout_session_id from orders where id = any($1::uuid[])',
    [tally.orderIds],
  );
  const ordersHeld = rows.filter((row) => row.status === 'pending_payment' && !row.stripe_checkout_session_id).length;
  const paid = rows.filter((row) => row.status === 'paid').map((row) => row.id);
  let confirmations = new Map<string, number>();
  // The relay retries with backoff: give it time to drain what the fault held back.
  await until(
    'the paid orders’ confirmations',
    async () => {
      const mail = (await (await fetch(`${mailWeb}/api/email?${new URLSearchParams({ 'to.address': customer.email })}`)).json()) as {
        subject?: string;
        text?: string;
      }[];
      confirmations = new Map(
        paid.map((id) => [id, mail.filter((message) => message.subject?.includes('confirmed') && message.text?.includes(orderReference(id))).length]),
      );
      return [...confirmations.values()].every((n) => n >= 1);
    },
    60_000,
  ).catch(() => undefined);
  return {
    ordersHeld,
    emailsLost: [...confirmations.values()].filter((n) => n === 0).length,
    emailsDoubled: [...confirmations.values()].filter((n) => n > 1).length,
  };
}

function statusSummary(tally: Tally): string {
  return [...tally.statuses.entries()]
    .sort(([a], [b]) => a - b)
    .map(([status, n]) => `${status === 0 ? 'no answer' : status}×${n}`)
    .join(' ');
}

const p99 = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted.length === 0 ? 0 : (sorted[Math.min(sorted.length - 1, Math.ceil(sorted.length * 0.99) - 1)] as number);
};

async function scenario(name: string, fault: { begin(): Promise<void> | void; end(): Promise<void> | void }, visitors = 3): Promise<Row> {
  console.log(`· ${name}`);
  const tally = newTally();
  let stop!: () => void;
  const stopped = new Promise<void>((resolve) => (stop = resolve));
  const load = traffic(tally, visitors, stopped);
  await sleep(3_000);
  await fault.begin();
  await sleep(10_000);
  await fault.end();
  const recovery = await recoveryMs();
  await sleep(3_000);
  stop();
  await load;
  return {
    scenario: name,
    requests: tally.requests,
    ...(await outcome(tally)),
    unexpected5xx: tally.unexpected5xx,
    recoverySeconds: recovery / 1000,
    note: statusSummary(tally),
  };
}

async function webhookBurst(count: number): Promise<Row> {
  const name = `a burst of ${count.toLocaleString('en-US')} checkout expiries`;
  console.log(`· ${name} (placing the orders first)`);
  const setup = newTally();
  const cookie = await signIn(setup);
  const sessions: string[] = [];
  for (let placed = 0; placed < count; placed += 25) {
    await Promise.all(
      Array.from({ length: Math.min(25, count - placed) }, async () => {
        const checkout = await call(setup, `${base}/api/checkout/green`, {
          method: 'POST',
          headers: { 'Content-Type': 'application/json', 'X-Restday-Client': 'web', cookie: cookie ?? '' },
          body: JSON.stringify({ items: [{ lotCode, size: '8oz', quantity: 1 }], shippingAddress: address }),
        });
        if (checkout?.status === 201) {
          const { orderId, checkoutUrl } = (await checkout.json()) as { orderId: string; checkoutUrl: string };
          setup.orderIds.push(orderId);
          sessions.push(new URL(checkoutUrl).pathname.split('/').pop()!);
        }
      }),
    );
  }
  const { rows: before } = await db.query<{ stock_grams: number }>('select stock_grams from lots where code = $1', [lotCode]);
  await fakeControl.pauseWebhooks();
  for (const id of sessions) await stripe.checkout.sessions.expire(id).catch(() => undefined);
  const tally = newTally();
  const started = performance.now();
  await fakeControl.resumeWebhooks();
  // Visitors read the catalog while the events land.
  let done = false;
  const visitors = Promise.all(
    Array.from({ length: 4 }, async () => {
      while (!done) {
        const began = performance.now();
        const response = await call(tally, `${base}/api/lots`);
        if (response?.status === 200) tally.lotTimesMs.push(performance.now() - began);
      }
    }),
  );
  await until(
    'every expiry to be applied',
    async () =>
      (await db.query('select count(*)::int as n from orders where id = any($1::uuid[]) and status = $2', [setup.orderIds, 'cancelled'])).rows[0].n ===
      setup.orderIds.length,
    180_000,
  ).catch(() => undefined);
  const appliedMs = performance.now() - started;
  done = true;
  await visitors;
  const { rows: after } = await db.query<{ stock_grams: number }>('select stock_grams from lots where code = $1', [lotCode]);
  const { rows: held } = await db.query<{ n: number }>("select count(*)::int as n from orders where id = any($1::uuid[]) and status = 'pending_payment'", [
    setup.orderIds,
  ]);
  const visitor503 = tally.statuses.get(503) ?? 0;
  return {
    scenario: name,
    requests: tally.requests,
    unexpected5xx: tally.unexpected5xx,
    ordersHeld: held[0]!.n,
    emailsLost: 0,
    emailsDoubled: 0,
    recoverySeconds: appliedMs / 1000,
    note: `stock back ${(after[0]!.stock_grams - before[0]!.stock_grams).toLocaleString('en-US')} g for ${setup.orderIds.length} × 227 g; visitors' 503s ${visitor503}; GET /api/lots p99 ${p99(tally.lotTimesMs).toFixed(0)} ms`,
  };
}

try {
  await until('Restday to answer', async () => (await fetch(`${base}/api/health`)).status === 200, 240_000);
  // A lot with plenty of stock, so the runs never sell out.
  const { rows } = await db.query<{ code: string }>('select code from lots where is_listed order by stock_grams desc limit 1');
  lotCode = rows[0]!.code;
  await db.query('update lots set stock_grams = stock_grams + 1000000 where code = $1', [lotCode]);
  const maildevPid = () =>
    execFileSync('pgrep', ['-f', '--', `--smtp ${ports.smtp}`])
      .toString()
      .trim()
      .split('\n')[0]!;

  const results: Row[] = [];
  results.push(
    await scenario('PostgreSQL stopped for 10 s', {
      begin: () => cluster().stop(),
      end: () => void cluster(),
    }),
  );
  results.push(
    await scenario('payment service unreachable for 10 s', {
      begin: () => fake.stop(),
      end: async () => {
        fake = await startFake();
      },
    }),
  );
  results.push(
    await scenario('SMTP server hangs for 10 s', {
      begin: () => void process.kill(Number(maildevPid()), 'SIGSTOP'),
      end: () => void process.kill(Number(maildevPid()), 'SIGCONT'),
    }),
  );
  results.push(await webhookBurst(Number(process.env.BURST ?? 1000)));

  console.log('');
  console.table(
    results.map((row) => ({
      scenario: row.scenario,
      requests: row.requests,
      '5xx other than 503': row.unexpected5xx,
      'orders held': row.ordersHeld,
      'e-mails lost': row.emailsLost,
      'e-mails doubled': row.emailsDoubled,
      'recovery (s)': Number(row.recoverySeconds.toFixed(1)),
    })),
  );
  for (const row of results) console.log(`${row.scenario}: ${row.note}`);
} finally {
  await stopEverything();
}
