import { beforeAll, describe, expect, it } from 'vitest';
import { batchTraceSchema, orderTraceSchema } from '@shared/schemas/packing';
import { createTestApp } from '../setup/test-app';
import { signedInAgent } from '../setup/test-users';
import { createGreenOrder, createLotForSale, createRoastedOrder, createTestUser, recordBatch, type TestUser, uniqueDay } from '../factories/index';

const app = createTestApp();
let staff: Awaited<ReturnType<typeof signedInAgent>>;
let ana: TestUser;
let ben: TestUser;

beforeAll(async () => {
  staff = await signedInAgent(app, await createTestUser('staff'));
  ana = await createTestUser('customer', { name: 'Ana Tracetest' });
  ben = await createTestUser('customer', { name: 'Ben Tracetest' });
});

async function orderTrace(orderId: string) {
  const response = await staff.get(`/api/orders/${orderId}/trace`);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return orderTraceSchema.parse(response.body);
}

async function batchTrace(batchId: string) {
  const response = await staff.get(`/api/roastery/batches/${batchId}/trace`);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return batchTraceSchema.parse(response.body);
}

describe('trace: lot → batch → bag → order', () => {
  it('traces an order to each batch and lot its bags came from, and a batch to every order it went into', async () => {
    const lot = await createLotForSale(20_000);
    const roastDate = uniqueDay();
    // 700 g holds two 341 g bags; Ana's third bag and Ben's bag come from the second batch.
    const first = await recordBatch({ lotId: lot.id, roastDate, roastLevel: 'medium', roastedGramsOut: 700 });
    const second = await recordBatch({ lotId: lot.id, roastDate, roastLevel: 'medium', roastedGramsOut: 3000 });
    const anaOrder = await createRoastedOrder(ana.id, { roastDate, lines: [{ lotId: lot.id, size: '12oz', quantity: 3, roastLevel: 'medium' }] });
    const benOrder = await createRoastedOrder(ben.id, { roastDate, lines: [{ lotId: lot.id, size: '12oz', quantity: 1, roastLevel: 'medium' }] });

    const beforePacking = await orderTrace(anaOrder.id);
    expect(beforePacking.bags).toEqual([
      { batchId: null, lotCode: lot.code, lotName: lot.name, roastLevel: 'medium', roastDate: null, size: '12oz', bags: 3, grams: 1023 },
    ]);

    for (const order of [anaOrder, benOrder]) expect((await staff.post(`/api/orders/${order.id}/pack`)).status).toBe(200);

    const anaTrace = await orderTrace(anaOrder.id);
    expect(anaTrace.order).toMatchObject({ id: anaOrder.id, kind: 'roasted', customerName: 'Ana Tracetest', customerEmail: ana.email, roastDate });
    expect(anaTrace.bags).toEqual([
      { batchId: first.id, lotCode: lot.code, lotName: lot.name, roastLevel: 'medium', roastDate, size: '12oz', bags: 2, grams: 682 },
      { batchId: second.id, lotCode: lot.code, lotName: lot.name, roastLevel: 'medium', roastDate, size: '12oz', bags: 1, grams: 341 },
    ]);

    const secondTrace = await batchTrace(second.id);
    expect(secondTrace.batch).toMatchObject({ id: second.id, lotCode: lot.code, roastLevel: 'medium', roastDate, roastedGramsOut: 3000, allocatedGrams: 682 });
    expect(secondTrace.orders).toEqual([
      expect.objectContaining({ orderId: anaOrder.id, customerName: 'Ana Tracetest', customerEmail: ana.email, bags: 1, grams: 341 }),
      expect.objectContaining({ orderId: benOrder.id, customerName: 'Ben Tracetest', customerEmail: ben.email, bags: 1, grams: 341 }),
    ]);
    const firstTrace = await batchTrace(first.id);
    expect(firstTrace.orders).toEqual([expect.objectContaining({ orderId: anaOrder.id, bags: 2, grams: 682 })]);
    expect(firstTrace.batch.allocatedGrams).toBe(682);
  });

  it('traces a green order to its lot, with no batch', async () => {
    const lot = await createLotForSale(20_000);
    const order = await createGreenOrder(ana.id, lot.id, { shipDate: uniqueDay(), status: 'paid' });

    const trace = await orderTrace(order.id);

    expect(trace.order.kind).toBe('green');
    expect(trace.bags).toEqual([
      { batchId: null, lotCode: lot.code, lotName: lot.name, roastLevel: null, roastDate: null, size: '1lb', bags: 1, grams: 454 },
      { batchId: null, lotCode: lot.code, lotName: lot.name, roastLevel: null, roastDate: null, size: '8oz', bags: 2, grams: 454 },
    ]);
  });

  it('answers 404 for an order or a batch that does not exist', async () => {
    const missing = '5f0c2f1e-0000-4000-8000-000000000000';
    expect((await staff.get(`/api/orders/${missing}/trace`)).status).toBe(404);
    expect((await staff.get(`/api/roastery/batches/${missing}/trace`)).status).toBe(404);
  });
});
