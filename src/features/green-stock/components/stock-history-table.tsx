import clsx from 'clsx';
import { Link } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { useShopClock } from '@/lib/shop-clock';
import { Table, TableBody, TableCell, TableFrame, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';
import { useStockMovements } from '../api/stock';
import { movementReasonLabels } from '../utils/stock-labels';
import { formatGramsChange, formatPounds } from '../utils/weights';

/** Every stock movement of the lot, newest first: by hand, sales, roasts and refunds. */
export function StockHistoryTable({ code }: { code: string }) {
  const clock = useShopClock();
  const movementsQuery = useStockMovements(code);
  if (movementsQuery.isError) {
    return <ErrorState title="The stock history could not load" error={movementsQuery.error} onRetry={() => void movementsQuery.refetch()} />;
  }
  if (!movementsQuery.data) {
    return (
      <div>
        <p role="status" className="sr-only">
          Loading the stock history…
        </p>
        <Skeleton className="h-40 rounded-card" />
      </div>
    );
  }
  const movements = movementsQuery.data.items;
  if (movements.length === 0) return <EmptyState title="No stock movements yet">Record the first arrival above; sales and roasts appear here too.</EmptyState>;

  return (
    // Focusable so a keyboard can scroll the table sideways on a narrow screen.
    <TableFrame role="region" aria-labelledby="stock-history-caption" tabIndex={0} aria-busy={movementsQuery.isFetching}>
      <Table className="min-w-[40rem]">
        <caption id="stock-history-caption" className="sr-only">
          Stock history of {code}, newest first
        </caption>
        <TableHead>
          <tr>
            <TableHeader>When</TableHeader>
            <TableHeader align="right">Change</TableHeader>
            <TableHeader>Reason</TableHeader>
            <TableHeader>Note</TableHeader>
            <TableHeader>By</TableHeader>
          </tr>
        </TableHead>
        <TableBody>
          {movements.map((movement) => (
            <tr key={movement.id}>
              <TableRowHeader className="whitespace-nowrap">{clock.dateTime(movement.createdAt)}</TableRowHeader>
              <TableCell align="right" className={clsx('whitespace-nowrap', movement.deltaGrams < 0 ? 'text-alert' : 'text-ok')}>
                {formatGramsChange(movement.deltaGrams)}
                <span className="block text-caption text-ink-muted">{formatPounds(Math.abs(movement.deltaGrams))}</span>
              </TableCell>
              <TableCell>{movementReasonLabels[movement.reason]}</TableCell>
              <TableCell>
                {movement.note}
                {movement.orderId ? (
                  <Link to={paths.roastery.order.getHref(movement.orderId)} className="block font-semibold text-leaf underline">
                    Open the order
                  </Link>
                ) : null}
              </TableCell>
              <TableCell>{movement.actorName ?? <span className="text-ink-muted">Automatic</span>}</TableCell>
            </tr>
          ))}
        </TableBody>
      </Table>
    </TableFrame>
  );
}
