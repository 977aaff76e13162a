import type { OrderStatus } from '@shared/domain/vocabulary';
import type { BadgeTone } from '@/components/ui/badge';

/** What a customer reads for each order status, and how it is shown. */
export const orderStatusLabels: Record<OrderStatus, { label: string; tone: BadgeTone }> = {
  pending_payment: { label: 'Awaiting payment', tone: 'neutral' },
  paid: { label: 'Paid', tone: 'ok' },
  held: { label: 'On hold', tone: 'alert' },
  roasted: { label: 'Roasted', tone: 'ok' },
  packed: { label: 'Packed', tone: 'ok' },
  shipped: { label: 'Shipped', tone: 'ok' },
  cancelled: { label: 'Cancelled', tone: 'alert' },
  refunded: { label: 'Refunded', tone: 'neutral' },
};
