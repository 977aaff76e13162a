import { describe, expect, it } from 'vitest';
import { orderListResponseSchema } from '@shared/schemas/orders';
import type { OrderStatus } from '@shared/domain/vocabulary';
import { createTestApp } from '../setup/test-app';
import { signedInAgent } from '../setup/test-users';
import { createLotForSale, createOrder, createTestUser } from '../factories/index';

const app = createTestApp();

/** An order written directly, as checkout or a subscription would leave it; each test places its orders on its own day. */
async function inventOrder(userId: string, lotId: string, { status, roastDate, placedAt }: { status: OrderStatus; roastDate: string | null; placedAt: Date }) {
  const order = await createOrder({
    userId,
    status,
    shippingCents: 1000,
    roastDate,
    createdAt: placedAt,
    lines: [{ lotId, size: '1lb', quantity: 2, unitPriceCents: 2000 }],
  });
  return order.id;
}

describe('GET /api/orders sorted for the staff table', () => {
  it('sorts by roast date either way with undated orders last, and by status along an order’s life', async () => {
    const lot = await createLotForSale(1000);
    const customer = await createTestUser('customer');
    const day = '2019-06-04';
    const at = (hour: number) => new Date(`${day}T${String(hour).padStart(2, '0')}:00:00Z`);
    const shipped = await inventOrder(customer.id, lot.id, { status: 'shipped', roastDate: '2019-06-10', placedAt: at(10) });
    const undated = await inventOrder(customer.id, lot.id, { status: 'pending_payment', roastDate: null, placedAt: at(11) });
    const paid = await inventOrder(customer.id, lot.id, { status: 'paid', roastDate: '2019-06-12', placedAt: at(12) });
    const refunded = await inventOrder(customer.id, lot.id, { status: 'refunded', roastDate: '2019-06-07', placedAt: at(13) });
    const staff = await signedInAgent(app, await createTestUser('staff'));

    const ids = async (sort: string) =>
      orderListResponseSchema.parse((await staff.get('/api/orders').query({ from: day, to: day, sort }).expect(200)).body).items.map((item) => item.id);

    expect(await ids('roast-date-soonest')).toEqual([refunded, shipped, paid, undated]);
    expect(await ids('roast-date-latest')).toEqual([paid, shipped, refunded, undated]);
    expect(await ids('status')).toEqual([undated, paid, shipped, refunded]);
  });
});
