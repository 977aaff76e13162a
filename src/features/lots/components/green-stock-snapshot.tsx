import type { LotSummary } from '@shared/schemas/lots';
import { formatGrams } from '@/lib/format';

/** A count of green stock across all lots, for the top of the Roastery. */
export function GreenStockSnapshot({ lots }: { lots: LotSummary[] }) {
  const outOfStock = lots.filter((lot) => lot.stockGrams <= 0).length;
  const totalGrams = lots.reduce((sum, lot) => sum + Math.max(lot.stockGrams, 0), 0);

  const figures = [
    { label: 'Lots listed', value: String(lots.length) },
    { label: 'In stock', value: String(lots.length - outOfStock) },
    { label: 'Out of stock', value: String(outOfStock) },
    { label: 'Green coffee on hand', value: formatGrams(totalGrams) },
  ];

  return (
    <dl className="grid grid-cols-2 gap-3 lg:grid-cols-4">
      {figures.map((figure) => (
        <div key={figure.label} className="rounded-card border border-rule bg-sheet p-4">
          <dt className="text-small text-ink-muted">{figure.label}</dt>
          <dd className="mt-1 font-heading text-h2 font-semibold">{figure.value}</dd>
        </div>
      ))}
    </dl>
  );
}
