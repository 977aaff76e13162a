import type { StockMovementReason } from '@shared/domain/vocabulary';
import type { stockAdjustmentReasons } from '@shared/schemas/lots';

type AdjustmentReason = (typeof stockAdjustmentReasons)[number];

export const movementReasonLabels: Record<StockMovementReason, string> = {
  arrival: 'Arrival',
  sale: 'Sale',
  roast: 'Roast',
  sample: 'Sample',
  loss: 'Loss',
  count: 'Count correction',
  refund: 'Refund',
};

/** How each reason staff may give moves stock, said where the amount is typed. */
export const adjustmentReasonHints: Record<AdjustmentReason, string> = {
  arrival: 'An arrival adds stock: enter the weight received.',
  sample: 'A sample takes stock away: enter a negative amount, e.g. -250.',
  loss: 'A loss takes stock away: enter a negative amount, e.g. -500.',
  count: 'A count correction goes either way: positive adds, negative takes away.',
};
