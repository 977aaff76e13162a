import { and, eq, sql } from 'drizzle-orm';
import type { DeliveryChoice } from '@shared/domain/delivery-plan';
import type { RoastDates } from '@shared/domain/roast-schedule';
import type { DbOrTx } from '../../db/client';
import type { AddressSnapshot } from '../../db/schema/common';
import { orderItems, orders } from '../../db/schema/index';
import { dayColumns } from './subscription-records.repo';

/** A paid delivery whose cutoff is ahead takes the new level, grind, brew method and address (its price does not change). */
export async function reshapePaidOrder(
  db: DbOrTx,
  orderId: string,
  change: { choice: DeliveryChoice; dates: Pick<RoastDates, 'roastDate' | 'shipDate' | 'readyFrom' | 'bestBefore'>; shippingAddress: AddressSnapshot },
) {
  await db
    .update(orderItems)
    .set({ roastLevel: change.choice.roastLevel, grind: change.choice.grind, brewMethod: change.choice.brewMethod })
    .where(eq(orderItems.orderId, orderId));
  await db
    .update(orders)
    .set({ ...dayColumns(change.dates), shippingAddress: change.shippingAddress })
    .where(and(eq(orders.id, orderId), sql`${orders.status} in ('paid', 'held')`));
}

/** Moves a paid order to another delivery (a skipped one's payment covers the next). */
export async function moveOrderToDelivery(
  db: DbOrTx,
  orderId: string,
  deliveryId: string,
  dates: Pick<RoastDates, 'roastDate' | 'shipDate' | 'readyFrom' | 'bestBefore'>,
) {
  await db
    .update(orders)
    .set({ deliveryId, ...dayColumns(dates) })
    .where(eq(orders.id, orderId));
}

export async function findOrderIdByInvoice(db: DbOrTx, stripeInvoiceId: string) {
  const [row] = await db.select({ id: orders.id }).from(orders).where(eq(orders.stripeInvoiceId, stripeInvoiceId));
  return row?.id;
}

export interface NewDeliveryOrder {
  userId: string;
  subscriptionId: string;
  stripeInvoiceId: string;
  stripePaymentIntentId: string | null;
  currency: string;
  subtotalCents: number;
  discountCents: number;
  shippingCents: number;
  totalCents: number;
  shippingAddress: AddressSnapshot;
  dates: Pick<RoastDates, 'roastDate' | 'shipDate' | 'readyFrom' | 'bestBefore'>;
  paidAt: Date;
  item: Omit<typeof orderItems.$inferInsert, 'orderId' | 'kind' | 'id'>;
}

/** A paid delivery's order (kind roasted) and its one line; undefined when the invoice already has its order. */
export async function createDeliveryOrder(db: DbOrTx, order: NewDeliveryOrder): Promise<string | undefined> {
  const [row] = await db
    .insert(orders)
    .values({
      userId: order.userId,
      kind: 'roasted',
      status: 'paid',
      subscriptionId: order.subscriptionId,
      subtotalCents: order.subtotalCents,
      discountCents: order.discountCents,
      shippingCents: order.shippingCents,
      totalCents: order.totalCents,
      currency: order.currency,
      shippingAddress: order.shippingAddress,
      ...dayColumns(order.dates),
      stripeInvoiceId: order.stripeInvoiceId,
      stripePaymentIntentId: order.stripePaymentIntentId,
      paidAt: order.paidAt,
    })
    .onConflictDoNothing({ target: orders.stripeInvoiceId })
    .returning({ id: orders.id });
  if (!row) return undefined;
  await db.insert(orderItems).values({ ...order.item, orderId: row.id, kind: 'roasted' });
  return row.id;
}

export async function linkOrderToDelivery(db: DbOrTx, orderId: string, deliveryId: string) {
  await db.update(orders).set({ deliveryId }).where(eq(orders.id, orderId));
}
