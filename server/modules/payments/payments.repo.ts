import { and, asc, desc, eq, isNull, lt, sql } from 'drizzle-orm';
import type { Db, DbOrTx, Tx } from '../../db/client';
import { deliveries, lots, orderItems, orders, paymentEvents, shopSettings, subscriptions, users } from '../../db/schema/index';
import { roastersRotationName, type OrderStatus, type SubscriptionStatus } from '@shared/domain/vocabulary';

export interface ReceivedEvent {
  id: string;
  type: string;
  payload: Record<string, unknown>;
}

function queries(db: DbOrTx) {
  const orderWithCustomer = () =>
    db
      .select({
        id: orders.id,
        kind: orders.kind,
        status: orders.status,
        subtotalCents: orders.subtotalCents,
        shippingCents: orders.shippingCents,
        totalCents: orders.totalCents,
        refundedCents: orders.refundedCents,
        currency: orders.currency,
        shippingAddress: orders.shippingAddress,
        roastDate: orders.roastDate,
        shipDate: orders.shipDate,
        stripeCheckoutSessionId: orders.stripeCheckoutSessionId,
        stripePaymentIntentId: orders.stripePaymentIntentId,
        createdAt: orders.createdAt,
        customerEmail: users.email,
        customerName: users.name,
      })
      .from(orders)
      .innerJoin(users, eq(users.id, orders.userId));

  const subscriptionWithCustomer = () =>
    db
      .select({
        id: subscriptions.id,
        status: subscriptions.status,
        roastLevel: subscriptions.roastLevel,
        bagSize: subscriptions.bagSize,
        bagsPerDelivery: subscriptions.bagsPerDelivery,
        grind: subscriptions.grind,
        brewMethod: subscriptions.brewMethod,
        cadenceWeeks: subscriptions.cadenceWeeks,
        pausedUntil: subscriptions.pausedUntil,
        priceCents: subscriptions.priceCents,
        currency: subscriptions.currency,
        stripeSubscriptionId: subscriptions.stripeSubscriptionId,
        stripeCustomerId: subscriptions.stripeCustomerId,
        stripeCheckoutSessionId: subscriptions.stripeCheckoutSessionId,
        coffee: sql<string>`coalesce(${lots.name}, ${roastersRotationName})`,
        customerEmail: users.email,
        customerName: users.name,
      })
      .from(subscriptions)
      .innerJoin(users, eq(users.id, subscriptions.userId))
      .leftJoin(lots, eq(lots.id, subscriptions.lotId));

  return {
    async findOrder(orderId: string) {
      const [order] = await orderWithCustomer().where(eq(orders.id, orderId));
      return order;
    },

    /** The order, locked until the transaction ends, so two events for it apply one after the other. */
    async lockOrder(orderId: string) {
      const [order] = await orderWithCustomer().where(eq(orders.id, orderId)).for('update', { of: orders });
      return order;
    },

    async findOrderIdByPaymentIntent(paymentIntentId: string) {
      const [order] = await db.select({ id: orders.id }).from(orders).where(eq(orders.stripePaymentIntentId, paymentIntentId));
      return order?.id;
    },

    async orderLines(orderId: string) {
      return (
        db
          .select({
            description: sql<string>`coalesce(${lots.name}, ${roastersRotationName})`,
            size: orderItems.size,
            quantity: orderItems.quantity,
            unitPriceCents: orderItems.unitPriceCents,
            lineTotalCents: orderItems.lineTotalCents,
            roastLevel: orderItems.roastLevel,
            grind: orderItems.grind,
          })
          .from(orderItems)
          .leftJoin(lots, eq(lots.id, orderItems.lotId))
          .where(eq(orderItems.orderId, orderId))
          // Items have no position of their own: by coffee, then the larger bag first.
          .orderBy(asc(lots.name), desc(orderItems.fillGrams), asc(orderItems.id))
      );
    },

    /**
     * Records the session opened for an unpaid order; false when the order was cancelled meanwhile
     * (the unpaid-orders job), so its payment page must not be handed out.
     */
    async setOrderCheckoutSession(orderId: string, sessionId: string): Promise<boolean> {
      const saved = await db
        .update(orders)
        .set({ stripeCheckoutSessionId: sessionId })
        .where(and(eq(orders.id, orderId), eq(orders.status, 'pending_payment')))
        .returning({ id: orders.id });
      return saved.length > 0;
    },

    async markOrderPaid(
      orderId: string,
      change: { status: OrderStatus; paidAt: Date; checkoutSessionId: string; paymentIntentId: string | null; shipDate?: string },
    ) {
      await db
        .update(orders)
        .set({
          status: change.status,
          paidAt: change.paidAt,
          ...(change.shipDate ? { shipDate: change.shipDate } : {}),
          stripeCheckoutSessionId: change.checkoutSessionId,
          ...(change.paymentIntentId ? { stripePaymentIntentId: change.paymentIntentId } : {}),
        })
        .where(eq(orders.id, orderId));
    },

    async setOrderRefund(orderId: string, change: { refundedCents: number; status: OrderStatus; paymentIntentId: string; at: Date }) {
      await db
        .update(orders)
        .set({
          refundedCents: change.refundedCents,
          status: change.status,
          stripePaymentIntentId: change.paymentIntentId,
          // A repeated event for a refund already recorded keeps its first date.
          refundedAt: sql`case when ${orders.refundedCents} = ${change.refundedCents} then ${orders.refundedAt} else ${change.at.toISOString()}::timestamptz end`,
        })
        .where(eq(orders.id, orderId));
    },

    async findSubscription(subscriptionId: string) {
      const [subscription] = await subscriptionWithCustomer().where(eq(subscriptions.id, subscriptionId));
      return subscription;
    },

    async lockSubscription(subscriptionId: string) {
      const [subscription] = await subscriptionWithCustomer().where(eq(subscriptions.id, subscriptionId)).for('update', { of: subscriptions });
      return subscription;
    },

    async findSubscriptionIdByStripeId(stripeSubscriptionId: string) {
      const [subscription] = await db.select({ id: subscriptions.id }).from(subscriptions).where(eq(subscriptions.stripeSubscriptionId, stripeSubscriptionId));
      return subscription?.id;
    },

    async setSubscriptionCheckoutSession(subscriptionId: string, sessionId: string) {
      await db.update(subscriptions).set({ stripeCheckoutSessionId: sessionId }).where(eq(subscriptions.id, subscriptionId));
    },

    async updateSubscriptionBilling(
      subscriptionId: string,
      change: {
        status: SubscriptionStatus;
        stripeSubscriptionId: string;
        stripeCustomerId: string | null;
        currentPeriodEnd: Date | null;
        cancelledAt: Date | null;
        stripeCheckoutSessionId?: string;
      },
    ) {
      await db.update(subscriptions).set(change).where(eq(subscriptions.id, subscriptionId));
    },

    async firstDeliveryRoastDate(subscriptionId: string) {
      const [first] = await db
        .select({ roastDate: deliveries.roastDate })
        .from(deliveries)
        .where(eq(deliveries.subscriptionId, subscriptionId))
        .orderBy(asc(deliveries.sequence))
        .limit(1);
      return first?.roastDate;
    },

    async shopTimeZone() {
      const [settings] = await db.select({ timeZone: shopSettings.timeZone }).from(shopSettings).limit(1);
      return settings?.timeZone;
    },

    /** Puts an event in the inbox, not yet applied. False when it is already there (a redelivery). */
    /** Puts the event in the inbox once; says whether it was there already and whether it is applied. */
    async receiveEvent(event: ReceivedEvent) {
      const inserted = await db.insert(paymentEvents).values(event).onConflictDoNothing({ target: paymentEvents.id }).returning({ id: paymentEvents.id });
      if (inserted.length > 0) return { duplicate: false, applied: false };
      const [row] = await db.select({ processedAt: paymentEvents.processedAt }).from(paymentEvents).where(eq(paymentEvents.id, event.id));
      return { duplicate: true, applied: row?.processedAt != null };
    },

    /** The inbox row of an event still to apply, or undefined once it is applied (or unknown). */
    async pendingEvent(eventId: string) {
      const [row] = await db
        .select({ id: paymentEvents.id, payload: paymentEvents.payload })
        .from(paymentEvents)
        .where(and(eq(paymentEvents.id, eventId), isNull(paymentEvents.processedAt)));
      return row;
    },

    /**
     * Claims the event for applying, in the caller's transaction: the row stays locked until it
     * commits, so a second worker with the same event waits and then finds it applied.
     */
    async claimEvent(eventId: string) {
      const [row] = await db
        .select({ id: paymentEvents.id })
        .from(paymentEvents)
        .where(and(eq(paymentEvents.id, eventId), isNull(paymentEvents.processedAt)))
        .for('update');
      return row !== undefined;
    },

    async markEventApplied(eventId: string, processedAt: Date) {
      await db.update(paymentEvents).set({ processedAt }).where(eq(paymentEvents.id, eventId));
    },

    /** Inbox rows received before `before` and still not applied (their job was lost or gave up), oldest first. */
    async eventsWaitingSince(before: Date, limit: number) {
      const rows = await db
        .select({ id: paymentEvents.id })
        .from(paymentEvents)
        .where(and(isNull(paymentEvents.processedAt), lt(paymentEvents.receivedAt, before)))
        .orderBy(asc(paymentEvents.receivedAt))
        .limit(limit);
      return rows.map((row) => row.id);
    },
  };
}

export type PaymentsQueries = ReturnType<typeof queries>;
export type PaymentsTransaction = PaymentsQueries & { tx: Tx };
export type OrderForPayment = NonNullable<Awaited<ReturnType<PaymentsQueries['findOrder']>>>;
export type SubscriptionForPayment = NonNullable<Awaited<ReturnType<PaymentsQueries['findSubscription']>>>;

export function createPaymentsRepo(db: Db) {
  return {
    ...queries(db),
    /** Runs `work` in one transaction; `tx` is for other modules' repos (the e-mail outbox) in the same transaction. */
    transaction<T>(work: (tx: PaymentsTransaction) => Promise<T>): Promise<T> {
      return db.transaction((tx) => work({ ...queries(tx), tx }));
    },
  };
}

export type PaymentsRepo = ReturnType<typeof createPaymentsRepo>;
