import { stringify } from 'csv-stringify/sync';
import { arrivalDate } from '@shared/domain/roast-schedule';
import { addDays, instantAt } from '@shared/domain/shop-time';
import { orderCsvColumns, type OrderDetail, type OrderListQuery, type OrderListResponse, type OrderSummary } from '@shared/schemas/orders';
import { AppError } from '../../lib/app-error';
import { packingRoles, type SessionUser } from '../../middleware/require-role';
import type { OrderFilters, OrderRow, OrdersRepo } from './orders.repo';

/** The team reads every order (a packer too: packing starts from the order); a customer reads their own. */
const readsEveryOrder = (user: SessionUser) => packingRoles.includes(user.role);

/** What a list row and an order's detail both say. */
function basicsOf(row: OrderRow) {
  return {
    id: row.id,
    kind: row.kind,
    status: row.status,
    placedAt: row.placedAt.toISOString(),
    customer: { id: row.customerId, name: row.customerName, email: row.customerEmail },
    totalCents: row.totalCents,
    roastDate: row.roastDate,
    shipDate: row.shipDate,
  };
}

const summaryOf = (row: OrderRow): OrderSummary => ({ ...basicsOf(row), bagCount: row.bagCount });

/** A spreadsheet runs a cell starting with = + - @ (or a tab or return) as a formula; a leading ' keeps it text. */
function spreadsheetSafe(text: string | null): string {
  if (text === null) return '';
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

export function createOrdersService(repo: OrdersRepo) {
  /** The query as repo filters: customers are kept to their own orders; days become the shop's midnights. */
  async function filtersOf(user: SessionUser, query: OrderListQuery): Promise<OrderFilters> {
    const timeZone = query.from || query.to ? ((await repo.shopTimeZone()) ?? 'UTC') : 'UTC';
    return {
      ...(readsEveryOrder(user) ? {} : { userId: user.id, hideDiscarded: true }),
      text: query.q,
      status: query.status,
      kind: query.kind,
      roastDate: query.roastDate,
      placedFrom: query.from ? instantAt(query.from, '00:00', timeZone) : undefined,
      placedBefore: query.to ? instantAt(addDays(query.to, 1), '00:00', timeZone) : undefined,
      sort: query.sort,
    };
  }

  return {
    async list(user: SessionUser, query: OrderListQuery): Promise<OrderListResponse> {
      const { rows, total } = await repo.list(await filtersOf(user, query), { limit: query.pageSize, offset: (query.page - 1) * query.pageSize });
      return { items: rows.map(summaryOf), total, page: query.page, pageSize: query.pageSize };
    },

    async get(user: SessionUser, orderId: string): Promise<OrderDetail> {
      const order = await repo.find(orderId, readsEveryOrder(user) ? undefined : user.id);
      if (!order) throw AppError.notFound('Order');
      const { shippingAddress } = order;
      const expectedArrival = order.shipDate ? arrivalDate(order.shipDate, await repo.transitDays()) : null;
      return {
        ...basicsOf(order),
        items: order.items,
        subtotalCents: order.subtotalCents,
        discountCents: order.discountCents,
        discountLabel: order.discountCents > 0 ? (order.subscriptionId ? 'Subscription discount' : 'Discount') : null,
        shippingCents: order.shippingCents,
        refundedCents: order.refundedCents,
        currency: order.currency,
        shippingAddress: { ...shippingAddress, line2: shippingAddress.line2 ?? null },
        readyFrom: order.readyFrom,
        bestBefore: order.bestBefore,
        expectedArrival,
        readyOnArrival: order.readyFrom && expectedArrival ? expectedArrival >= order.readyFrom : null,
        carrier: order.carrier,
        trackingNumber: order.trackingNumber,
        paidAt: order.paidAt?.toISOString() ?? null,
        shippedAt: order.shippedAt?.toISOString() ?? null,
        cancelledAt: order.cancelledAt?.toISOString() ?? null,
        ...(readsEveryOrder(user) ? { staffNote: order.staffNote } : {}),
      };
    },

    /** Every order matching the filters (all pages), one CSV row each, columns as `orderCsvColumns`. */
    async csv(user: SessionUser, query: OrderListQuery): Promise<string> {
      const { rows } = await repo.list(await filtersOf(user, query));
      return stringify(
        rows.map((row) => ({
          order_id: row.id,
          placed_at: row.placedAt.toISOString(),
          kind: row.kind,
          status: row.status,
          customer_name: spreadsheetSafe(row.customerName),
          customer_email: spreadsheetSafe(row.customerEmail),
          bags: row.bagCount,
          subtotal_cents: row.subtotalCents,
          shipping_cents: row.shippingCents,
          total_cents: row.totalCents,
          refunded_cents: row.refundedCents,
          roast_date: row.roastDate ?? '',
          ship_date: row.shipDate ?? '',
          carrier: spreadsheetSafe(row.carrier),
          tracking_number: spreadsheetSafe(row.trackingNumber),
        })),
        { header: true, columns: [...orderCsvColumns] },
      );
    },
  };
}

export type OrdersService = ReturnType<typeof createOrdersService>;
