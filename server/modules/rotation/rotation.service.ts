import { greenNeededForRoasted } from '@shared/domain/roast-loss';
import { planDeliveries } from '@shared/domain/delivery-plan';
import { isOpenRoastDay, roastCalendarDays, SEARCH_HORIZON_DAYS, type RoastCalendar } from '@shared/domain/roast-schedule';
import { addDays, daysBetween, localDateOf } from '@shared/domain/shop-time';
import type { DeliveryStatus, RoastLevel } from '@shared/domain/vocabulary';
import { bagFillGrams } from '@shared/domain/units';
import type { RotationPick, RotationPickResponse, RotationQuery, RotationResponse } from '@shared/schemas/rotation';
import { AppError } from '../../lib/app-error';
import type { Clock } from '../../lib/clock';
import type { SessionUser } from '../../middleware/require-role';
import type { AuditTrail } from '../audit';
import type { RotationRepo } from './rotation.repo';
import { choiceOf, keptDeliveryOf } from '../subscriptions';

interface DayNeed {
  subscribers: Set<string>;
  bags: number;
  roastedGrams: number;
  greenGrams: number;
}

/** A grid delivery's roast date can be moved by closures up to the engine's search horizon, so look back that far. */
const lookBackDays = SEARCH_HORIZON_DAYS;
const earliest = (a: string, b: string) => (a < b ? a : b);

/** Kept rows that roast on their day: not skipped, and not held for an unpaid renewal. */
const roastingStatuses: ReadonlySet<DeliveryStatus> = new Set(['scheduled', 'roasted', 'shipped']);

type Settings = Awaited<ReturnType<RotationRepo['shopSettings']>>;

export function createRotationService({ repo, clock, audit }: { repo: RotationRepo; clock: Clock; audit: AuditTrail }) {
  async function calendarFrom(from: string): Promise<RoastCalendar> {
    return { overrides: await repo.calendarOverrides(from) };
  }

  /**
   * What the rotation subscribers need each roast day between the two days: their kept delivery
   * rows (a paid one counts its order's bags, a frozen one what it froze), and the deliveries only
   * the schedule grid knows yet (the subscription's current choice), as Deliveries shows them.
   */
  async function needsBetween(from: string, to: string, settings: Settings, calendar: RoastCalendar, now: Date) {
    const today = localDateOf(now, settings.timeZone);
    const subscriptions = await repo.rotationSubscriptions();
    const keptRows = await repo.keptDeliveries(subscriptions.map((subscription) => subscription.id));
    const needs = new Map<string, DayNeed>();
    const add = (roastDate: string, subscriptionId: string, level: RoastLevel, bags: number, roastedGrams: number) => {
      const need = needs.get(roastDate) ?? { subscribers: new Set<string>(), bags: 0, roastedGrams: 0, greenGrams: 0 };
      need.subscribers.add(subscriptionId);
      need.bags += bags;
      need.roastedGrams += roastedGrams;
      need.greenGrams += greenNeededForRoasted(roastedGrams, settings.lossModel[level].defaultPct, settings.overagePct);
      needs.set(roastDate, need);
    };
    const inRange = (date: string) => date >= from && date <= to;

    for (const subscription of subscriptions) {
      const choice = choiceOf(subscription);
      const rows = keptRows.filter((row) => row.subscriptionId === subscription.id);
      const kept = rows.map(keptDeliveryOf);
      const pausedOn = (date: string) => subscription.pausedUntil !== null && date < subscription.pausedUntil;
      for (const [index, row] of rows.entries()) {
        if (!inRange(row.roastDate) || !roastingStatuses.has(row.status)) continue;
        // A paid delivery roasts whatever happened since; an unpaid one not while the subscription is paused.
        if (row.orderId === null && pausedOn(kept[index]!.nominalDate)) continue;
        const brings = kept[index]!.choice ?? choice;
        const bags = row.orderBags ?? brings.bagsPerDelivery;
        add(row.roastDate, subscription.id, brings.roastLevel, bags, row.orderGrams ?? bags * bagFillGrams(brings.bagSize));
      }
      if (to < today) continue;
      const gridLength = kept.length + Math.ceil(daysBetween(today, to) / (subscription.cadenceWeeks * 7)) + 2;
      const plan = planDeliveries(
        { ...subscription, anchorDate: subscription.anchorDate ?? kept[0]?.nominalDate ?? null, choice },
        kept,
        settings,
        calendar,
        now,
        gridLength,
      );
      for (const delivery of plan) {
        if (delivery.keptId !== null || !inRange(delivery.roastDate)) continue;
        add(delivery.roastDate, subscription.id, choice.roastLevel, choice.bagsPerDelivery, choice.bagsPerDelivery * bagFillGrams(choice.bagSize));
      }
    }
    return needs;
  }

  return {
    /** Every open roast day between the two days, with its pick and what its rotation subscribers need. */
    async days(query: RotationQuery): Promise<RotationResponse> {
      const settings = await repo.shopSettings();
      const now = clock.now();
      const calendar = await calendarFrom(earliest(query.from, addDays(localDateOf(now, settings.timeZone), -lookBackDays)));
      const [picks, needs] = await Promise.all([repo.picks(query.from, query.to), needsBetween(query.from, query.to, settings, calendar, now)]);
      const pickByDate = new Map(picks.map((pick) => [pick.roastDate, pick]));
      return {
        days: roastCalendarDays(query.from, query.to, settings, calendar)
          .filter((day) => day.open)
          .map(({ date }) => {
            const pick = pickByDate.get(date);
            const need = needs.get(date);
            return {
              roastDate: date,
              lotCode: pick?.lotCode ?? null,
              coffee: pick?.lotName ?? null,
              note: pick?.note ?? '',
              subscribers: need?.subscribers.size ?? 0,
              bags: need?.bags ?? 0,
              roastedGrams: need?.roastedGrams ?? 0,
            };
          }),
      };
    },

    /**
     * Chooses the lot the rotation subscribers get on an open roast day that is neither over nor
     * roasted. A lot that is not listed, or short of the green coffee the day needs, is saved with
     * a warning: staff may know better (a delivery on its way, a lot kept for subscribers).
     */
    async pick(user: SessionUser, roastDate: string, input: RotationPick, context: { ip?: string | null }): Promise<RotationPickResponse> {
      const settings = await repo.shopSettings();
      const now = clock.now();
      const today = localDateOf(now, settings.timeZone);
      if (roastDate < today) throw AppError.conflict('roast_day_past', 'That roast day is over.');
      const calendar = await calendarFrom(addDays(today, -lookBackDays));
      if (!isOpenRoastDay(roastDate, settings, calendar)) {
        throw AppError.conflict('not_a_roast_day', 'The roastery does not roast that day.');
      }
      if (await repo.rotationRoasted(roastDate)) {
        throw AppError.conflict('rotation_already_roasted', "That day's Roaster's Rotation is already roasted.");
      }
      const lot = await repo.findLot(input.lotCode);
      if (!lot) throw AppError.notFound('Lot');

      const warnings: RotationPickResponse['warnings'] = [];
      if (!lot.isListed) warnings.push({ code: 'lot_not_listed', message: `${lot.name} is not listed in Green Lots.` });
      const greenGrams = (await needsBetween(roastDate, roastDate, settings, calendar, now)).get(roastDate)?.greenGrams ?? 0;
      if (greenGrams > lot.stockGrams) {
        warnings.push({
          code: 'short_of_stock',
          message: `The day's rotation needs about ${greenGrams.toLocaleString('en-US')} g of green coffee; ${lot.name} has ${lot.stockGrams.toLocaleString('en-US')} g in stock.`,
        });
      }

      const { previousLotCode } = await repo.savePick({ roastDate, lotId: lot.id, note: input.note, pickedBy: user.id });
      await audit.record({ action: 'rotation.picked', actorId: user.id, ip: context.ip ?? null, detail: { roastDate, lotCode: lot.code, previousLotCode } });
      return { roastDate, lotCode: lot.code, coffee: lot.name, note: input.note, warnings };
    },
  };
}

export type RotationService = ReturnType<typeof createRotationService>;
