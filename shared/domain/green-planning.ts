/**
 * Green planning: the green coffee each lot needs over the coming weeks, the week its stock runs
 * out, and the last day to reorder it given the supplier's lead time.
 *
 * - `subscriptionRoastDemand(subscriptions, settings, calendar, now, until)`: every subscription's
 *   upcoming deliveries as Deliveries shows them (the grid, skips, a pause, closures), less those a
 *   paid order already carries, as roasted bags by roast day. Roaster's Rotation deliveries take the
 *   day's pick, or stay unpicked.
 * - `planGreen(input)`: roasted bags by roast day (paid orders still to roast and the deliveries
 *   above) → green grams per day through the Roast List's own rule (loss model, overage, the lot's
 *   measured loss) → per lot and week, plus the recent pace of green sales → stock left after each
 *   week → the first day the stock cannot cover (run-out) → run-out − lead time (reorder by).
 *
 * Weeks are seven days from today. Green sales follow the window's average daily pace, counted
 * cumulatively and rounded up so the plan never under-counts. A reorder-by day already past is
 * reported as it is, and `reorderNow` says the order is due.
 */
import { planDeliveries, type KeptDelivery, type SubscriptionForPlan } from './delivery-plan';
import { ceilDiv } from './integer-math';
import { buildRoastList, type LotLossHistory, type RoastListSettings, type RoastOrderLine } from './roast-list';
import { firstGridDateStillAhead, SEARCH_HORIZON_DAYS, type RoastCalendar, type ScheduleSettings } from './roast-schedule';
import { addDays, daysBetween, localDateOf, type IsoDate } from './shop-time';
import { coverWindowDays } from './stock-cover';
import { bagFillGrams } from './units';
import { roastersRotationName, type RoastLevel } from './vocabulary';

/** Roasted bags of one lot (null: a Roaster's Rotation day not yet picked) and level on a roast day. */
export interface RoastDemand {
  roastDate: IsoDate;
  lotCode: string | null;
  roastLevel: RoastLevel;
  fillGrams: number;
  bags: number;
}

export interface SubscriptionForPlanning extends SubscriptionForPlan {
  /** Null: Roaster's Rotation. */
  lotCode: string | null;
  kept: readonly KeptDelivery[];
}

/**
 * The earliest grid date whose delivery can still roast on or after `today`: the day after the
 * last open roast day before it. A delivery only moves later, to the first open roast day on or
 * after its grid date, so one due on or before that roast day was roasted (or skipped) in the past,
 * and kept rows due before this date can be left unread when planning from today.
 */
export function earliestNominalDateStillAhead(today: IsoDate, settings: ScheduleSettings, calendar: RoastCalendar): IsoDate {
  return firstGridDateStillAhead(today, settings, calendar) ?? addDays(today, -SEARCH_HORIZON_DAYS);
}

/**
 * Deliveries still to be paid and roasted, by roast day, from today through `until`. A kept row
 * with an order is left to the order; a held one (an unpaid renewal) waits for its payment.
 */
export function subscriptionRoastDemand(
  subscriptions: readonly SubscriptionForPlanning[],
  settings: ScheduleSettings,
  calendar: RoastCalendar,
  now: Date,
  until: IsoDate,
  rotationPicks: Readonly<Record<IsoDate, string>> = {},
): RoastDemand[] {
  const today = localDateOf(now, settings.timeZone);
  const demand: RoastDemand[] = [];
  for (const subscription of subscriptions) {
    const count = subscription.kept.length + Math.ceil((daysBetween(today, until) + 1) / (subscription.cadenceWeeks * 7)) + 2;
    for (const delivery of planDeliveries(subscription, subscription.kept, settings, calendar, now, count)) {
      if (delivery.status !== 'scheduled' || delivery.orderId !== null) continue;
      if (delivery.roastDate < today || delivery.roastDate > until) continue;
      demand.push({
        roastDate: delivery.roastDate,
        lotCode: subscription.lotCode ?? rotationPicks[delivery.roastDate] ?? null,
        roastLevel: delivery.choice.roastLevel,
        fillGrams: bagFillGrams(delivery.choice.bagSize),
        bags: delivery.choice.bagsPerDelivery,
      });
    }
  }
  return demand;
}

export interface PlanningLot {
  code: string;
  stockGrams: number;
  /** Days from placing an order with the supplier to the green coffee on the shelf. */
  leadTimeDays: number;
  /** Green grams sold to customers over the last `runRateWindowDays` days. */
  greenSoldGrams: number;
}

export interface GreenPlanInput {
  today: IsoDate;
  weeks: number;
  lots: readonly PlanningLot[];
  demand: readonly RoastDemand[];
  settings: RoastListSettings;
  lotLoss?: LotLossHistory;
  runRateWindowDays?: number;
}

export interface PlanningWeek {
  /** First day of the week (today for the first one). */
  start: IsoDate;
  /** Green grams the week's roasting takes. */
  roastGreenGrams: number;
  /** Green grams the week's sales take at the recent pace. */
  salesGreenGrams: number;
  needGrams: number;
  /** Stock left at the week's end; negative once it has run out. */
  stockAfterGrams: number;
}

export interface LotPlan {
  lotCode: string;
  stockGrams: number;
  leadTimeDays: number;
  weeks: PlanningWeek[];
  needGrams: number;
  /** The first day the stock cannot cover; null when it lasts the whole plan. */
  runOutDate: IsoDate | null;
  /** The start of the week holding the run-out day. */
  runOutWeek: IsoDate | null;
  /** Run-out day less the lead time: the last day an order arrives in time. */
  reorderBy: IsoDate | null;
  reorderNow: boolean;
}

export interface GreenPlan {
  from: IsoDate;
  weeks: number;
  lots: LotPlan[];
  /** Green grams per week for Roaster's Rotation days with no pick yet (no lot to charge them to). */
  unpickedRotationGreenGrams: number[];
}

/** Green grams each lot's roasting takes per day, as the Roast List would plan each day. */
function roastGreenByLotAndDay(input: GreenPlanInput, unpickedCode: string): Map<string, Map<IsoDate, number>> {
  const linesByDay = new Map<IsoDate, RoastOrderLine[]>();
  for (const demand of input.demand) {
    const line: RoastOrderLine = { lotCode: demand.lotCode ?? unpickedCode, roastLevel: demand.roastLevel, fillGrams: demand.fillGrams, quantity: demand.bags };
    const lines = linesByDay.get(demand.roastDate);
    if (lines) lines.push(line);
    else linesByDay.set(demand.roastDate, [line]);
  }
  const byLot = new Map<string, Map<IsoDate, number>>();
  for (const [date, lines] of linesByDay) {
    const list = buildRoastList({ date, lines, settings: input.settings, lotLoss: input.lotLoss, stockGrams: {}, dayCapacityGrams: Number.MAX_SAFE_INTEGER });
    for (const line of list.lines) {
      const days = byLot.get(line.lotCode) ?? new Map<IsoDate, number>();
      days.set(date, (days.get(date) ?? 0) + line.greenGrams);
      byLot.set(line.lotCode, days);
    }
  }
  return byLot;
}

export function planGreen(input: GreenPlanInput): GreenPlan {
  const { today, weeks } = input;
  if (!Number.isSafeInteger(weeks) || weeks < 1) throw new RangeError(`weeks must be a whole number ≥ 1, got ${weeks}`);
  const window = input.runRateWindowDays ?? coverWindowDays;
  const unpickedCode = roastersRotationName;
  const roastByLot = roastGreenByLotAndDay(input, unpickedCode);

  const lots = input.lots.map((lot): LotPlan => {
    const roastByDay = roastByLot.get(lot.code) ?? new Map<IsoDate, number>();
    const salesThrough = (day: number) => ceilDiv(lot.greenSoldGrams * day, window);
    const planWeeks: PlanningWeek[] = [];
    let used = 0;
    let runOutDate: IsoDate | null = null;
    for (let week = 0; week < weeks; week += 1) {
      let roastGreenGrams = 0;
      for (let day = week * 7; day < week * 7 + 7; day += 1) {
        const date = addDays(today, day);
        const roast = roastByDay.get(date) ?? 0;
        roastGreenGrams += roast;
        if (runOutDate === null && used + roast + salesThrough(day + 1) > lot.stockGrams) runOutDate = date;
        used += roast;
      }
      const salesGreenGrams = salesThrough(week * 7 + 7) - salesThrough(week * 7);
      const previous = planWeeks.at(-1)?.stockAfterGrams ?? lot.stockGrams;
      planWeeks.push({
        start: addDays(today, week * 7),
        roastGreenGrams,
        salesGreenGrams,
        needGrams: roastGreenGrams + salesGreenGrams,
        stockAfterGrams: previous - roastGreenGrams - salesGreenGrams,
      });
    }
    const runOutWeek = runOutDate === null ? null : addDays(today, Math.floor(daysBetween(today, runOutDate) / 7) * 7);
    const reorderBy = runOutDate === null ? null : addDays(runOutDate, -lot.leadTimeDays);
    return {
      lotCode: lot.code,
      stockGrams: lot.stockGrams,
      leadTimeDays: lot.leadTimeDays,
      weeks: planWeeks,
      needGrams: planWeeks.reduce((sum, week) => sum + week.needGrams, 0),
      runOutDate,
      runOutWeek,
      reorderBy,
      reorderNow: reorderBy !== null && reorderBy <= today,
    };
  });

  const unpicked = roastByLot.get(unpickedCode);
  const unpickedRotationGreenGrams = Array.from({ length: weeks }, (_, week) => {
    let grams = 0;
    for (let day = week * 7; day < week * 7 + 7; day += 1) grams += unpicked?.get(addDays(today, day)) ?? 0;
    return grams;
  });
  return { from: today, weeks, lots, unpickedRotationGreenGrams };
}
