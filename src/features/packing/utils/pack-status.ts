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

/** Where an order stands in the day's packing, for the Pack List's counts and filter. */
export const packStages = ['to-pack', 'packed', 'shipped'] as const;
export type PackStage = (typeof packStages)[number];

export const packStageLabels: Record<PackStage, string> = { 'to-pack': 'To pack', packed: 'Packed', shipped: 'Shipped' };

/** The stage of an order; null for one that is not the packer's to handle (awaiting payment, on hold, cancelled, refunded). */
export function packStageOf(status: OrderStatus): PackStage | null {
  if (canPack(status)) return 'to-pack';
  if (status === 'packed') return 'packed';
  if (status === 'shipped') return 'shipped';
  return null;
}

/** How many orders are at each stage. */
export function packStageCounts(orders: readonly { status: OrderStatus }[]): Record<PackStage, number> {
  const counts: Record<PackStage, number> = { 'to-pack': 0, packed: 0, shipped: 0 };
  for (const order of orders) {
    const stage = packStageOf(order.status);
    if (stage) counts[stage] += 1;
  }
  return counts;
}
