import { Link } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { formatInstant } from '@/lib/dates';
import { useStockMovements } from '../api/stock';
import { movementReasonLabels } from '../utils/stock-labels';
import { formatGramsChange, formatPounds } from '../utils/weights';


/** Every stock movement of the lot, newest first: by hand, sales, roasts and refunds. */
export function StockHistoryTable({ code }: { code: string }) {
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
    <div role="region" aria-labelledby="stock-history-caption" tabIndex={0} className="overflow-x-auto rounded-card border border-rule bg-sheet" aria-busy={movementsQuery.isFetching}>
      <table className="w-full min-w-[40rem] border-collapse text-left text-small">
        <caption id="stock-history-caption" className="sr-only">
          Stock history of {code}, newest first
        </caption>
        <thead className="bg-paper-shade">
          <tr>
            <th scope="col" className="px-3 py-3 font-semibold">
              When
            </th>
            <th scope="col" className="px-3 py-3 text-right font-semibold">
              Change
            </th>
            <th scope="col" className="px-3 py-3 font-semibold">
              Reason
            </th>
            <th scope="col" className="px-3 py-3 font-semibold">
              Note
            </th>
            <th scope="col" className="px-3 py-3 font-semibold">
              By
            </th>
          </tr>
        </thead>
        <tbody>
          {movements.map((movement) => (
            <tr key={movement.id} className="border-t border-rule">
              <th scope="row" className="px-3 py-2 font-normal whitespace-nowrap">
                {formatInstant(movement.createdAt)}
              </th>
              <td className={movement.deltaGrams < 0 ? 'px-3 py-2 text-right whitespace-nowrap text-alert tabular-nums' : 'px-3 py-2 text-right whitespace-nowrap text-ok tabular-nums'}>
                {formatGramsChange(movement.deltaGrams)}
                <span className="block text-caption text-ink-muted">{formatPounds(Math.abs(movement.deltaGrams))}</span>
              </td>
              <td className="px-3 py-2">{movementReasonLabels[movement.reason]}</td>
              <td className="px-3 py-2">
                {movement.note}
                {movement.orderId ? (
                  <Link to={paths.roastery.order.getHref(movement.orderId)} className="block font-semibold text-leaf underline">
                    Open the order
                  </Link>
                ) : null}
              </td>
              <td className="px-3 py-2">{movement.actorName ?? <span className="text-ink-muted">Automatic</span>}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
