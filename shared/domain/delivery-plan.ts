/**
 * A subscription's deliveries as Deliveries shows them: the rows the shop keeps (paid, skipped,
 * held, or frozen once their cutoff passed) laid over the grid `subscriptionDeliveries` computes
 * from the anchor, the cadence, a pause and the Roast Calendar.
 *
 * - `planDeliveries(subscription, kept, settings, calendar, now, count)`: the next `count`
 *   deliveries by roast date, each with its status, lock and what it brings.
 * - `deliveryToCharge(plan)`: the delivery the next paid (or failed) charge is for: a held one
 *   first, else the first one neither paid nor skipped.
 * - `firstRoastDates(paidAt, coffee, settings, calendar)`: the first open roast day whose cutoff
 *   has not passed, and its dates. A subscription's anchor, and where a late payment roasts.
 *
 * A kept row is the truth for its grid date (`nominalDate`); the grid fills the rest. A row that
 * is not frozen follows the subscription's current choice, so its ready-from date is recomputed.
 */
import {
  arrivalDate,
  cutoffInstant,
  datesForRoastDate,
  scheduleOrder,
  subscriptionDeliveries,
  type CoffeeForRest,
  type RoastCalendar,
  type RoastDates,
  type ScheduleSettings,
} from './roast-schedule';
import { greenNeededForRoasted, type LossModel } from './roast-loss';
import { localDateOf, type IsoDate } from './shop-time';
import { bagFillGrams } from './units';
import type { BrewMethod, CadenceWeeks, DeliveryStatus, Grind, RoastedBagSize, RoastLevel, SubscriptionStatus } from './vocabulary';

export interface DeliveryChoice {
  roastLevel: RoastLevel;
  bagSize: RoastedBagSize;
  bagsPerDelivery: number;
  grind: Grind;
  brewMethod: BrewMethod;
}

/** A deliveries row. */
export interface KeptDelivery {
  id: string;
  nominalDate: IsoDate;
  roastDate: IsoDate;
  shipDate: IsoDate;
  readyFrom: IsoDate;
  bestBefore: IsoDate;
  status: DeliveryStatus;
  orderId: string | null;
  /** What it brings, once frozen; null follows the subscription. */
  choice: DeliveryChoice | null;
}

export interface SubscriptionForPlan {
  status: SubscriptionStatus;
  /** Null until the first payment. */
  anchorDate: IsoDate | null;
  cadenceWeeks: number;
  pausedUntil: IsoDate | null;
  cancelAtPeriodEnd: boolean;
  choice: DeliveryChoice;
}

export interface PlannedDelivery extends RoastDates {
  nominalDate: IsoDate;
  status: DeliveryStatus;
  /** The cutoff has passed: it keeps what it brings, and changes reach the next one. */
  locked: boolean;
  orderId: string | null;
  choice: DeliveryChoice;
  /** The row it comes from; null for a delivery only the grid knows. */
  keptId: string | null;
  frozen: boolean;
}

const upcomingStatuses: ReadonlySet<SubscriptionStatus> = new Set(['active', 'paused', 'past_due']);

function isShown(row: KeptDelivery, today: IsoDate): boolean {
  if (row.status === 'shipped') return false;
  if (row.status === 'held') return true;
  if (row.status === 'skipped') return row.roastDate >= today;
  return row.orderId !== null || row.roastDate >= today;
}

export function planDeliveries(
  subscription: SubscriptionForPlan,
  kept: readonly KeptDelivery[],
  settings: ScheduleSettings,
  calendar: RoastCalendar,
  now: Date,
  count: number,
): PlannedDelivery[] {
  const today = localDateOf(now, settings.timeZone);
  const isLocked = (dates: RoastDates) => now.getTime() >= Date.parse(dates.cutoffAt);
  const fromRows = kept
    .filter((row) => isShown(row, today))
    .map((row): PlannedDelivery => {
      const choice = row.choice ?? subscription.choice;
      const dates: RoastDates = row.choice
        ? {
            ...datesForRoastDate(row.roastDate, choice, settings, calendar),
            shipDate: row.shipDate,
            readyFrom: row.readyFrom,
            bestBefore: row.bestBefore,
            expectedArrival: arrivalDate(row.shipDate, settings.transitDays),
          }
        : datesForRoastDate(row.roastDate, choice, settings, calendar);
      return {
        ...dates,
        nominalDate: row.nominalDate,
        status: row.status,
        locked: isLocked(dates),
        orderId: row.orderId,
        choice,
        keptId: row.id,
        frozen: row.choice !== null,
      };
    });

  const keptDates = new Set(kept.map((row) => row.nominalDate));
  const fromGrid: PlannedDelivery[] =
    subscription.anchorDate && upcomingStatuses.has(subscription.status) && !subscription.cancelAtPeriodEnd
      ? subscriptionDeliveries(
          {
            anchorDate: subscription.anchorDate,
            cadenceWeeks: subscription.cadenceWeeks as CadenceWeeks,
            pausedUntil: subscription.pausedUntil,
            from: today,
            count: count + kept.length,
            now,
            brewMethod: subscription.choice.brewMethod,
            roastLevel: subscription.choice.roastLevel,
          },
          settings,
          calendar,
        )
          .filter((delivery) => !keptDates.has(delivery.nominalDate))
          .map((delivery) => ({
            roastDate: delivery.roastDate,
            cutoffAt: delivery.cutoffAt,
            shipDate: delivery.shipDate,
            readyFrom: delivery.readyFrom,
            bestBefore: delivery.bestBefore,
            expectedArrival: delivery.expectedArrival,
            nominalDate: delivery.nominalDate,
            status: 'scheduled',
            locked: delivery.locked,
            orderId: null,
            choice: subscription.choice,
            keptId: null,
            frozen: false,
          }))
      : [];

  return [...fromRows, ...fromGrid].sort((a, b) => a.roastDate.localeCompare(b.roastDate) || a.nominalDate.localeCompare(b.nominalDate)).slice(0, count);
}

/** The delivery a charge pays for: a held one first, else the first neither paid nor skipped. */
export function deliveryToCharge(plan: readonly PlannedDelivery[]): PlannedDelivery | undefined {
  return plan.find((delivery) => delivery.status === 'held') ?? plan.find((delivery) => delivery.status === 'scheduled' && delivery.orderId === null);
}

/** The next delivery the subscriber will receive: neither skipped nor already on its way. */
export function nextDelivery(plan: readonly PlannedDelivery[]): PlannedDelivery | undefined {
  return plan.find((delivery) => delivery.status === 'scheduled' || delivery.status === 'held');
}

/** Subscriptions are booked ahead and never held back by capacity, so no grams count here. */
export function firstRoastDates(paidAt: Date, coffee: CoffeeForRest, settings: ScheduleSettings, calendar: RoastCalendar): RoastDates {
  return scheduleOrder({ paidAt, greenGrams: 0, ...coffee }, settings, calendar);
}

/** The dates a paid delivery roasts on: its own while its cutoff is ahead, else the next open roast day. */
export function roastDatesWhenPaid(delivery: PlannedDelivery, paidAt: Date, settings: ScheduleSettings, calendar: RoastCalendar): RoastDates {
  if (paidAt.getTime() < cutoffInstant(delivery.roastDate, settings).getTime()) {
    return datesForRoastDate(delivery.roastDate, delivery.choice, settings, calendar);
  }
  return firstRoastDates(paidAt, delivery.choice, settings, calendar);
}

/**
 * Green coffee one delivery takes from its lot: the bags' fill weight plus the overage, over the
 * level's default loss (the Roast List's own rule). A lot holding less cannot roast a delivery.
 */
export function deliveryGreenGrams(
  choice: Pick<DeliveryChoice, 'roastLevel' | 'bagSize' | 'bagsPerDelivery'>,
  settings: { lossModel: LossModel; overagePct: number },
): number {
  return greenNeededForRoasted(bagFillGrams(choice.bagSize) * choice.bagsPerDelivery, settings.lossModel[choice.roastLevel].defaultPct, settings.overagePct);
}
