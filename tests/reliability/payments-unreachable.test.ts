// Checkout when the payment service is down or hangs: a 503 `payments_unavailable` with Retry-After
// well within the request's own deadline, the order cancelled and its stock back. Both outages are
// real sockets: a closed port, and a server that accepts connections and never answers.
import { createServer, type Server, type Socket } from 'node:net';
import { desc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { orders } from '../../server/db/schema/index';
import { movementsOf, stockOf } from '../api/checkout-support';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { createLotForSale, createTestUser, shipTo } from '../factories/index';

const oneLbFillGrams = 454; // 1 lb = 453.59237 g, filled to the next whole gram so a bag never weighs short
// Two tries of 2 s and the SDK's backoff (~0.5 s), with room for a busy machine; 3 × 10 s before.
const deadlineMs = 8_000;

let silent: Server;
const held = new Set<Socket>();
let silentUrl: string;

beforeAll(async () => {
  silent = createServer((socket) => {
    held.add(socket);
    socket.on('close', () => held.delete(socket));
  });
  await new Promise<void>((resolve) => silent.listen(0, '127.0.0.1', resolve));
  const address = silent.address();
  silentUrl = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`;
});

afterAll(async () => {
  for (const socket of held) socket.destroy();
  await new Promise((resolve) => silent.close(resolve));
});

async function checkoutWithStripeAt(stripeApiUrl: string) {
  const lot = await createLotForSale(10 * oneLbFillGrams);
  const buyer = await createTestUser('customer');
  const agent = await signedInAgent(createTestApp({ env: { STRIPE_API_URL: stripeApiUrl } }), buyer);
  const started = performance.now();
  const response = await agent.post('/api/checkout/green').send({ items: [{ lotCode: lot.code, size: '1lb', quantity: 3 }], shippingAddress: shipTo });
  const elapsedMs = performance.now() - started;
  const [order] = await getTestDb().select().from(orders).where(eq(orders.userId, buyer.id)).orderBy(desc(orders.createdAt));
  return { lot, response, elapsedMs, order: order! };
}

describe('checkout while the payment service is out', () => {
  for (const [outage, url] of [
    ['refuses connections (a closed port)', () => 'http://127.0.0.1:9'],
    ['accepts connections and never answers', () => silentUrl],
  ] as const) {
    it(
      `answers 503 payments_unavailable within ${deadlineMs / 1000} s when it ${outage}, the order cancelled and its stock back`,
      { timeout: 30_000 },
      async () => {
        const { lot, response, elapsedMs, order } = await checkoutWithStripeAt(url());
        expect(response.status).toBe(503);
        expect(apiErrorSchema.parse(response.body).error.code).toBe('payments_unavailable');
        expect(response.headers['retry-after']).toBeDefined();
        expect(elapsedMs).toBeLessThan(deadlineMs);
        expect(order).toMatchObject({ status: 'cancelled', stripeCheckoutSessionId: null });
        // 3 × 454 g reserved and put back: the lot holds its 4,540 g again, in two movements.
        expect(await stockOf(lot.id)).toBe(10 * oneLbFillGrams);
        expect(await movementsOf(lot.id, order.id)).toEqual({ sum: 0, count: 2 });
      },
    );
  }
});
