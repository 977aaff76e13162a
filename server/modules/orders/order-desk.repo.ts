import { and, desc, eq, like, or } from 'drizzle-orm';
import type { PostalAddressInput } from '@shared/schemas/address';
import type { Db, Tx } from '../../db/client';
import { emailOutbox, orders, users } from '../../db/schema/index';

/** What staff actions on one order read and write. */
export function createOrderDeskRepo(db: Db) {
  return {
    transaction: <T>(work: (tx: Tx) => Promise<T>) => db.transaction(work),

    /** The order, locked for the caller's transaction, with its customer's current e-mail. */
    async lockOrder(tx: Tx, orderId: string) {
      const [row] = await tx
        .select({ id: orders.id, status: orders.status, kind: orders.kind, customerEmail: users.email })
        .from(orders)
        .innerJoin(users, eq(users.id, orders.userId))
        .where(eq(orders.id, orderId))
        .for('update', { of: orders });
      return row;
    },

    async setAddress(tx: Tx, orderId: string, address: PostalAddressInput) {
      await tx.update(orders).set({ shippingAddress: address }).where(eq(orders.id, orderId));
    },

    async setNote(tx: Tx, orderId: string, note: string | null) {
      await tx.update(orders).set({ staffNote: note }).where(eq(orders.id, orderId));
    },

    /** The last e-mail of this template about the order that was queued (the first, or a resend), with its payload. */
    async lastEmail(tx: Tx, template: string, orderId: string) {
      const key = `${template}:${orderId}`;
      const [row] = await tx
        .select({ payload: emailOutbox.payload })
        .from(emailOutbox)
        .where(and(eq(emailOutbox.template, template), or(eq(emailOutbox.dedupeKey, key), like(emailOutbox.dedupeKey, `${key}:resend:%`))))
        .orderBy(desc(emailOutbox.createdAt))
        .limit(1);
      return row;
    },
  };
}

export type OrderDeskRepo = ReturnType<typeof createOrderDeskRepo>;
