import type { GreenStockItem } from '@shared/schemas/green-stock';
import { formatGrams } from '@/lib/format';

/** Days of cover with the pace behind it, or why there is no figure. */
export function CoverText({ item, windowDays }: { item: Pick<GreenStockItem, 'daysOfCover' | 'averageDailyUseGrams' | 'stockGrams'>; windowDays: number }) {
  if (item.daysOfCover === null) {
    return (
      <>
        No use in {windowDays} days
        <span className="block text-caption font-normal text-ink-muted">Nothing sold or roasted</span>
      </>
    );
  }
  return (
    <>
      {item.daysOfCover} {item.daysOfCover === 1 ? 'day' : 'days'}
      <span className="block text-caption font-normal text-ink-muted">at {formatGrams(item.averageDailyUseGrams)} a day</span>
    </>
  );
}
