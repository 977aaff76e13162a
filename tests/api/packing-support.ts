// Readers for the Pack List, shipping, refund, trace and rest-day tests.
import { asc, eq } from 'drizzle-orm';
import { bagAllocations, batches, orders } from '../../server/db/schema/index';
import { getTestDb } from '../setup/test-db';

export async function allocationsOf(orderId: string) {
  return getTestDb()
    .select({ batchId: bagAllocations.batchId, orderItemId: bagAllocations.orderItemId, bags: bagAllocations.bags, grams: bagAllocations.grams })
    .from(bagAllocations)
    .innerJoin(batches, eq(batches.id, bagAllocations.batchId))
    .where(eq(bagAllocations.orderId, orderId))
    .orderBy(asc(batches.createdAt), asc(batches.id));
}

export async function orderStatusOf(orderId: string) {
  const [row] = await getTestDb().select().from(orders).where(eq(orders.id, orderId));
  return row!;
}
