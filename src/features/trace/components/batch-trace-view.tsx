import { roastLevelLabels } from '@shared/domain/vocabulary';
import type { BatchTrace } from '@shared/schemas/packing';
import { orderReference } from '@shared/domain/order-reference';
import { Link } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { paths } from '@/config/paths';
import { Table, TableBody, TableCell, TableFrame, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';
import { formatTraceDay, formatTraceGrams, traceStatusLabels } from '../utils/trace-format';

/** A batch and every order it went into: who to reach in a recall. */
export function BatchTraceView({ trace }: { trace: BatchTrace }) {
  const { batch, orders } = trace;
  const facts = [
    ['Lot', `${batch.lotName} (${batch.lotCode})`],
    ['Roast level', roastLevelLabels[batch.roastLevel]],
    ['Roast day', formatTraceDay(batch.roastDate)],
    ['Green in', formatTraceGrams(batch.greenGramsIn)],
    ['Roasted out', formatTraceGrams(batch.roastedGramsOut)],
    ['Filled into bags', formatTraceGrams(batch.allocatedGrams)],
  ] as const;
  return (
    <>
      <dl className="mb-8 grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        {facts.map(([label, value]) => (
          <div key={label} className="rounded-card border border-rule bg-sheet p-4">
            <dt className="text-small text-ink-muted">{label}</dt>
            <dd className="font-semibold">{value}</dd>
          </div>
        ))}
      </dl>
      <section aria-labelledby="batch-orders">
        <h2 id="batch-orders" className="mb-3 text-h2">
          Orders from this batch
        </h2>
        {orders.length === 0 ? (
          <EmptyState title="No bags filled from this batch yet">Bags are filled from a batch when their order is packed.</EmptyState>
        ) : (
          <TableFrame>
            <Table variant="sheet">
              <TableHead>
                <tr>
                  {['Order', 'Customer', 'Bags', 'Status', 'Ship day'].map((heading) => (
                    <TableHeader key={heading}>{heading}</TableHeader>
                  ))}
                </tr>
              </TableHead>
              <TableBody>
                {orders.map((order) => (
                  <tr key={order.orderId}>
                    <TableRowHeader>
                      <Link to={paths.roastery.orderTrace.getHref(order.orderId)} className="font-semibold text-leaf underline">
                        {orderReference(order.orderId)}
                      </Link>
                    </TableRowHeader>
                    <TableCell>
                      {order.customerName}
                      <span className="block break-all text-small text-ink-muted">{order.customerEmail}</span>
                    </TableCell>
                    <TableCell>
                      {order.bags} ({formatTraceGrams(order.grams)})
                    </TableCell>
                    <TableCell>{traceStatusLabels[order.status]}</TableCell>
                    <TableCell>{formatTraceDay(order.shipDate)}</TableCell>
                  </tr>
                ))}
              </TableBody>
            </Table>
          </TableFrame>
        )}
      </section>
    </>
  );
}
