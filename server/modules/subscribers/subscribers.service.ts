import { stringify } from 'csv-stringify/sync';
import { nextDelivery, planDeliveries, type KeptDelivery } from '@shared/domain/delivery-plan';
import { SEARCH_HORIZON_DAYS } from '@shared/domain/roast-schedule';
import { addDays, localDateOf } from '@shared/domain/shop-time';
import { roastersRotationName, type RoastedBagSize } from '@shared/domain/vocabulary';
import {
  rotationLotFilter,
  subscriberCsvColumns,
  type SubscriberDetail,
  type SubscriberListQuery,
  type SubscriberListResponse,
  type SubscriberSummary,
} from '@shared/schemas/subscribers';
import { AppError } from '../../lib/app-error';
import type { Clock } from '../../lib/clock';
import type { SubscriberFilters, SubscriberRow, SubscribersRepo } from './subscribers.repo';
import { choiceOf, keptDeliveryOf } from '../subscriptions';

/** Subscriptions sell roasted sizes only (a CHECK constraint keeps it so). */
const roastedSize = (size: string) => size as RoastedBagSize;

/** A closure can move a delivery up to the engine's search horizon, so the calendar is read from that far back. */
const lookBackDays = SEARCH_HORIZON_DAYS;

const summaryOf = (row: SubscriberRow, nextRoastDate: string | null): SubscriberSummary => ({
  id: row.id,
  customerName: row.customerName,
  email: row.email,
  status: row.status,
  coffee: row.lotName ?? roastersRotationName,
  lotCode: row.lotCode,
  roastLevel: row.roastLevel,
  bagSize: roastedSize(row.bagSize),
  bagsPerDelivery: row.bagsPerDelivery,
  grind: row.grind,
  brewMethod: row.brewMethod,
  cadenceWeeks: row.cadenceWeeks,
  priceCents: row.priceCents,
  nextRoastDate,
  createdAt: row.createdAt.toISOString(),
});

/** A spreadsheet runs a cell starting with = + - @ (or a tab or return) as a formula; a leading ' keeps it text. */
function spreadsheetSafe(text: string | null): string {
  if (text === null) return '';
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

export function createSubscribersService({ repo, clock }: { repo: SubscribersRepo; clock: Clock }) {
  /** Each subscription's next roast date as Deliveries shows it: its kept rows laid over the schedule grid. */
  async function nextRoastDates(rows: readonly SubscriberRow[]): Promise<Map<string, string | null>> {
    const now = clock.now();
    const settings = await repo.shopSettings();
    const overrides = await repo.calendarOverrides(addDays(localDateOf(now, settings.timeZone), -lookBackDays));
    const keptBySubscription = new Map<string, KeptDelivery[]>();
    for (const row of await repo.keptDeliveries(rows.map((subscription) => subscription.id))) {
      const kept = keptBySubscription.get(row.subscriptionId) ?? [];
      kept.push(keptDeliveryOf(row));
      keptBySubscription.set(row.subscriptionId, kept);
    }
    return new Map(
      rows.map((row) => {
        const kept = keptBySubscription.get(row.id) ?? [];
        const plan = planDeliveries(
          { ...row, anchorDate: row.anchorDate ?? kept[0]?.nominalDate ?? null, choice: choiceOf(row) },
          kept,
          settings,
          { overrides },
          now,
          kept.length + 3,
        );
        return [row.id, nextDelivery(plan)?.roastDate ?? null];
      }),
    );
  }

  /** Every matching subscription with its next roast date, in the asked order. */
  async function matching(query: SubscriberListQuery): Promise<SubscriberSummary[]> {
    const filters: SubscriberFilters = {
      status: query.status,
      level: query.level,
      cadenceWeeks: query.cadence,
      lot: query.lot === undefined ? undefined : query.lot === rotationLotFilter ? { rotation: true } : { code: query.lot },
      q: query.q || undefined,
      sort: query.sort === 'next-roast' ? 'newest' : query.sort,
    };
    const rows = await repo.list(filters);
    const next = await nextRoastDates(rows);
    const summaries = rows.map((row) => summaryOf(row, next.get(row.id) ?? null));
    // The date comes from the delivery plan, not a column, so this order is kept here; none sorts last.
    if (query.sort === 'next-roast') summaries.sort((a, b) => (a.nextRoastDate ?? '9999-12-31').localeCompare(b.nextRoastDate ?? '9999-12-31'));
    return summaries;
  }

  return {
    async list(query: SubscriberListQuery): Promise<SubscriberListResponse> {
      const all = await matching(query);
      const start = (query.page - 1) * query.pageSize;
      return { items: all.slice(start, start + query.pageSize), total: all.length, page: query.page, pageSize: query.pageSize };
    },

    /** Every subscription matching the filters (all pages), one CSV row each, columns as `subscriberCsvColumns`. */
    async csv(query: SubscriberListQuery): Promise<string> {
      return stringify(
        (await matching(query)).map((row) => ({
          subscription_id: row.id,
          created_at: row.createdAt,
          status: row.status,
          customer_name: spreadsheetSafe(row.customerName),
          customer_email: spreadsheetSafe(row.email),
          coffee: spreadsheetSafe(row.coffee),
          lot_code: spreadsheetSafe(row.lotCode),
          roast_level: row.roastLevel,
          bag_size: row.bagSize,
          bags_per_delivery: row.bagsPerDelivery,
          grind: row.grind,
          brew_method: row.brewMethod,
          cadence_weeks: row.cadenceWeeks,
          price_cents: row.priceCents,
          next_roast_date: row.nextRoastDate ?? '',
        })),
        { header: true, columns: [...subscriberCsvColumns] },
      );
    },

    async get(subscriptionId: string): Promise<SubscriberDetail> {
      const record = await repo.find(subscriptionId);
      if (!record) throw AppError.notFound('Subscription');
      const { subscription } = record;
      const next = await nextRoastDates([subscription]);
      const { customerName, email, ...summary } = summaryOf(subscription, next.get(subscription.id) ?? null);
      const toOrder = (order: (typeof record.orders)[number]) => ({
        id: order.id,
        status: order.status,
        totalCents: order.totalCents,
        placedAt: order.placedAt.toISOString(),
        paidAt: order.paidAt?.toISOString() ?? null,
        roastDate: order.roastDate,
        shipDate: order.shipDate,
        carrier: order.carrier,
        trackingNumber: order.trackingNumber,
      });
      const ordersById = new Map(record.orders.map((order) => [order.id, order]));
      const rotation = subscription.lotCode === null;
      return {
        ...summary,
        customer: { id: subscription.customerId, name: customerName, email },
        currency: subscription.currency,
        pausedUntil: subscription.pausedUntil,
        cancelAtPeriodEnd: subscription.cancelAtPeriodEnd,
        currentPeriodEnd: subscription.currentPeriodEnd?.toISOString() ?? null,
        cancelledAt: subscription.cancelledAt?.toISOString() ?? null,
        shippingAddress: { ...subscription.shippingAddress, line2: subscription.shippingAddress.line2 ?? null },
        deliveries: record.deliveries.map((delivery) => {
          const order = delivery.orderId ? ordersById.get(delivery.orderId) : undefined;
          return {
            id: delivery.id,
            sequence: delivery.sequence,
            roastDate: delivery.roastDate,
            shipDate: delivery.shipDate,
            readyFrom: delivery.readyFrom,
            bestBefore: delivery.bestBefore,
            status: delivery.status,
            lotCode: rotation ? delivery.pickedLotCode : subscription.lotCode,
            coffee: rotation ? delivery.pickedLotName : subscription.lotName,
            order: order ? toOrder(order) : null,
          };
        }),
        orders: record.orders.map((order) => ({ ...toOrder(order), bags: order.bags })),
      };
    },
  };
}

export type SubscribersService = ReturnType<typeof createSubscribersService>;
