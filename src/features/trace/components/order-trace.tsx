import { Link } from 'react-router-dom';
import { roastLevelLabels } from '@shared/domain/vocabulary';
import { orderReference } from '@shared/domain/order-reference';
import { ErrorState } from '@/components/ui/error-state';
import { Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { Table, TableBody, TableCell, TableFrame, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';
import { useOrderTrace } from '../api/get-order-trace';
import { formatTraceDay, formatTraceGrams, traceStatusLabels } from '../utils/trace-format';

type OrderTraceProps = {
  orderId: string;
  /** The section heading's level: 2 on a page of its own, 3 inside an order's page. */
  headingLevel?: 2 | 3;
};

/** Where an order's bags came from: batch by batch, with lot and roast day. A section any order page can show. */
export function OrderTrace({ orderId, headingLevel = 2 }: OrderTraceProps) {
  const trace = useOrderTrace(orderId);
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  const headingId = `order-trace-${orderId}`;

  let body;
  if (trace.isError) {
    body = <ErrorState title="The trace could not load" error={trace.error} onRetry={() => void trace.refetch()} />;
  } else if (!trace.data) {
    body = (
      <div>
        <p role="status" className="sr-only">
          Loading the trace…
        </p>
        <Skeleton className="h-32 rounded-card" />
      </div>
    );
  } else {
    const { order, bags } = trace.data;
    body = (
      <>
        <p className="mb-3 text-ink-muted">
          Order {orderReference(order.id)} for {order.customerName} ({order.customerEmail}) · {traceStatusLabels[order.status]}
          {order.roastDate ? ` · roast day ${formatTraceDay(order.roastDate)}` : ''}
          {order.shipDate ? ` · ship day ${formatTraceDay(order.shipDate)}` : ''}
        </p>
        <TableFrame>
          <Table variant="sheet">
            <TableHead>
              <tr>
                {['Lot', 'Level', 'Bags', 'Roast day', 'Batch'].map((heading) => (
                  <TableHeader key={heading}>{heading}</TableHeader>
                ))}
              </tr>
            </TableHead>
            <TableBody>
              {bags.map((row, index) => (
                <tr key={`${row.batchId ?? 'none'}-${row.lotCode ?? 'none'}-${row.size}-${index}`}>
                  <TableRowHeader className="font-semibold">
                    {row.lotName ?? 'Lot not picked yet'}
                    {row.lotCode ? <span className="block text-small font-normal text-ink-muted">{row.lotCode}</span> : null}
                  </TableRowHeader>
                  <TableCell>{row.roastLevel ? roastLevelLabels[row.roastLevel] : 'Green'}</TableCell>
                  <TableCell>
                    {row.bags} × {row.size.replace(/(\d)([a-z])/, '$1 $2')} ({formatTraceGrams(row.grams)})
                  </TableCell>
                  <TableCell>{formatTraceDay(row.roastDate)}</TableCell>
                  <TableCell>
                    {row.batchId ? (
                      <Link to={paths.roastery.batch.getHref(row.batchId)} className="font-semibold text-leaf underline">
                        Open batch<span className="sr-only"> of {row.lotName ?? 'this line'}</span>
                      </Link>
                    ) : (
                      <span className="text-ink-muted">{row.roastLevel ? 'Not filled from a batch yet' : 'Green coffee: no batch'}</span>
                    )}
                  </TableCell>
                </tr>
              ))}
            </TableBody>
          </Table>
        </TableFrame>
      </>
    );
  }

  return (
    <section aria-labelledby={headingId}>
      <Heading id={headingId} className="mb-3 text-h2">
        Trace: batches and lots
      </Heading>
      {body}
    </section>
  );
}
