import { spawn, type ChildProcess } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import http from 'node:http';
import { count, eq, inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { payOnTestPaymentPage } from '../../dev-services/stripe-fake/control-client';
import { succeedingTestCard } from '../../dev-services/stripe-fake/test-cards';
import { emailOutbox, lots, orders, paymentEvents } from '../../server/db/schema/index';
import { inboxOf, waitFor } from '../api/outbox-support';
import { stripeFake } from '../api/payments-support';
import { getTestDb } from '../setup/test-db';
import { freePort } from '../setup/free-port';
import { createLotForSale } from '../factories/index';

/**
 * Restday scaled out as the README says: stateless servers behind a load balancer, queue work in a
 * separate worker, one PostgreSQL. Two real server processes and one `npm run worker` process run
 * behind a small round-robin balancer; one server is killed mid-traffic and started again.
 */

const fake = stripeFake();
const children = new Set<ChildProcess>();

const processEnv = (port: number) => ({
  ...process.env,
  NODE_ENV: 'test',
  LOG_LEVEL: 'warn',
  PORT: String(port),
  DATABASE_URL: inject('databaseUrl'),
  SMTP_URL: inject('smtpUrl'),
  STRIPE_API_URL: inject('stripeFakeUrl'),
  STRIPE_WEBHOOK_SECRET: inject('stripeWebhookSecret'),
  WORKERS_IN_SERVER: 'false',
  AUTH_THROTTLE_PER_IP: '100000',
  STATIC_DIR: 'dist',
});

function startProcess(entry: 'server/index.ts' | 'server/worker.ts', port: number): ChildProcess {
  const child = spawn(process.execPath, ['--import', 'tsx', entry], { env: processEnv(port), stdio: ['ignore', 'ignore', 'inherit'] });
  children.add(child);
  child.once('exit', () => children.delete(child));
  return child;
}

async function startServerProcess(port: number): Promise<ChildProcess> {
  const child = startProcess('server/index.ts', port);
  await waitFor(
    () =>
      fetch(`http://127.0.0.1:${port}/api/health`).then(
        (response) => response.status,
        () => 0,
      ),
    (status) => status === 200,
    30_000,
    `the server on ${port} to answer`,
  );
  return child;
}

/** Round-robin over the servers; a server that refuses the connection is skipped, as a balancer's health check would. */
function startBalancer(ports: readonly number[]): Promise<{ url: string; close(): Promise<void> }> {
  let next = 0;
  const server = http.createServer((req, res) => {
    const body: Buffer[] = [];
    req.on('data', (chunk: Buffer) => body.push(chunk));
    req.on('end', () => {
      const attempt = (triesLeft: number) => {
        const port = ports[next++ % ports.length]!;
        const upstream = http.request({ host: '127.0.0.1', port, method: req.method, path: req.url, headers: req.headers }, (answer) => {
          res.writeHead(answer.statusCode ?? 502, answer.headers);
          answer.pipe(res);
        });
        upstream.on('error', () => (triesLeft > 0 ? attempt(triesLeft - 1) : res.writeHead(502).end()));
        upstream.end(Buffer.concat(body));
      };
      attempt(ports.length);
    });
  });
  return new Promise((resolve) =>
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      resolve({ url: `http://127.0.0.1:${port}`, close: () => new Promise((done) => server.close(() => done())) });
    }),
  );
}

let ports: number[];
let serverA: ChildProcess;
let balancer: Awaited<ReturnType<typeof startBalancer>>;

beforeAll(async () => {
  ports = [await freePort(), await freePort()];
  const workerPort = await freePort();
  [serverA] = await Promise.all([startServerProcess(ports[0]!), startServerProcess(ports[1]!)]);
  startProcess('server/worker.ts', workerPort);
  balancer = await startBalancer(ports);
  await fake.setWebhookEndpoint(`${balancer.url}/api/payments/webhook`);
}, 90_000);

afterAll(async () => {
  await fake.setWebhookEndpoint(null);
  await balancer?.close();
  await Promise.all(
    [...children].map(
      (child) =>
        new Promise<void>((resolve) => {
          child.once('exit', () => resolve());
          child.kill('SIGTERM');
        }),
    ),
  );
});

/** A customer signed up through the balancer (so on either server), with a cookie jar of one cookie. */
async function customerSession(index: number) {
  const email = `scaled-${index}-${randomUUID().slice(0, 8)}@example.test`;
  const response = await fetch(`${balancer.url}/api/auth/sign-up`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-Restday-Client': 'web' },
    body: JSON.stringify({ email, password: 'an invented long passphrase', name: `Scaled Customer ${index}` }),
  });
  expect(response.status).toBe(201);
  const cookie = response.headers
    .getSetCookie()
    .map((value) => value.split(';')[0])
    .join('; ');
  return { email, cookie };
}

async function checkout(session: { cookie: string }, lotCode: string) {
  const response = await fetch(`${balancer.url}/api/checkout/green`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-Restday-Client': 'web', cookie: session.cookie },
    body: JSON.stringify({
      items: [{ lotCode, size: '1lb', quantity: 1 }],
      shippingAddress: { name: 'Scaled Customer', line1: '4 Larkspur Lane', city: 'Wrenfield', region: 'CO', postalCode: '81640', country: 'US' },
    }),
  });
  expect(response.status, await response.clone().text()).toBe(201);
  return (await response.json()) as { orderId: string; checkoutUrl: string };
}

describe('two stateless servers and a worker on one PostgreSQL', () => {
  // Restarting a server process and 12 sign-ups, checkouts and payments outlast the API project's
  // 20 s default on a busy machine; its own waits allow up to 30 s for payment alone.
  it('loses and doubles nothing when one server is killed mid-traffic and started again', { timeout: 120_000 }, async () => {
    const lot = await createLotForSale(50_000);
    const [before] = await getTestDb().select({ stockGrams: lots.stockGrams }).from(lots).where(eq(lots.id, lot.id));
    const placed: { email: string; orderId: string }[] = [];

    for (let index = 0; index < 12; index += 1) {
      // A third of the way in, server A dies without warning (no graceful shutdown); two thirds in, it is back.
      if (index === 4) serverA.kill('SIGKILL');
      if (index === 8) serverA = await startServerProcess(ports[0]!);
      const session = await customerSession(index);
      // Sign in again on whichever server the balancer picks: the session is in PostgreSQL, not in a process.
      const me = await fetch(`${balancer.url}/api/auth/me`, { headers: { cookie: session.cookie } });
      expect(((await me.json()) as { user: { email: string } | null }).user?.email).toBe(session.email);
      const { orderId, checkoutUrl } = await checkout(session, lot.code);
      expect((await payOnTestPaymentPage(checkoutUrl, { number: succeedingTestCard })).status).toBe(303);
      placed.push({ email: session.email, orderId });
    }

    const orderIds = placed.map((order) => order.orderId);
    await waitFor(
      () => getTestDb().select({ status: orders.status }).from(orders).where(inArray(orders.id, orderIds)),
      (rows) => rows.length === orderIds.length && rows.every((row) => row.status === 'paid'),
      30_000,
      'every order to be paid',
    );
    // Stock went down by exactly one 1 lb bag (454 g fill: 1 lb rounded up to a whole gram) per order.
    const [after] = await getTestDb().select({ stockGrams: lots.stockGrams }).from(lots).where(eq(lots.id, lot.id));
    expect(before!.stockGrams - after!.stockGrams).toBe(12 * 454);
    // One confirmation e-mail per order: queued once, sent once by the worker.
    const keys = orderIds.map((id) => `order-confirmed:${id}`);
    const [queued] = await getTestDb().select({ n: count() }).from(emailOutbox).where(inArray(emailOutbox.dedupeKey, keys));
    expect(queued!.n).toBe(12);
    for (const { email } of placed) {
      const mail = await waitFor(
        () => inboxOf(inject('mailCatcherUrl'), email),
        (found) => found.length >= 1,
        20_000,
        `the confirmation to ${email}`,
      );
      expect(mail.filter((message) => /order/i.test(message.subject))).toHaveLength(1);
    }
    // Every payment event recorded once.
    const sessions = new Set(
      (await getTestDb().select({ id: orders.stripeCheckoutSessionId }).from(orders).where(inArray(orders.id, orderIds))).map((row) => row.id),
    );
    const completed = (await fake.deliveries('checkout.session.completed')).filter((event) => sessions.has(event.objectId));
    expect(completed.every((event) => event.status === 'delivered')).toBe(true);
    const eventIds = completed.map((event) => event.eventId);
    expect(new Set(eventIds).size).toBe(12);
    const [ledger] = await getTestDb().select({ n: count() }).from(paymentEvents).where(inArray(paymentEvents.id, eventIds));
    expect(ledger!.n).toBe(12);
  });
});
