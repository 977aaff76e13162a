import type { OrderStatus } from '@shared/domain/vocabulary';
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

/** Orders the packer can still mark packed. */
export function canPack(status: OrderStatus): boolean {
  return status === 'paid' || status === 'roasted';
}
