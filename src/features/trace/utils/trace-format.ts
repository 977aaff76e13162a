import type { OrderStatus } from '@shared/domain/vocabulary';
import { formatDay } from '@/lib/dates';

const grams = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });

/** 4635 → "4,635 g": a recall counts to the gram. */
export function formatTraceGrams(value: number): string {
  return `${grams.format(value)} g`;
}

/** "2026-12-03" → "Dec 3, 2026"; null → "—". */
export function formatTraceDay(date: string | null): string {
  return date ? formatDay(date) : '—';
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
