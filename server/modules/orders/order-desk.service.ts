import { randomUUID } from 'node:crypto';
import type { OrderStatus } from '@shared/domain/vocabulary';
import type { PostalAddressInput } from '@shared/schemas/address';
import type { ResendableTemplate } from '@shared/schemas/orders';
import type { EmailPayloads } from '../../../emails/index';
import type { Tx } from '../../db/client';
import type { Clock } from '../../lib/clock';
import { AppError } from '../../lib/app-error';
import type { SessionUser } from '../../middleware/require-role';
import type { AuditAction, AuditTrail } from '../audit';
import { cancelUnpaidOrder } from '../checkout';
import { queueEmail } from '../outbox';
import type { OrderDeskRepo } from './order-desk.repo';

/** Where the request came from, for the audit trail. */
export interface RequestContext {
  ip?: string | null;
}

/** An order that has left (or will never leave) the roastery keeps the address it had. */
const beforeShipping: readonly OrderStatus[] = ['pending_payment', 'paid', 'held', 'roasted', 'packed'];

/** Staff acting on one order: cancel it unpaid, send an e-mail again, correct its address, keep a note. Each is audited. */
export function createOrderDeskService({ repo, clock, audit }: { repo: OrderDeskRepo; clock: Clock; audit: AuditTrail }) {
  async function act<T>(orderId: string, work: (tx: Tx, order: NonNullable<Awaited<ReturnType<OrderDeskRepo['lockOrder']>>>) => Promise<T>): Promise<T> {
    return repo.transaction(async (tx) => {
      const order = await repo.lockOrder(tx, orderId);
      if (!order) throw AppError.notFound('Order');
      return work(tx, order);
    });
  }

  const record = (action: AuditAction, user: SessionUser, context: RequestContext, detail: Record<string, string | null>) =>
    audit.record({ action, actorId: user.id, ip: context.ip ?? null, detail });

  return {
    /** Cancels an order still awaiting payment and puts its stock back; a paid order is refunded instead. */
    async cancel(user: SessionUser, orderId: string, context: RequestContext): Promise<void> {
      await act(orderId, async (tx, order) => {
        if (order.status !== 'pending_payment' || !(await cancelUnpaidOrder(tx, orderId, clock.now(), 'cancelled by staff'))) {
          throw AppError.conflict('order_not_cancellable', 'Only an order awaiting payment can be cancelled; a paid order is refunded by the owner.');
        }
      });
      await record('order.cancelled', user, context, { orderId });
    },

    /** Queues the order's e-mail again, as first written, to the customer's current address. */
    async resend(user: SessionUser, orderId: string, template: ResendableTemplate, context: RequestContext): Promise<void> {
      await act(orderId, async (tx, order) => {
        const sent = await repo.lastEmail(tx, template, orderId);
        if (!sent) throw AppError.conflict('email_not_sent', 'This order has had no such e-mail yet, so there is nothing to send again.');
        // The stored payload is this template's own; queueEmail checks it against the template again.
        await queueEmail(tx, {
          template,
          to: order.customerEmail,
          payload: sent.payload as EmailPayloads[ResendableTemplate],
          dedupeKey: `${template}:${orderId}:resend:${randomUUID()}`,
        });
      });
      await record('order.email_resent', user, context, { orderId, template });
    },

    /** Where the order ships, corrected before it ships. */
    async correctAddress(user: SessionUser, orderId: string, address: PostalAddressInput, context: RequestContext): Promise<void> {
      await act(orderId, async (tx, order) => {
        if (!beforeShipping.includes(order.status)) {
          throw AppError.conflict('order_shipped', 'This order has shipped or ended; its address can no longer change.');
        }
        await repo.setAddress(tx, orderId, address);
      });
      await record('order.address_corrected', user, context, { orderId });
    },

    async saveNote(user: SessionUser, orderId: string, note: string | null, context: RequestContext): Promise<void> {
      await act(orderId, (tx) => repo.setNote(tx, orderId, note));
      await record('order.note_saved', user, context, { orderId });
    },
  };
}

export type OrderDeskService = ReturnType<typeof createOrderDeskService>;
