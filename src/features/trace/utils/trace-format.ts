import type { OrderStatus } from '@shared/domain/vocabulary';

const grams = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const shortDate = new Intl.DateTimeFormat('en-US', { month: 'short', day: 'numeric', year: 'numeric', timeZone: 'UTC' });

/** 4635 → "4,635 g": a recall counts to the gram. */
export function formatTraceGrams(value: number): string {
  return `${grams.format(value)} g`;
}

/** "2026-12-03" → "Dec 3, 2026"; null → "—". */
export function formatTraceDay(date: string | null): string {
  return date ? shortDate.format(new Date(`${date}T00:00:00Z`)) : '—';
}

export const traceStatusLabels: Record<OrderStatus, string> = {
  pending_payment: 'Awaiting payment',
  paid: 'Paid',
  held: 'On hold',
  roasted: 'Roasted',
  packed: 'Packed',
  shipped: 'Shipped',
  cancelled: 'Cancelled',
  refunded: 'Refunded',
};

export function shortOrderId(orderId: string): string {
  return orderId.slice(0, 8).toUpperCase();
}
