import type { OrderKind, OrderStatus } from '@shared/domain/vocabulary';
import type { BadgeTone } from '@/components/ui/badge';

/** How the packer reads each order's state on the Pack List (the same words the customer sees). */
export const packStatusLabels: Record<OrderStatus, { label: string; tone: BadgeTone }> = {
  pending_payment: { label: 'Awaiting payment', tone: 'neutral' },
  paid: { label: 'Paid, not roasted yet', tone: 'neutral' },
  held: { label: 'On hold', tone: 'alert' },
  roasted: { label: 'Roasted', tone: 'neutral' },
  packed: { label: 'Packed', tone: 'ok' },
  shipped: { label: 'Shipped', tone: 'ok' },
  cancelled: { label: 'Cancelled', tone: 'alert' },
  refunded: { label: 'Refunded', tone: 'neutral' },
};

/** The state as the packer reads it: green coffee is never roasted, so a paid green order is simply ready to pack. */
export function packStatusOf(order: { status: OrderStatus; kind: OrderKind }): { label: string; tone: BadgeTone } {
  if (order.kind === 'green' && order.status === 'paid') return { label: 'Paid, ready to pack', tone: 'neutral' };
  return packStatusLabels[order.status];
}

/** Orders the packer can still mark packed. */
export function canPack(status: OrderStatus): boolean {
  return status === 'paid' || status === 'roasted';
}
