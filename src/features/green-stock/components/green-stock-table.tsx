import { Link } from 'react-router-dom';
import type { GreenStockItem } from '@shared/schemas/green-stock';
import { Badge } from '@/components/ui/badge';
import { paths } from '@/config/paths';
import { formatGrams } from '@/lib/format';
import { formatPounds } from '../utils/weights';
import { CoverText } from './cover-text';

/** What needs buying soonest first: lots at their reorder point, then the fewest days of cover, then the least stock. */
export function byUrgency(a: GreenStockItem, b: GreenStockItem): number {
  if (a.reorderAlert !== b.reorderAlert) return a.reorderAlert ? -1 : 1;
  const coverA = a.daysOfCover ?? Number.POSITIVE_INFINITY;
  const coverB = b.daysOfCover ?? Number.POSITIVE_INFINITY;
  if (coverA !== coverB) return coverA - coverB;
  return a.stockGrams - b.stockGrams || a.code.localeCompare(b.code);
}

const head = 'px-3 py-3 font-semibold whitespace-nowrap';
const cell = 'px-3 py-3 align-top';

export function GreenStockTable({ items, windowDays }: { items: GreenStockItem[]; windowDays: number }) {
  const rows = [...items].sort(byUrgency);
  return (
    <div className="overflow-x-auto rounded-card border border-rule bg-sheet">
      <table className="w-full min-w-[48rem] border-collapse text-left text-small">
        <caption className="sr-only">Green stock by lot: lots to reorder first, then the fewest days of cover</caption>
        <thead className="bg-paper-shade">
          <tr>
            <th scope="col" className={head}>
              Lot
            </th>
            <th scope="col" className={`${head} text-right`}>
              On hand
            </th>
            <th scope="col" className={`${head} text-right`}>
              Reorder point
            </th>
            <th scope="col" className={head}>
              Days of cover
            </th>
            <th scope="col" className={head}>
              Green Lots
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((item) => (
            <tr key={item.code} className="border-t border-rule">
              <th scope="row" className={`${cell} font-normal`}>
                <Link to={paths.roastery.lot.getHref(item.code)} className="font-semibold text-leaf underline">
                  {item.name}
                </Link>
                <span className="block text-caption text-ink-muted">{item.code}</span>
                {item.reorderAlert ? (
                  <Badge tone="alert" className="mt-1">
                    Time to reorder
                  </Badge>
                ) : null}
              </th>
              <td className={`${cell} text-right whitespace-nowrap tabular-nums`}>
                {item.stockGrams > 0 ? formatGrams(item.stockGrams) : <Badge tone="alert">Out of stock</Badge>}
                <span className="block text-caption text-ink-muted">{formatPounds(item.stockGrams)}</span>
              </td>
              <td className={`${cell} text-right whitespace-nowrap tabular-nums`}>
                {item.reorderPointGrams > 0 ? (
                  <>
                    {formatGrams(item.reorderPointGrams)}
                    <span className="block text-caption text-ink-muted">{formatPounds(item.reorderPointGrams)}</span>
                  </>
                ) : (
                  <span className="text-ink-muted">None set</span>
                )}
              </td>
              <td className={cell}>
                <CoverText item={item} windowDays={windowDays} />
              </td>
              <td className={cell}>{item.isListed ? <Badge tone="ok">Listed</Badge> : <Badge>Not listed</Badge>}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** The counts at the top of Green Stock. */
export function GreenStockFigures({ items }: { items: GreenStockItem[] }) {
  const figures = [
    { label: 'Lots', value: String(items.length) },
    { label: 'Time to reorder', value: String(items.filter((item) => item.reorderAlert).length) },
    { label: 'Out of stock', value: String(items.filter((item) => item.stockGrams <= 0).length) },
    { label: 'Green coffee on hand', value: formatGrams(items.reduce((sum, item) => sum + Math.max(item.stockGrams, 0), 0)) },
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
