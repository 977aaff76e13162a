import { buildRoastList, type LotLossHistory, type RoastOrderLine } from '@shared/domain/roast-list';
import { greenNeededForRoasted } from '@shared/domain/roast-loss';
import {
  dayCapacityGrams,
  datesForLines,
  datesForRoastDate,
  greenOrderDates,
  isOpenRoastDay,
  ScheduleError,
  SEARCH_HORIZON_DAYS,
  type CalendarOverride,
  type CoffeeForRest,
  type RoastDates,
} from '@shared/domain/roast-schedule';
import { addDays, type IsoDate } from '@shared/domain/shop-time';
import { roastersRotationName, type BrewMethod, type RoastLevel } from '@shared/domain/vocabulary';
import type { EmailPayloads } from '../../../emails/index';
import type { ShopSettings } from '@shared/schemas/settings';

/** A roast day's bags summed by lot (null: Roaster's Rotation not yet picked), level and fill weight. */
export interface PlannedGroup {
  roastDate: IsoDate;
  lotCode: string | null;
  roastLevel: RoastLevel;
  fillGrams: number;
  bags: number;
}

export type { LotLossRow as LossHistoryRow } from '@shared/domain/roast-list';
export { lotLossHistoryOf as lossHistoryOf } from '@shared/domain/roast-list';

/**
 * Green grams each day's orders need, as the Roast List plans them. Unpicked Roaster's Rotation
 * bags count too (at the level's default loss): they will roast that day whatever lot is picked.
 */
export function plannedGreenByDay(groups: readonly PlannedGroup[], settings: ShopSettings, lotLoss: LotLossHistory): Record<IsoDate, number> {
  const linesByDay = new Map<IsoDate, RoastOrderLine[]>();
  for (const group of groups) {
    const line = { lotCode: group.lotCode ?? roastersRotationName, roastLevel: group.roastLevel, fillGrams: group.fillGrams, quantity: group.bags };
    const lines = linesByDay.get(group.roastDate);
    if (lines) lines.push(line);
    else linesByDay.set(group.roastDate, [line]);
  }
  const planned: Record<IsoDate, number> = {};
  for (const [date, lines] of linesByDay) {
    planned[date] = buildRoastList({ date, lines, settings, lotLoss, stockGrams: {}, dayCapacityGrams: settings.dayCapacityGrams }).totals.greenGrams;
  }
  return planned;
}

export interface OrderOnClosedDay {
  id: string;
  customer: { email: string; name: string };
  paidAt: Date | null;
  deliveryId: string | null;
  lines: { coffee: string; roastLevel: RoastLevel; brewMethod: BrewMethod; fillGrams: number; quantity: number }[];
}

export interface DeliveryOnClosedDay {
  id: string;
  subscriptionId: string;
  customer: { email: string; name: string };
  coffee: string;
  roastLevel: RoastLevel;
  brewMethod: BrewMethod;
}

export interface ClosureInput {
  closedDate: IsoDate;
  orders: readonly OrderOnClosedDay[];
  deliveries: readonly DeliveryOnClosedDay[];
  settings: ShopSettings;
  /** Every override from the closed day on, the closure included. */
  overrides: Readonly<Record<IsoDate, CalendarOverride>>;
  /** Green grams already planned on the days after the closed one. */
  plannedGreenGrams: Readonly<Record<IsoDate, number>>;
}

export type NewDates = Pick<RoastDates, 'roastDate' | 'shipDate' | 'readyFrom' | 'bestBefore'>;

export interface ClosurePlan {
  orders: { id: string; deliveryId: string | null; dates: NewDates }[];
  deliveries: { id: string; subscriptionId: string; dates: NewDates }[];
  emails: { to: string; dedupeKey: string; payload: EmailPayloads['roast-day-moved'] }[];
}

/** The green an order adds to a day, each line at its level's default loss. */
function orderGreenGrams(order: OrderOnClosedDay, settings: ShopSettings): number {
  return order.lines.reduce(
    (total, line) => total + greenNeededForRoasted(line.fillGrams * line.quantity, settings.lossModel[line.roastLevel].defaultPct, settings.overagePct),
    0,
  );
}

function firstRoastDayAfter(date: IsoDate, accept: (day: IsoDate) => boolean): IsoDate {
  for (let offset = 1; offset <= SEARCH_HORIZON_DAYS; offset += 1) {
    const day = addDays(date, offset);
    if (accept(day)) return day;
  }
  throw new ScheduleError('no_roast_day', `No open roast day within ${SEARCH_HORIZON_DAYS} days after ${date} can take these orders.`);
}

/** The dates an order's bags get on a roast day: it is ready, and ships, as its slowest-resting bag does. */
function orderDates(roastDate: IsoDate, lines: OrderOnClosedDay['lines'], settings: ShopSettings, overrides: ClosureInput['overrides']): NewDates {
  const { shipDate, readyFrom, bestBefore } = datesForLines(roastDate, lines, settings, { overrides });
  return { roastDate, shipDate, readyFrom, bestBefore };
}

/**
 * Where a closed day's coffee goes. Orders move, in the order they were paid, to the next open
 * roast day with capacity left for them; subscription deliveries not yet paid move to the next open
 * roast day (they are booked ahead, not held back by capacity). Each customer gets one e-mail
 * listing everything of theirs that moved. Throws a ScheduleError when no day can take an order.
 */
export function planClosureMoves(input: ClosureInput): ClosurePlan {
  const { closedDate, settings, overrides } = input;
  const planned: Record<IsoDate, number> = { ...input.plannedGreenGrams };
  const calendar = { overrides };
  const plan: ClosurePlan = { orders: [], deliveries: [], emails: [] };
  const itemsByCustomer = new Map<string, { name: string; firstId: string; items: EmailPayloads['roast-day-moved']['items'] }>();
  const tell = (customer: { email: string; name: string }, id: string, item: EmailPayloads['roast-day-moved']['items'][number]) => {
    const entry = itemsByCustomer.get(customer.email);
    if (entry) entry.items.push(item);
    else itemsByCustomer.set(customer.email, { name: customer.name, firstId: id, items: [item] });
  };

  const byPayment = [...input.orders].sort((a, b) => (a.paidAt?.getTime() ?? Infinity) - (b.paidAt?.getTime() ?? Infinity) || (a.id < b.id ? -1 : 1));
  for (const order of byPayment) {
    const green = orderGreenGrams(order, settings);
    const roastDate = firstRoastDayAfter(
      closedDate,
      (day) => isOpenRoastDay(day, settings, calendar) && (planned[day] ?? 0) + green <= dayCapacityGrams(day, settings, calendar),
    );
    planned[roastDate] = (planned[roastDate] ?? 0) + green;
    const dates = orderDates(roastDate, order.lines, settings, overrides);
    plan.orders.push({ id: order.id, deliveryId: order.deliveryId, dates });
    const coffee = [...new Set(order.lines.map((line) => line.coffee))].join(', ');
    tell(order.customer, order.id, { orderId: order.id, coffee, ...dates });
  }

  for (const delivery of input.deliveries) {
    const roastDate = firstRoastDayAfter(closedDate, (day) => isOpenRoastDay(day, settings, calendar));
    const { shipDate, readyFrom, bestBefore } = datesForRoastDate(roastDate, delivery, settings, calendar);
    const dates = { roastDate, shipDate, readyFrom, bestBefore };
    plan.deliveries.push({ id: delivery.id, subscriptionId: delivery.subscriptionId, dates });
    tell(delivery.customer, delivery.id, { coffee: delivery.coffee, ...dates });
  }

  for (const [email, { name, firstId, items }] of itemsByCustomer) {
    plan.emails.push({
      to: email,
      // One message per customer and closure; the first thing moved and its new day name it.
      dedupeKey: `roast-day-moved:${firstId}:${items[0]?.roastDate ?? closedDate}`,
      payload: { name, closedDate, items },
    });
  }
  return plan;
}

/** A parcel not yet packed whose ship date a change of the ship calendar may move. */
export type ParcelToRedate =
  | { kind: 'roasted'; orderId: string | null; deliveryId: string | null; roastDate: IsoDate; shipDate: IsoDate; lines: CoffeeForRest[] }
  | { kind: 'green'; orderId: string; paidAt: Date; shipDate: IsoDate };

export interface ShipMove {
  orderId: string | null;
  deliveryId: string | null;
  from: IsoDate;
  shipDate: IsoDate;
}

/**
 * New ship dates after shipping on `date` closes or opens: each parcel's ship date again as the
 * schedule gives it with the new calendar. Only parcels that shipped on the day (a closure moves
 * them) or now ship on it (an opening brings them forward) move; others keep their dates.
 */
export function planShipMoves(date: IsoDate, parcels: readonly ParcelToRedate[], settings: ShopSettings, overrides: ClosureInput['overrides']): ShipMove[] {
  const calendar = { overrides };
  const moves: ShipMove[] = [];
  for (const parcel of parcels) {
    const shipDate =
      parcel.kind === 'green'
        ? greenOrderDates(parcel.paidAt, settings, calendar).shipDate
        : datesForLines(parcel.roastDate, parcel.lines, settings, calendar).shipDate;
    if (shipDate === parcel.shipDate || (parcel.shipDate !== date && shipDate !== date)) continue;
    moves.push({
      orderId: parcel.orderId,
      deliveryId: parcel.kind === 'roasted' ? parcel.deliveryId : null,
      from: parcel.shipDate,
      shipDate,
    });
  }
  return moves;
}
