import Stripe from 'stripe';
import { deliveryToCharge, planDeliveries } from '@shared/domain/delivery-plan';
import { instantAt } from '@shared/domain/shop-time';
import type { Db } from '../../db/client';
import type { PaymentsGateway } from '../../integrations/payments';
import type { Clock } from '../../lib/clock';
import type { Logger } from '../../lib/logger';
import { deferredSkipCount, markSynced, skipsAwaitingStripe, unskipsAwaitingStripe } from './delivery-grid.repo';
import { choiceOf, keptDeliveries } from './subscription-records.repo';
import { createSubscriptionsRepo } from './subscriptions.repo';

/** Metadata on the Stripe subscription naming the Restday state it holds, so a retried push after a crash is recognised. */
export const syncMarkerKey = 'restday_sync';
const weekSeconds = 7 * 86_400;

export interface StripeSyncDeps {
  db: Db;
  gateway: Pick<PaymentsGateway, 'stripe' | 'retrieveSubscription'>;
  clock: Clock;
  logger: Logger;
}

const unix = (instant: Date) => Math.floor(instant.getTime() / 1000);

/**
 * Pushes a subscription's whole current state to Stripe: price and interval (no proration; the
 * next charge keeps its date), pause (collection paused until the shop-local start of `pausedUntil`),
 * cancellation at period end, and each skip as the next charge moved one cadence later (`trial_end`).
 * A skip is pushed only once no unpaid delivery comes before it, so earlier deliveries are still
 * charged in time; an undone skip whose charge was already moved moves it back one cadence. Safe to run again at any point: the state pushed is named in the metadata and in
 * the Idempotency-Key, and a push already in Stripe is only recorded.
 */
export function createStripeSync({ db, gateway, clock, logger }: StripeSyncDeps) {
  const repo = createSubscriptionsRepo(db);

  async function push(subscriptionId: string): Promise<'pushed' | 'already' | 'nothing'> {
    const subscription = await repo.findById(subscriptionId);
    if (!subscription?.stripeSubscriptionId || subscription.status === 'incomplete') return 'nothing';
    const now = clock.now();
    const { settings, calendar, today } = await repo.scheduleContext(now);
    const kept = await keptDeliveries(db, subscriptionId);
    const plan = planDeliveries(
      {
        status: subscription.status,
        anchorDate: subscription.anchorDate ?? kept[0]?.nominalDate ?? null,
        cadenceWeeks: subscription.cadenceWeeks,
        pausedUntil: subscription.pausedUntil,
        cancelAtPeriodEnd: false,
        choice: choiceOf(subscription),
      },
      kept,
      settings,
      calendar,
      now,
      26,
    );
    const toCharge = deliveryToCharge(plan);
    let stripeSubscription: Stripe.Subscription;
    try {
      stripeSubscription = await gateway.retrieveSubscription(subscription.stripeSubscriptionId);
    } catch (error) {
      // Stripe has no such subscription (the demo seed's invented ids): nothing to push to, so stop asking.
      if (error instanceof Stripe.errors.StripeInvalidRequestError && error.statusCode === 404) {
        logger.warn(
          { subscriptionId, stripeSubscriptionId: subscription.stripeSubscriptionId },
          'Stripe does not know this subscription; its changes stay in Restday',
        );
        await markSynced(
          db,
          subscriptionId,
          subscription.changeVersion,
          (await skipsAwaitingStripe(db, subscriptionId, today)).map((skip) => skip.id),
        );
        return 'nothing';
      }
      throw error;
    }
    // A charge can only be moved on while the subscription is in good standing (not past due).
    const canMoveCharge = stripeSubscription.status === 'active' || stripeSubscription.status === 'trialing';
    const skips = canMoveCharge
      ? (await skipsAwaitingStripe(db, subscriptionId, today)).filter((skip) => !toCharge || skip.roastDate < toCharge.roastDate)
      : [];
    const restored = canMoveCharge ? await unskipsAwaitingStripe(db, subscriptionId, today) : [];
    const skipIds = skips.map((skip) => skip.id);
    const restoredIds = restored.map((row) => row.id);
    // The state pushed: the change version and how many charges skips have moved in all.
    const marker = `v${subscription.changeVersion}-m${(await deferredSkipCount(db, subscriptionId)) + skips.length - restored.length}`;

    if (stripeSubscription.status === 'canceled' || stripeSubscription.metadata?.[syncMarkerKey] === marker) {
      await markSynced(db, subscriptionId, subscription.changeVersion, skipIds, restoredIds);
      return 'already';
    }
    const item = stripeSubscription.items.data[0];
    if (!item) throw new Error(`Stripe subscription ${stripeSubscription.id} has no item`);
    const intervalChanged = item.price.recurring?.interval !== 'week' || item.price.recurring.interval_count !== subscription.cadenceWeeks;
    const priceChanged = item.price.unit_amount !== subscription.priceCents;
    const paused = subscription.pausedUntil !== null && subscription.pausedUntil > today;
    const movedBy = skips.length - restored.length;

    const params: Stripe.SubscriptionUpdateParams = {
      proration_behavior: 'none',
      cancel_at_period_end: subscription.cancelAtPeriodEnd,
      metadata: { [syncMarkerKey]: marker },
      ...(intervalChanged || priceChanged
        ? {
            items: [
              {
                id: item.id,
                price_data: {
                  currency: subscription.currency,
                  product: typeof item.price.product === 'string' ? item.price.product : item.price.product.id,
                  unit_amount: subscription.priceCents,
                  recurring: { interval: 'week', interval_count: subscription.cadenceWeeks },
                },
                quantity: 1,
              },
            ],
          }
        : {}),
      ...(paused
        ? { pause_collection: { behavior: 'void', resumes_at: unix(instantAt(subscription.pausedUntil!, '00:00', settings.timeZone)) } }
        : stripeSubscription.pause_collection
          ? { pause_collection: '' }
          : {}),
      // A new interval would restart the period and bill at once; a trial end keeps the next charge where it was (or moves it on for skips).
      // Moved back, the charge never lands in the past: Stripe charges at once instead.
      ...((intervalChanged && canMoveCharge) || movedBy !== 0
        ? { trial_end: Math.max(item.current_period_end + movedBy * subscription.cadenceWeeks * weekSeconds, unix(now) + 60) }
        : {}),
    };
    await gateway.stripe.subscriptions.update(stripeSubscription.id, params, { idempotencyKey: `subscription-${subscriptionId}-sync-${marker}` });
    await markSynced(db, subscriptionId, subscription.changeVersion, skipIds, restoredIds);
    logger.info({ subscriptionId, marker }, 'subscription pushed to Stripe');
    return 'pushed';
  }

  return {
    push,
    /** Every subscription whose Stripe side is behind; one failure does not stop the others, but is thrown at the end so the job retries. */
    async pushAllBehind() {
      const { today } = await repo.scheduleContext(clock.now());
      let failed: unknown;
      for (const id of await repo.idsAwaitingStripe(today)) {
        try {
          await push(id);
        } catch (error) {
          logger.warn({ err: error, subscriptionId: id }, 'pushing a subscription to Stripe failed; it is retried');
          failed ??= error;
        }
      }
      if (failed) throw failed;
    },
  };
}

export type StripeSync = ReturnType<typeof createStripeSync>;
