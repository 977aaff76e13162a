// What a self-service change reads and writes: the plan it looks over, prices, and how it is described.
import { planDeliveries, type DeliveryChoice, type PlannedDelivery } from '@shared/domain/delivery-plan';
import { quoteSubscriptionDelivery } from '@shared/domain/pricing';
import type { RoastCalendar, ScheduleSettings } from '@shared/domain/roast-schedule';
import type { IsoDate } from '@shared/domain/shop-time';
import { grindLabels, roastLevelLabels, type RoastLevel } from '@shared/domain/vocabulary';
import type { SubscriptionDelivery } from '@shared/schemas/subscriptions';
import type { ShopSettings } from '@shared/schemas/settings';
import type { Tx } from '../../db/client';
import { AppError } from '../../lib/app-error';
import { assertBagsShip } from '../shipping';
import { choiceOf, type keptDeliveries, type SubscriptionRecord } from './subscription-records.repo';
import type { SubscriptionFieldsChange } from './subscriptions.repo';

/** Deliveries a change looks over: enough to find the next unlocked one past skips. */
export const planLength = 26;
/** The longest pause a subscriber can set themselves. */
export const maxPauseDays = 366;

export function levelOffered(level: RoastLevel, allowed: readonly RoastLevel[] | null) {
  return allowed === null || allowed.includes(level);
}

export const levelNotOffered = (level: RoastLevel, allowed: readonly RoastLevel[]) =>
  new AppError(422, 'roast_level_not_offered', `This coffee is not roasted ${roastLevelLabels[level].toLowerCase()}.`, {
    roastLevel: `Choose one of: ${allowed.map((each) => roastLevelLabels[each].toLowerCase()).join(', ')}.`,
  });

/** Price of one delivery: roasted bags less the subscription discount, plus shipping (the trade engine's quote). */
export function deliveryPrice(lotCode: string | null, choice: Pick<DeliveryChoice, 'bagSize' | 'bagsPerDelivery'>, settings: ShopSettings) {
  assertBagsShip([{ field: 'bagSize', size: choice.bagSize }], settings.shipping);
  return quoteSubscriptionDelivery({ lotCode, bagSize: choice.bagSize, bagsPerDelivery: choice.bagsPerDelivery }, settings).totalCents;
}

export function planOf(
  subscription: SubscriptionRecord,
  kept: Awaited<ReturnType<typeof keptDeliveries>>,
  settings: ScheduleSettings,
  calendar: RoastCalendar,
  now: Date,
  count: number,
) {
  return planDeliveries(
    {
      status: subscription.status,
      anchorDate: subscription.anchorDate ?? kept[0]?.nominalDate ?? null,
      cadenceWeeks: subscription.cadenceWeeks,
      pausedUntil: subscription.pausedUntil,
      cancelAtPeriodEnd: subscription.cancelAtPeriodEnd,
      choice: choiceOf(subscription),
    },
    kept,
    settings,
    calendar,
    now,
    count,
  );
}

export function toApiDelivery(
  delivery: PlannedDelivery,
  subscription: SubscriptionRecord,
  picks: ReadonlyMap<IsoDate, { code: string; name: string }>,
): SubscriptionDelivery {
  const pick = subscription.lotCode ? { code: subscription.lotCode, name: subscription.coffee } : picks.get(delivery.roastDate);
  return {
    roastDate: delivery.roastDate,
    shipDate: delivery.shipDate,
    readyFrom: delivery.readyFrom,
    bestBefore: delivery.bestBefore,
    expectedArrival: delivery.expectedArrival,
    readyOnArrival: delivery.expectedArrival >= delivery.readyFrom,
    status: delivery.status,
    locked: delivery.locked,
    cutoffAt: delivery.cutoffAt,
    lotCode: pick?.code ?? null,
    coffee: pick?.name ?? null,
    ...delivery.choice,
    orderId: delivery.orderId,
    paid: delivery.orderId !== null,
  };
}

export const describeChoice = {
  roastLevel: (value: RoastLevel) => `Roast level: ${roastLevelLabels[value]}`,
  grind: (value: DeliveryChoice['grind']) => `Grind: ${grindLabels[value]}`,
  brewMethod: (value: DeliveryChoice['brewMethod']) => `Brew method: ${value === 'espresso' ? 'Espresso' : 'Filter'}`,
  bagSize: (value: DeliveryChoice['bagSize']) => `Bag size: ${value}`,
  bagsPerDelivery: (value: number) => `Bags per delivery: ${value}`,
  cadenceWeeks: (value: number) => `Every ${value === 1 ? 'week' : `${value} weeks`}`,
};

export type ChangeKind = 'changed' | 'skipped' | 'unskipped' | 'paused' | 'resumed' | 'cancelled';

export interface ChangeContext {
  tx: Tx;
  subscription: SubscriptionRecord;
  plan: PlannedDelivery[];
  settings: ShopSettings;
  calendar: RoastCalendar;
  today: IsoDate;
  now: Date;
}

/**
 * What a change wants: the subscription's new fields, the e-mail's lines and what the subscriber is
 * told (`notice`, also the e-mail's lead when given), or nothing (it is already so, and `notice` says that).
 */
export type ChangeOutcome = { fields: SubscriptionFieldsChange; summary: string[]; notice?: string } | { unchanged: string };
export const unchanged = (notice: string): ChangeOutcome => ({ unchanged: notice });
