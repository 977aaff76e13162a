import { stringify } from 'csv-stringify/sync';
import { localDateOf } from '@shared/domain/shop-time';
import { roastersRotationName } from '@shared/domain/vocabulary';
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

const summaryOf = (row: SubscriberRow): SubscriberSummary => ({
  id: row.id,
  customerName: row.customerName,
  email: row.email,
  status: row.status,
  coffee: row.lotName ?? roastersRotationName,
  lotCode: row.lotCode,
  roastLevel: row.roastLevel,
  bagSize: row.bagSize as SubscriberSummary['bagSize'],
  bagsPerDelivery: row.bagsPerDelivery,
  grind: row.grind,
  brewMethod: row.brewMethod,
  cadenceWeeks: row.cadenceWeeks,
  priceCents: row.priceCents,
  nextRoastDate: row.nextRoastDate,
  createdAt: row.createdAt.toISOString(),
});

/** A spreadsheet runs a cell starting with = + - @ (or a tab or return) as a formula; a leading ' keeps it text. */
function spreadsheetSafe(text: string | null): string {
  if (text === null) return '';
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

export function createSubscribersService({ repo, clock }: { repo: SubscribersRepo; clock: Clock }) {
  async function today(): Promise<string> {
    return localDateOf(clock.now(), await repo.shopTimeZone());
  }

  async function filtersOf(query: SubscriberListQuery): Promise<SubscriberFilters> {
    return {
      status: query.status,
      level: query.level,
      cadenceWeeks: query.cadence,
      lot: query.lot === undefined ? undefined : query.lot === rotationLotFilter ? { rotation: true } : { code: query.lot },
      q: query.q || undefined,
      sort: query.sort,
      today: await today(),
    };
  }

  return {
    async list(query: SubscriberListQuery): Promise<SubscriberListResponse> {
      const { rows, total } = await repo.list(await filtersOf(query), { limit: query.pageSize, offset: (query.page - 1) * query.pageSize });
      return { items: rows.map(summaryOf), total, page: query.page, pageSize: query.pageSize };
    },

    /** Every subscription matching the filters (all pages), one CSV row each, columns as `subscriberCsvColumns`. */
    async csv(query: SubscriberListQuery): Promise<string> {
      const { rows } = await repo.list(await filtersOf(query));
      return stringify(
        rows.map((row) => ({
          subscription_id: row.id,
          created_at: row.createdAt.toISOString(),
          status: row.status,
          customer_name: spreadsheetSafe(row.customerName),
          customer_email: spreadsheetSafe(row.email),
          coffee: spreadsheetSafe(row.lotName ?? roastersRotationName),
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
      const record = await repo.find(subscriptionId, await today());
      if (!record) throw AppError.notFound('Subscription');
      const { subscription } = record;
      const { customerName, email, ...summary } = summaryOf(subscription);
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
      return {
        ...summary,
        customer: { id: subscription.customerId, name: customerName, email },
        currency: subscription.currency,
        pausedUntil: subscription.pausedUntil,
        currentPeriodEnd: subscription.currentPeriodEnd?.toISOString() ?? null,
        cancelledAt: subscription.cancelledAt?.toISOString() ?? null,
        shippingAddress: { ...subscription.shippingAddress, line2: subscription.shippingAddress.line2 ?? null },
        deliveries: record.deliveries.map((delivery) => {
          const order = delivery.orderId ? ordersById.get(delivery.orderId) : undefined;
          const rotation = subscription.lotCode === null;
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
