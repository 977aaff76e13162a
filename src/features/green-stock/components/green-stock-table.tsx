import { Link } from 'react-router-dom';
import type { GreenStockItem } from '@shared/schemas/green-stock';
import { Badge } from '@/components/ui/badge';
import { paths } from '@/config/paths';
import { formatGrams } from '@/lib/format';
import { Table, TableBody, TableCell, TableFrame, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';
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

export function GreenStockTable({ items, windowDays }: { items: GreenStockItem[]; windowDays: number }) {
  const rows = [...items].sort(byUrgency);
  return (
    <TableFrame>
      <Table className="min-w-[48rem]">
        <caption className="sr-only">Green stock by lot: lots to reorder first, then the fewest days of cover</caption>
        <TableHead>
          <tr>
            <TableHeader className="whitespace-nowrap">Lot</TableHeader>
            <TableHeader align="right" className="whitespace-nowrap">
              On hand
            </TableHeader>
            <TableHeader align="right" className="whitespace-nowrap">
              Reorder point
            </TableHeader>
            <TableHeader className="whitespace-nowrap">Days of cover</TableHeader>
            <TableHeader className="whitespace-nowrap">Green Lots</TableHeader>
          </tr>
        </TableHead>
        <TableBody>
          {rows.map((item) => (
            <tr key={item.code}>
              <TableRowHeader>
                <Link to={paths.roastery.lot.getHref(item.code)} className="font-semibold text-leaf underline">
                  {item.name}
                </Link>
                <span className="block text-caption text-ink-muted">{item.code}</span>
                {item.reorderAlert ? (
                  <Badge tone="alert" className="mt-1">
                    Time to reorder
                  </Badge>
                ) : null}
              </TableRowHeader>
              <TableCell align="right" className="whitespace-nowrap">
                {item.stockGrams > 0 ? formatGrams(item.stockGrams) : <Badge tone="alert">Out of stock</Badge>}
                <span className="block text-caption text-ink-muted">{formatPounds(item.stockGrams)}</span>
              </TableCell>
              <TableCell align="right" className="whitespace-nowrap">
                {item.reorderPointGrams > 0 ? (
                  <>
                    {formatGrams(item.reorderPointGrams)}
                    <span className="block text-caption text-ink-muted">{formatPounds(item.reorderPointGrams)}</span>
                  </>
                ) : (
                  <span className="text-ink-muted">None set</span>
                )}
              </TableCell>
              <TableCell>
                <CoverText item={item} windowDays={windowDays} />
              </TableCell>
              <TableCell>{item.isListed ? <Badge tone="ok">Listed</Badge> : <Badge>Not listed</Badge>}</TableCell>
            </tr>
          ))}
        </TableBody>
      </Table>
    </TableFrame>
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
