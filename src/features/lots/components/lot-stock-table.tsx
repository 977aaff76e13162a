import { Link } from 'react-router-dom';
import type { LotSummary } from '@shared/schemas/lots';
import { paths } from '@/config/paths';
import { formatGrams, formatPricePerKg } from '@/lib/format';
import { StockBadge } from './stock-badge';

/** Green coffee on hand per lot, lowest first, so what runs out soonest is read first. */
export function LotStockTable({ lots }: { lots: LotSummary[] }) {
  const byStock = [...lots].sort((a, b) => a.stockGrams - b.stockGrams);

  return (
    <div className="overflow-x-auto rounded-card border border-rule bg-sheet">
      <table className="w-full min-w-[34rem] border-collapse text-left text-small">
        <caption className="sr-only">Green coffee on hand, lowest first</caption>
        <thead className="bg-paper-shade">
          <tr>
            <th scope="col" className="px-4 py-3 font-semibold whitespace-nowrap">
              Lot
            </th>
            <th scope="col" className="px-4 py-3 font-semibold whitespace-nowrap">
              Origin
            </th>
            <th scope="col" className="px-4 py-3 text-right font-semibold whitespace-nowrap">
              On hand
            </th>
            <th scope="col" className="px-4 py-3 text-right font-semibold whitespace-nowrap">
              Price
            </th>
            <th scope="col" className="px-4 py-3 font-semibold whitespace-nowrap">
              State
            </th>
          </tr>
        </thead>
        <tbody>
          {byStock.map((lot) => (
            <tr key={lot.code} className="border-t border-rule">
              <th scope="row" className="px-4 py-3 font-normal">
                <Link to={paths.lot.getHref(lot.code)} className="font-semibold text-leaf underline">
                  {lot.name}
                </Link>
                <span className="block text-caption text-ink-muted">{lot.code}</span>
              </th>
              <td className="px-4 py-3">{lot.origin}</td>
              <td className="px-4 py-3 text-right tabular-nums">{formatGrams(lot.stockGrams)}</td>
              <td className="px-4 py-3 text-right tabular-nums">{formatPricePerKg(lot.pricePerKgCents)}</td>
              <td className="px-4 py-3">
                <StockBadge stockGrams={lot.stockGrams} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
