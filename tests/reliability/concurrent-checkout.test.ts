import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { greenCheckoutResponseSchema } from '@shared/schemas/checkout';
import { apiErrorSchema } from '@shared/schemas/errors';
import { lots, stockMovements } from '../../server/db/schema/index';
import { movementsOf, stockOf } from '../api/checkout-support';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { createLotForSale, createTestUser, shipTo } from '../factories/index';

const app = createTestApp();
const buyers = 40;
const bagsInStock = 10;
const oneLbFillGrams = 454; // 1 lb = 453.59237 g, filled to the next whole gram so a bag never weighs short

describe('concurrent checkouts for scarce stock', () => {
  it(
    `${buyers} buyers at once for ${bagsInStock} bags: exactly ${bagsInStock} get 201, the rest 409, stock ends at 0 and never below`,
    { timeout: 60_000 },
    async () => {
      const lot = await createLotForSale(bagsInStock * oneLbFillGrams);
      const agents = await Promise.all(Array.from({ length: buyers }, async () => signedInAgent(app, await createTestUser('customer'))));

      // Watch the lot while the checkouts race: a negative reading would be an oversell.
      let lowest = Number.POSITIVE_INFINITY;
      let racing = true;
      const watcher = (async () => {
        while (racing) {
          lowest = Math.min(lowest, await stockOf(lot.id));
          await new Promise((resolve) => setTimeout(resolve, 5));
        }
      })();

      const responses = await Promise.all(
        agents.map((agent) => agent.post('/api/checkout/green').send({ items: [{ lotCode: lot.code, size: '1lb', quantity: 1 }], shippingAddress: shipTo })),
      );
      racing = false;
      await watcher;

      const created = responses.filter((response) => response.status === 201);
      const refused = responses.filter((response) => response.status === 409);
      expect(created).toHaveLength(bagsInStock);
      expect(refused).toHaveLength(buyers - bagsInStock);
      for (const response of created) greenCheckoutResponseSchema.parse(response.body);
      for (const response of refused) {
        const { error } = apiErrorSchema.parse(response.body);
        expect(error.code).toBe('insufficient_stock');
        expect(error.message).toBe(
          `There is not enough of lot ${lot.code} left for this order. Nothing was reserved or charged; lower the quantity or choose another lot.`,
        );
      }

      expect(await stockOf(lot.id)).toBe(0);
      expect(lowest).toBeGreaterThanOrEqual(0);
      // The movements account for every gram that left: one 'sale' per successful checkout.
      expect(await movementsOf(lot.id)).toEqual({ sum: -bagsInStock * oneLbFillGrams, count: bagsInStock });
      const orderIds = new Set(created.map((response) => greenCheckoutResponseSchema.parse(response.body).orderId));
      const movements = await getTestDb()
        .select({ orderId: stockMovements.orderId, reason: stockMovements.reason })
        .from(stockMovements)
        .where(eq(stockMovements.lotId, lot.id));
      expect(new Set(movements.map((movement) => movement.orderId))).toEqual(orderIds);
      expect(movements.every((movement) => movement.reason === 'sale')).toBe(true);
    },
  );

  it('the CHECK constraint refuses stock below zero even when the code is bypassed', async () => {
    const lot = await createLotForSale(100);
    await expect(getTestDb().update(lots).set({ stockGrams: -1 }).where(eq(lots.id, lot.id))).rejects.toMatchObject({
      cause: expect.objectContaining({ constraint: 'lots_stock_grams_non_negative' }),
    });
    expect(await stockOf(lot.id)).toBe(100);
  });
});
