import { roastCalendarDays, ScheduleError, type CalendarOverride } from '@shared/domain/roast-schedule';
import { weekdayOf, type IsoDate } from '@shared/domain/shop-time';
import type { CalendarDay, CalendarDayUpdate, CalendarDayUpdateResponse, CalendarQuery, CalendarResponse } from '@shared/schemas/roastery';
import type { ShopSettings } from '@shared/schemas/settings';
import { AppError } from '../../lib/app-error';
import { lossHistoryOf, planClosureMoves, plannedGreenByDay, planShipMoves, type ClosurePlan, type ShipMove } from './calendar-planning';
import {
  overrideOf,
  type CalendarContext,
  type CalendarRepo,
  type MovingCoffee,
  type OverrideRow,
  type RedatingParcels,
  type RoastedOnDay,
} from './calendar.repo';

function calendarOf(context: CalendarContext) {
  const overrides: Record<IsoDate, CalendarOverride> = Object.fromEntries(context.overrides.map((row) => [row.date, overrideOf(row)]));
  const plannedGreenGrams = plannedGreenByDay(context.groups, context.settings, lossHistoryOf(context.lossHistory));
  return { overrides, plannedGreenGrams };
}

const nothingRoasted: RoastedOnDay = { batches: 0, greenGrams: 0, roastedGrams: 0 };

interface DayFigures {
  orderCounts: ReadonlyMap<IsoDate, number>;
  roasted: ReadonlyMap<IsoDate, RoastedOnDay>;
}

function daysOf(from: IsoDate, to: IsoDate, context: CalendarContext, figures: DayFigures): CalendarDay[] {
  const calendar = calendarOf(context);
  return roastCalendarDays(from, to, context.settings, calendar).map((day) => ({
    ...day,
    ordersCount: figures.orderCounts.get(day.date) ?? 0,
    roasted: figures.roasted.get(day.date) ?? nothingRoasted,
    overridden: Object.hasOwn(calendar.overrides, day.date),
  }));
}

/** A row that says only what the weekly settings already say is no override at all. */
function isWeeklyDefault(override: OverrideRow, settings: ShopSettings): boolean {
  return (
    override.open === settings.roastWeekdays.includes(weekdayOf(override.date)) &&
    override.shipOpen === null &&
    override.capacityGrams === null &&
    override.note === ''
  );
}

function planMoves({ closedDate, orders, deliveries, context }: MovingCoffee): ClosurePlan {
  const { overrides, plannedGreenGrams } = calendarOf(context);
  try {
    return planClosureMoves({ closedDate, orders, deliveries, settings: context.settings, overrides, plannedGreenGrams });
  } catch (error) {
    if (error instanceof ScheduleError) {
      throw new AppError(409, 'no_roast_day', `${error.message} Open another roast day or raise a day's capacity first.`, {
        open: 'no later roast day can take this day\u2019s orders',
      });
    }
    throw error;
  }
}

function planShip({ date, parcels, context }: RedatingParcels): ShipMove[] {
  const { overrides } = calendarOf(context);
  try {
    return planShipMoves(date, parcels, context.settings, overrides);
  } catch (error) {
    if (error instanceof ScheduleError) {
      throw new AppError(409, 'no_ship_day', `${error.message} Open another ship day first.`, {
        shipOpen: 'no later ship day can take this day\u2019s parcels',
      });
    }
    throw error;
  }
}

export function createCalendarService(repo: CalendarRepo) {
  return {
    async calendar({ from, to }: CalendarQuery): Promise<CalendarResponse> {
      const [context, orderCounts, roasted] = await Promise.all([repo.context(from, to), repo.orderCounts(from, to), repo.roastedByDay(from, to)]);
      return { days: daysOf(from, to, context, { orderCounts, roasted }) };
    },

    /**
     * Opens, closes or re-sizes a day, for roasting and for shipping apart. Closing it to roasting
     * moves its coffee to later roast days and tells each customer; changing its shipping re-dates
     * the parcels that could ship on it.
     */
    async updateDay(date: IsoDate, update: CalendarDayUpdate): Promise<CalendarDayUpdateResponse> {
      const result = await repo.updateDay(date, update, isWeeklyDefault, planMoves, planShip);
      const [orderCounts, roasted] = await Promise.all([repo.orderCounts(date, date), repo.roastedByDay(date, date)]);
      const [day] = daysOf(date, date, result.context, { orderCounts, roasted });
      if (!day) throw new Error(`the calendar has no entry for ${date}`);
      return {
        ...day,
        moved: result.plan.orders.map((move) => ({ orderId: move.id, from: date, to: move.dates.roastDate })),
        movedDeliveries: result.plan.deliveries.map((move) => ({
          deliveryId: move.id,
          subscriptionId: move.subscriptionId,
          from: date,
          to: move.dates.roastDate,
        })),
        shipMoved: result.shipMoves.map((move) => ({ orderId: move.orderId, deliveryId: move.deliveryId, from: move.from, to: move.shipDate })),
      };
    },
  };
}

export type CalendarService = ReturnType<typeof createCalendarService>;
