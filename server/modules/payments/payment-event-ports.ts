import type { Tx } from '../../db/client';
import type { Logger } from '../../lib/logger';

/** An invoice Stripe says is paid, as the subscriptions module records it. */
export interface PaidInvoice {
  id: string;
  amountPaidCents: number;
  currency: string;
  paymentIntentId: string | null;
}

/**
 * What applying an event does to other modules' records, inside the ledger's transaction. The
 * composition root passes the checkout and subscriptions modules' own functions, so those modules
 * depend on payments and never the other way round.
 */
export interface PaymentEventPorts {
  /** An expired checkout: cancels the unpaid order and gives its held stock back. */
  cancelUnpaidOrder(tx: Tx, orderId: string, at: Date, note: string): Promise<boolean>;
  /** A paid renewal becomes the delivery's order; returns the order id (undefined when it already has one). */
  recordPaidCycle(tx: Tx, subscriptionId: string, invoice: PaidInvoice, paidAt: Date, logger: Logger): Promise<string | undefined>;
  /** A failed renewal holds the next delivery. */
  holdUnpaidCycle(tx: Tx, subscriptionId: string, now: Date): Promise<boolean>;
}
