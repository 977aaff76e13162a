import { greenNeededForRoasted } from '@shared/domain/roast-loss';
import { isOpenRoastDay, roastCalendarDays, type CalendarOverride, type RoastCalendar } from '@shared/domain/roast-schedule';
import { localDateOf } from '@shared/domain/shop-time';
import { bagFillGrams } from '@shared/domain/units';
import type { RotationPick, RotationPickResponse, RotationQuery, RotationResponse } from '@shared/schemas/rotation';
import { AppError } from '../../lib/app-error';
import type { Clock } from '../../lib/clock';
import type { SessionUser } from '../../middleware/require-role';
import type { AuditTrail } from '../audit/audit-trail';
import type { RotationRepo } from './rotation.repo';

interface DayNeed {
  subscribers: Set<string>;
  bags: number;
  roastedGrams: number;
  greenGrams: number;
}

export function createRotationService({ repo, clock, audit }: { repo: RotationRepo; clock: Clock; audit: AuditTrail }) {
  async function calendarBetween(from: string, to: string): Promise<RoastCalendar> {
    const overrides: Record<string, CalendarOverride> = {};
    for (const row of await repo.calendarOverrides(from, to)) overrides[row.date] = { open: row.open, capacityGrams: row.capacityGrams, note: row.note };
    return { overrides };
  }

  /** What the rotation subscribers need each day: bags and roasted grams, and green grams by each level's default loss. */
  async function needsBetween(from: string, to: string, settings: Awaited<ReturnType<RotationRepo['shopSettings']>>) {
    const needs = new Map<string, DayNeed>();
    for (const row of await repo.rotationDeliveries(from, to)) {
      const need = needs.get(row.roastDate) ?? { subscribers: new Set<string>(), bags: 0, roastedGrams: 0, greenGrams: 0 };
      const bags = row.orderBags ?? row.bagsPerDelivery;
      const roastedGrams = row.orderGrams ?? row.bagsPerDelivery * bagFillGrams(row.bagSize);
      need.subscribers.add(row.subscriptionId);
      need.bags += bags;
      need.roastedGrams += roastedGrams;
      need.greenGrams += greenNeededForRoasted(roastedGrams, settings.lossModel[row.roastLevel].defaultPct, settings.overagePct);
      needs.set(row.roastDate, need);
    }
    return needs;
  }

  return {
    /** Every open roast day between the two days, with its pick and what its rotation subscribers need. */
    async days(query: RotationQuery): Promise<RotationResponse> {
      const settings = await repo.shopSettings();
      const [calendar, picks, needs] = await Promise.all([
        calendarBetween(query.from, query.to),
        repo.picks(query.from, query.to),
        needsBetween(query.from, query.to, settings),
      ]);
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
      if (roastDate < localDateOf(clock.now(), settings.timeZone)) throw AppError.conflict('roast_day_past', 'That roast day is over.');
      if (!isOpenRoastDay(roastDate, settings, await calendarBetween(roastDate, roastDate))) {
        throw AppError.conflict('not_a_roast_day', 'The roastery does not roast that day.');
      }
      if (await repo.rotationRoasted(roastDate)) {
        throw AppError.conflict('rotation_already_roasted', "That day's Roaster's Rotation is already roasted.");
      }
      const lot = await repo.findLot(input.lotCode);
      if (!lot) throw AppError.notFound('Lot');

      const warnings: RotationPickResponse['warnings'] = [];
      if (!lot.isListed) warnings.push({ code: 'lot_not_listed', message: `${lot.name} is not listed in Green Lots.` });
      const greenGrams = (await needsBetween(roastDate, roastDate, settings)).get(roastDate)?.greenGrams ?? 0;
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
