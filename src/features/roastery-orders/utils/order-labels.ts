import type { OrderKind, OrderStatus } from '@shared/domain/vocabulary';
import type { OrderDetail, OrderSort } from '@shared/schemas/orders';
import type { BadgeTone } from '@/components/ui/badge';

/** What the team reads for each order status: where the order stands in the roastery's work. */
export const staffStatusLabels: Record<OrderStatus, { label: string; tone: BadgeTone }> = {
  pending_payment: { label: 'Awaiting payment', tone: 'neutral' },
  paid: { label: 'Paid', tone: 'ok' },
  held: { label: 'On hold', tone: 'alert' },
  roasted: { label: 'Roasted', tone: 'ok' },
  packed: { label: 'Packed', tone: 'ok' },
  shipped: { label: 'Shipped', tone: 'neutral' },
  cancelled: { label: 'Cancelled', tone: 'alert' },
  refunded: { label: 'Refunded', tone: 'neutral' },
};

export const orderKindLabels: Record<OrderKind, string> = {
  green: 'Green coffee',
  roasted: 'Roasted coffee',
};

export const orderSortLabels: Record<OrderSort, string> = {
  newest: 'Newest first',
  oldest: 'Oldest first',
  'total-high': 'Total, highest first',
  'total-low': 'Total, lowest first',
  'roast-date-soonest': 'Roast date, soonest first',
  'roast-date-latest': 'Roast date, latest first',
  status: 'Status, awaiting payment first',
};

/** The order's money in one phrase: unpaid, paid, or how much went back. */
export function paymentState(
  order: Pick<OrderDetail, 'status' | 'paidAt' | 'refundedCents' | 'totalCents'>,
): 'unpaid' | 'paid' | 'partly-refunded' | 'refunded' | 'cancelled-unpaid' {
  if (order.paidAt === null) return order.status === 'cancelled' ? 'cancelled-unpaid' : 'unpaid';
  if (order.refundedCents >= order.totalCents) return 'refunded';
  if (order.refundedCents > 0) return 'partly-refunded';
  return 'paid';
}
