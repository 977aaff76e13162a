import { samePostalAddress } from '@shared/domain/address';
import { searchFromBuilder } from '@shared/domain/builder-search';
import { deliveryGreenGrams, nextDelivery, type DeliveryChoice, type PlannedDelivery } from '@shared/domain/delivery-plan';
import { datesForRoastDate } from '@shared/domain/roast-schedule';
import { addDays, localDateOf, type IsoDate } from '@shared/domain/shop-time';
import { subscriptionStatusOf } from '@shared/domain/subscription-status';
import { paidDeliveryInPauseQuestion, pauseNotice, skipNotice, unskipNotice, writtenDay, type PauseOutcome } from '@shared/domain/subscription-wording';
import type {
  PaidDeliveryChoice,
  Subscription,
  SubscriptionChangeResponse,
  SubscriptionCheckoutRequest,
  SubscriptionCheckoutResponse,
  SubscriptionDelivery,
  SubscriptionUpdate,
} from '@shared/schemas/subscriptions';
import { AppError } from '../../lib/app-error';
import type { Clock } from '../../lib/clock';
import type { SessionUser } from '../../middleware/require-role';
import { queueEmail } from '../outbox';
import type { CheckoutUrlResponse } from '@shared/schemas/checkout';
import type { AddressBook } from '../account';
import type { AuditTrail } from '../audit';
import type { PaymentsService } from '../payments';
import { dropDelivery, keepDelivery } from './delivery-grid.repo';
import { moveOrderToDelivery, reshapePaidOrder } from './delivery-orders.repo';
import { choiceOf, keptDeliveries, loadScheduleContext, lockSubscription, type SubscriptionRecord } from './subscription-records.repo';
import { changeSubscription, type SubscriptionFieldsChange, type SubscriptionsRepo } from './subscriptions.repo';
import {
  deliveryPrice,
  describeChoice,
  levelNotOffered,
  levelOffered,
  maxPauseDays,
  planLength,
  planOf,
  toApiDelivery,
  unchanged,
  type ChangeContext,
  type ChangeKind,
  type ChangeOutcome,
} from './subscription-plan';

export interface SubscriptionsServiceDeps {
  repo: SubscriptionsRepo;
  payments: Pick<PaymentsService, 'createCheckoutForSubscription'>;
  clock: Clock;
  /** Called after a change commits: hands the subscription to the Stripe sync (a queued job). */
  onChanged?: (subscriptionId: string) => Promise<void>;
  addressBook: AddressBook;
  /** Records changes staff make on a subscriber's behalf. */
  audit: AuditTrail;
}

export function createSubscriptionsService({ repo, payments, clock, onChanged, addressBook, audit }: SubscriptionsServiceDeps) {
  async function present(subscription: SubscriptionRecord, count = 1): Promise<{ subscription: Subscription; plan: SubscriptionDelivery[] }> {
    const now = clock.now();
    const { settings, calendar } = await repo.scheduleContext(now);
    const kept = await repo.keptDeliveries(subscription.id);
    const plan = planOf(subscription, kept, settings, calendar, now, count);
    const picks = subscription.lotCode ? new Map() : await repo.rotationPicks(plan.map((delivery) => delivery.roastDate));
    const next = nextDelivery(plan);
    const apiPlan = plan.map((delivery) => toApiDelivery(delivery, subscription, picks));
    return {
      plan: apiPlan,
      subscription: {
        id: subscription.id,
        status: subscriptionStatusOf(subscription.status, subscription.pausedUntil, localDateOf(now, settings.timeZone)),
        lotCode: subscription.lotCode,
        coffee: subscription.coffee,
        ...choiceOf(subscription),
        cadenceWeeks: subscription.cadenceWeeks,
        pausedUntil: subscription.pausedUntil,
        cancelAtPeriodEnd: subscription.cancelAtPeriodEnd,
        endsOn: subscription.cancelAtPeriodEnd && subscription.currentPeriodEnd ? localDateOf(subscription.currentPeriodEnd, settings.timeZone) : null,
        priceCents: subscription.priceCents,
        currency: subscription.currency,
        shippingAddress: { ...subscription.shippingAddress, line2: subscription.shippingAddress.line2 ?? null },
        nextDelivery: next ? toApiDelivery(next, subscription, picks) : null,
        createdAt: subscription.createdAt.toISOString(),
      },
    };
  }

  async function own(user: SessionUser, subscriptionId: string) {
    const subscription = await repo.findOwn(subscriptionId, user.id);
    if (!subscription) throw AppError.notFound('Subscription');
    return subscription;
  }

  const isStaff = (user: SessionUser) => user.role === 'staff' || user.role === 'owner';

  /** The subscriber themselves, or staff acting on their behalf (audited). */
  const mayChange = (user: SessionUser, subscription: { userId: string }) => subscription.userId === user.id || isStaff(user);

  async function changeable(user: SessionUser, subscriptionId: string) {
    const subscription = isStaff(user) ? await repo.findById(subscriptionId) : await repo.findOwn(subscriptionId, user.id);
    if (!subscription) throw AppError.notFound('Subscription');
    return subscription;
  }

  /** Deliveries past their cutoff keep what they bring from now on: a change must never reach them. */
  async function freezeLocked({ tx, subscription, plan }: ChangeContext) {
    for (const delivery of plan) {
      if (!delivery.locked || delivery.frozen || delivery.status === 'skipped') continue;
      await keepDelivery(tx, subscription.id, delivery, { status: delivery.status, dates: delivery, choice: delivery.choice });
    }
  }

  /**
   * One self-service change, in one transaction with its e-mail: lock the subscription, freeze the
   * locked deliveries, apply, bump the change version (the Stripe sync's idempotency), queue the
   * e-mail. A change that is already so changes nothing and sends nothing.
   */
  async function change(
    user: SessionUser,
    subscriptionId: string,
    kind: ChangeKind,
    decide: (context: ChangeContext) => Promise<ChangeOutcome>,
  ): Promise<SubscriptionChangeResponse> {
    const before = await changeable(user, subscriptionId);
    const now = clock.now();
    const { changed, notice } = await repo.transaction(async (tx) => {
      const subscription = await lockSubscription(tx, subscriptionId);
      if (!subscription || !mayChange(user, subscription)) throw AppError.notFound('Subscription');
      if (subscription.status === 'cancelled')
        throw AppError.conflict('subscription_ended', 'This subscription has ended; start a new one to receive coffee again.');
      if (subscription.status === 'incomplete')
        throw AppError.conflict('subscription_not_started', 'This subscription starts once its first payment goes through.');
      const { settings, calendar, today } = await loadScheduleContext(tx, now);
      const plan = planOf(subscription, await keptDeliveries(tx, subscriptionId), settings, calendar, now, planLength);
      const context: ChangeContext = { tx, subscription, plan, settings, calendar, today, now };
      await freezeLocked(context);
      const outcome = await decide(context);
      if ('unchanged' in outcome) return { changed: false, notice: outcome.unchanged };
      const version = await changeSubscription(tx, subscriptionId, outcome.fields);
      const notice = outcome.notice ?? outcome.summary.join(' ');

      const after = (await lockSubscription(tx, subscriptionId))!;
      const afterPlan = planOf(after, await keptDeliveries(tx, subscriptionId), settings, calendar, now, planLength);
      const next = nextDelivery(afterPlan);
      await queueEmail(tx, {
        template: 'subscription-changed',
        to: after.customerEmail,
        dedupeKey: `subscription-changed:${subscriptionId}:${version}`,
        payload: {
          name: after.customerName,
          subscriptionId,
          coffee: after.coffee,
          change: kind,
          summary: outcome.summary,
          ...(outcome.notice ? { notice: outcome.notice } : {}),
          ...(next ? { nextDelivery: { roastDate: next.roastDate, shipDate: next.shipDate, readyFrom: next.readyFrom } } : {}),
          ...(kind === 'paused' && after.pausedUntil ? { pausedUntil: after.pausedUntil } : {}),
          ...(kind === 'cancelled' && after.currentPeriodEnd ? { endsOn: localDateOf(after.currentPeriodEnd, settings.timeZone) } : {}),
        },
      });
      return { changed: true, notice };
    });
    if (changed) await onChanged?.(subscriptionId);
    if (changed && before.userId !== user.id) {
      await audit.record({ action: 'subscription.changed_by_staff', actorId: user.id, detail: { subscriptionId, customerId: before.userId, change: kind } });
    }
    return { ...(await present(await changeable(user, subscriptionId))).subscription, notice };
  }

  /** The delivery on a roast date, or the next one a skip can take. */
  function deliveryOn(plan: readonly PlannedDelivery[], roastDate: IsoDate) {
    const found = plan.find((delivery) => delivery.roastDate === roastDate);
    if (!found)
      throw new AppError(422, 'no_such_delivery', 'There is no upcoming delivery on that day.', {
        roastDate: 'Choose the roast date of an upcoming delivery.',
      });
    return found;
  }

  return {
    /**
     * Roasted to Order: checks the coffee and level, prices one delivery with the trade engine,
     * creates the subscription (incomplete until paid) and opens Stripe's subscription checkout.
     */
    async startCheckout(user: SessionUser, request: SubscriptionCheckoutRequest): Promise<SubscriptionCheckoutResponse> {
      const lot = request.lotCode === null ? null : await repo.lotForSubscription(request.lotCode);
      if (request.lotCode !== null && !lot) {
        throw AppError.badRequest('That coffee is not offered.', { lotCode: `There is no lot ${request.lotCode} to subscribe to.` });
      }
      if (lot && !levelOffered(request.roastLevel, lot.allowedLevels)) throw levelNotOffered(request.roastLevel, lot.allowedLevels);
      const { settings } = await repo.scheduleContext(clock.now());
      const choice: DeliveryChoice = {
        roastLevel: request.roastLevel,
        bagSize: request.bagSize,
        bagsPerDelivery: request.bagsPerDelivery,
        grind: request.grind,
        brewMethod: request.brewMethod,
      };
      // Never take money for coffee that cannot be roasted: the lot must hold one delivery's green.
      if (lot && lot.stockGrams < deliveryGreenGrams(choice, settings)) {
        throw new AppError(409, 'lot_sold_out', `${lot.name} is sold out; the Roaster's Rotation is roasting now.`, {
          lotCode: `${lot.code} does not have enough green coffee left to roast a delivery. Choose the Roaster's Rotation or another lot.`,
        });
      }
      const subscriptionId = await repo.createSubscription({
        userId: user.id,
        lotId: lot?.id ?? null,
        roastLevel: request.roastLevel,
        choice,
        cadenceWeeks: request.cadenceWeeks,
        shippingAddress: request.shippingAddress,
        priceCents: deliveryPrice(lot?.code ?? null, choice, settings),
        currency: settings.currency,
      });
      if (request.saveAddress) await addressBook.keep(user.id, request.shippingAddress);
      // Leaving the payment page comes back to the builder with these same choices, not the defaults.
      const backToBuilder = searchFromBuilder(request);
      backToBuilder.set('checkout', 'cancelled');
      try {
        const { checkoutUrl } = await payments.createCheckoutForSubscription(subscriptionId, {
          successPath: `/subscriptions/${subscriptionId}?checkout=complete`,
          cancelPath: `/subscribe?${backToBuilder.toString()}`,
        });
        return { subscriptionId, checkoutUrl };
      } catch (error) {
        await repo.cancelIncomplete(subscriptionId, clock.now());
        throw error;
      }
    },

    /** "Pay now" on a subscription whose first payment never came: the same subscription and, while open, the same payment page. */
    async resumePayment(user: SessionUser, subscriptionId: string): Promise<CheckoutUrlResponse> {
      const subscription = await own(user, subscriptionId);
      if (subscription.status !== 'incomplete') throw AppError.conflict('subscription_not_payable', 'This subscription has already started.');
      const { checkoutUrl } = await payments.createCheckoutForSubscription(subscriptionId, {
        successPath: `/subscriptions/${subscriptionId}?checkout=complete`,
        cancelPath: `/subscriptions/${subscriptionId}?checkout=cancelled`,
      });
      return { checkoutUrl };
    },

    /** "Discard": a subscription never paid for is cancelled and leaves the customer's list. */
    async discard(user: SessionUser, subscriptionId: string): Promise<void> {
      await own(user, subscriptionId);
      if (!(await repo.discardIncomplete(subscriptionId, clock.now()))) {
        throw AppError.conflict('subscription_not_payable', 'This subscription has already started.');
      }
    },

    async list(user: SessionUser): Promise<Subscription[]> {
      const rows = await repo.listOwn(user.id);
      return Promise.all(rows.map(async (row) => (await present(row)).subscription));
    },

    async get(user: SessionUser, subscriptionId: string): Promise<Subscription> {
      return (await present(await own(user, subscriptionId))).subscription;
    },

    async deliveries(user: SessionUser, subscriptionId: string, count: number): Promise<SubscriptionDelivery[]> {
      return (await present(await own(user, subscriptionId), count)).plan;
    },

    update(user: SessionUser, subscriptionId: string, update: SubscriptionUpdate) {
      return change(user, subscriptionId, 'changed', async ({ tx, subscription, plan, settings, calendar }) => {
        const current = { ...choiceOf(subscription), cadenceWeeks: subscription.cadenceWeeks };
        const fields: SubscriptionFieldsChange = {};
        const summary: string[] = [];
        for (const key of ['roastLevel', 'grind', 'brewMethod', 'bagSize', 'bagsPerDelivery', 'cadenceWeeks'] as const) {
          const value = update[key];
          if (value === undefined || value === current[key]) continue;
          Object.assign(fields, { [key]: value });
          summary.push((describeChoice[key] as (value: unknown) => string)(value));
        }
        const addressChanged = update.shippingAddress !== undefined && !samePostalAddress(update.shippingAddress, subscription.shippingAddress);
        if (addressChanged) {
          fields.shippingAddress = update.shippingAddress;
          summary.push(`Ship to: ${update.shippingAddress!.line1}, ${update.shippingAddress!.city}`);
        }
        if (summary.length === 0) return unchanged('Nothing to change: your subscription already reads so.');
        if (fields.roastLevel && subscription.lotId) {
          const allowed = await repo.lotLevels(subscription.lotId);
          if (allowed && !levelOffered(fields.roastLevel, allowed)) throw levelNotOffered(fields.roastLevel, allowed);
        }
        const choice: DeliveryChoice = { ...choiceOf(subscription), ...fields } as DeliveryChoice;
        if (fields.bagSize || fields.bagsPerDelivery) fields.priceCents = deliveryPrice(subscription.lotCode, choice, settings);

        // A new cadence starts its grid at the first delivery that is not locked.
        if (fields.cadenceWeeks) {
          const firstOpen = plan.find((delivery) => !delivery.locked);
          if (firstOpen) fields.anchorDate = firstOpen.nominalDate;
        }
        // Paid deliveries whose cutoff is ahead take what does not change their price.
        const shippingAddress = fields.shippingAddress ?? subscription.shippingAddress;
        for (const delivery of plan) {
          if (delivery.locked || !delivery.orderId || delivery.status !== 'scheduled') continue;
          const reshaped: DeliveryChoice = { ...delivery.choice, roastLevel: choice.roastLevel, grind: choice.grind, brewMethod: choice.brewMethod };
          const dates = datesForRoastDate(delivery.roastDate, reshaped, settings, calendar);
          await keepDelivery(tx, subscription.id, delivery, { status: 'scheduled', dates, choice: reshaped });
          await reshapePaidOrder(tx, delivery.orderId, { choice: reshaped, dates, shippingAddress });
        }
        return { fields, summary };
      });
    },

    skip(user: SessionUser, subscriptionId: string, roastDate: IsoDate | undefined) {
      return change(user, subscriptionId, 'skipped', async ({ tx, subscription, plan, settings, calendar }) => {
        const target = roastDate
          ? deliveryOn(plan, roastDate)
          : plan.find((delivery) => !delivery.locked && (delivery.status === 'scheduled' || delivery.status === 'skipped'));
        if (!target) {
          throw new AppError(422, 'no_such_delivery', 'There is no upcoming delivery on that day.', {
            roastDate: 'Choose the roast date of an upcoming delivery.',
          });
        }
        if (target.locked) {
          throw AppError.conflict(
            'delivery_locked',
            `The delivery roasting on ${writtenDay(target.roastDate)} is past its cutoff and can no longer be skipped.`,
          );
        }
        if (target.status === 'skipped') return unchanged(`The delivery roasting ${writtenDay(target.roastDate)} is already skipped.`);
        if (target.status === 'held')
          throw AppError.conflict('delivery_held', 'This delivery is waiting for its payment; update your card instead of skipping it.');
        if (target.status !== 'scheduled') throw AppError.conflict('delivery_locked', 'This delivery is already roasted.');

        // A row Stripe has already moved a charge for (a skip undone, not yet pushed) keeps that mark, so the charge is not moved twice.
        await keepDelivery(tx, subscription.id, target, {
          status: 'skipped',
          dates: target,
          choice: null,
          orderId: null,
          ...(target.keptId ? {} : { chargeDeferred: false }),
        });
        // Already paid: the payment carries over to the next delivery, and Stripe's next charge moves one cadence on.
        let paymentMovesTo: IsoDate | undefined;
        if (target.orderId) {
          const following = plan.find((delivery) => delivery.roastDate > target.roastDate && delivery.status === 'scheduled' && !delivery.orderId);
          if (!following) throw AppError.conflict('delivery_locked', 'There is no later delivery to carry this payment to.');
          const dates = datesForRoastDate(following.roastDate, target.choice, settings, calendar);
          const deliveryId = await keepDelivery(tx, subscription.id, following, { status: 'scheduled', dates, choice: target.choice, orderId: target.orderId });
          await moveOrderToDelivery(tx, target.orderId, deliveryId, dates);
          paymentMovesTo = following.roastDate;
        }
        const notice = skipNotice({ roastDate: target.roastDate, ...(paymentMovesTo ? { paymentMovesTo } : {}) });
        return { fields: {}, summary: [notice], notice };
      });
    },

    /**
     * Undoes a skip while the delivery's cutoff is ahead. A payment the skip carried on comes back:
     * paid deliveries come first, so the first later paid delivery whose cutoff is ahead holds it.
     */
    unskip(user: SessionUser, subscriptionId: string, roastDate: IsoDate) {
      return change(user, subscriptionId, 'unskipped', async ({ tx, subscription, plan, settings, calendar }) => {
        const target = deliveryOn(plan, roastDate);
        if (target.status !== 'skipped') return unchanged(`The delivery roasting ${writtenDay(target.roastDate)} is not skipped.`);
        if (target.locked) {
          throw AppError.conflict(
            'delivery_locked',
            `The delivery roasting ${writtenDay(target.roastDate)} is past its cutoff, so its skip can no longer be undone.`,
            {
              roastDate: 'Its cutoff has passed.',
            },
          );
        }
        if (subscription.pausedUntil && target.roastDate < subscription.pausedUntil) {
          throw AppError.conflict('delivery_in_pause', `The delivery roasting ${writtenDay(target.roastDate)} falls inside your pause; resume first.`, {
            roastDate: 'It falls inside the pause.',
          });
        }
        const carrier = plan.find(
          (delivery) => delivery.roastDate > target.roastDate && delivery.status === 'scheduled' && delivery.orderId && !delivery.locked,
        );
        const choice = carrier ? carrier.choice : choiceOf(subscription);
        const dates = datesForRoastDate(target.roastDate, choice, settings, calendar);
        if (carrier?.orderId) {
          await keepDelivery(tx, subscription.id, carrier, { status: 'scheduled', dates: carrier, choice: null, orderId: null });
          const deliveryId = await keepDelivery(tx, subscription.id, target, { status: 'scheduled', dates, choice, orderId: carrier.orderId });
          await moveOrderToDelivery(tx, carrier.orderId, deliveryId, dates);
        } else {
          await keepDelivery(tx, subscription.id, target, { status: 'scheduled', dates, choice: null });
        }
        const notice = unskipNotice({ roastDate: target.roastDate, ...(carrier ? { paymentMovesFrom: carrier.roastDate } : {}) });
        return { fields: {}, summary: [notice], notice };
      });
    },

    pause(user: SessionUser, subscriptionId: string, until: IsoDate, paidDelivery: PaidDeliveryChoice | undefined) {
      return change(user, subscriptionId, 'paused', async ({ tx, subscription, plan, settings, calendar, today, now }) => {
        if (until <= today) throw AppError.badRequest('Choose a day after today.', { until: 'Choose a day after today.' });
        if (until > addDays(today, maxPauseDays))
          throw AppError.badRequest('Pause for at most a year.', { until: `Choose a day within ${maxPauseDays} days.` });
        if (subscription.pausedUntil === until) return unchanged(pauseNotice({ until, shipping: [], held: [] }));
        // Paid deliveries the pause would cover whose cutoff is ahead: the subscriber says whether they ship or wait.
        const paidInside = plan.filter((delivery) => delivery.orderId && delivery.status === 'scheduled' && !delivery.locked && delivery.roastDate < until);
        if (paidInside.length > 0 && !paidDelivery) {
          const first = paidInside[0]!;
          throw AppError.conflict('paid_delivery_in_pause', paidDeliveryInPauseQuestion(first.roastDate), {
            paidDelivery: `Choose ship or hold for the paid delivery roasting ${writtenDay(first.roastDate)}.`,
          });
        }
        const outcome = { until, shipping: [] as IsoDate[], held: [] as PauseOutcome['held'][number][] };
        if (paidDelivery === 'hold' && paidInside.length > 0) {
          // The first deliveries after the pause, as the paused grid will lay them.
          const paused = { ...subscription, pausedUntil: until };
          const afterPause = planOf(paused, await keptDeliveries(tx, subscription.id), settings, calendar, now, planLength).filter(
            (delivery) => delivery.roastDate >= until && delivery.status === 'scheduled' && !delivery.orderId,
          );
          for (const [index, held] of paidInside.entries()) {
            const to = afterPause[index];
            if (!to)
              throw AppError.conflict('paid_delivery_in_pause', 'There is no delivery after the pause to hold this payment for.', {
                paidDelivery: 'Choose ship.',
              });
            const dates = datesForRoastDate(to.roastDate, held.choice, settings, calendar);
            await dropDelivery(tx, held.keptId!);
            const deliveryId = await keepDelivery(tx, subscription.id, to, { status: 'scheduled', dates, choice: held.choice, orderId: held.orderId });
            await moveOrderToDelivery(tx, held.orderId!, deliveryId, dates);
            outcome.held.push({ from: held.roastDate, to: to.roastDate });
          }
        } else {
          outcome.shipping.push(...paidInside.map((delivery) => delivery.roastDate));
        }
        const notice = pauseNotice(outcome);
        return {
          fields: { pausedUntil: until, pausedAt: now, status: subscriptionStatusOf(subscription.status, until, today) },
          summary: [notice],
          notice,
        };
      });
    },

    resume(user: SessionUser, subscriptionId: string) {
      return change(user, subscriptionId, 'resumed', async ({ subscription, today }) => {
        const paused = subscription.pausedUntil !== null && subscription.pausedUntil > today;
        if (!paused && !subscription.cancelAtPeriodEnd) return unchanged('Your subscription is running.');
        return {
          fields: { pausedUntil: null, cancelAtPeriodEnd: false, status: subscriptionStatusOf(subscription.status, null, today) },
          summary: [subscription.cancelAtPeriodEnd && !paused ? 'Cancellation withdrawn' : 'Deliveries resume'],
        };
      });
    },

    cancel(user: SessionUser, subscriptionId: string) {
      return change(user, subscriptionId, 'cancelled', async ({ subscription }) => {
        if (subscription.cancelAtPeriodEnd) return unchanged('Your subscription is already cancelled at the end of its paid period.');
        return { fields: { cancelAtPeriodEnd: true }, summary: ['Cancelled at the end of the paid period'] };
      });
    },
  };
}

export type SubscriptionsService = ReturnType<typeof createSubscriptionsService>;
