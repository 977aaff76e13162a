import { Link } from 'react-router-dom';
import { orderReference } from '@shared/domain/order-reference';
import type { OrderSort, OrderSummary } from '@shared/schemas/orders';
import { paths } from '@/config/paths';
import { useShopMoney } from '@/lib/shop-currency';
import { formatDay } from '@/lib/dates';
import { useShopClock } from '@/lib/shop-clock';
import { Table, TableBody, TableCell, TableFrame, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';
import { orderKindLabels, orderSortLabels } from '../utils/order-labels';
import { StaffOrderStatus } from './staff-order-status';

type SortedColumn = 'placed' | 'total' | 'status' | 'roastDate';

const sortedColumn: Record<OrderSort, { column: SortedColumn; direction: 'ascending' | 'descending' }> = {
  newest: { column: 'placed', direction: 'descending' },
  oldest: { column: 'placed', direction: 'ascending' },
  'total-high': { column: 'total', direction: 'descending' },
  'total-low': { column: 'total', direction: 'ascending' },
  'roast-date-soonest': { column: 'roastDate', direction: 'ascending' },
  'roast-date-latest': { column: 'roastDate', direction: 'descending' },
  status: { column: 'status', direction: 'ascending' },
};

export function RoasteryOrderTable({ orders, sort }: { orders: OrderSummary[]; sort: OrderSort }) {
  const clock = useShopClock();
  const { money } = useShopMoney();
  const sorted = sortedColumn[sort];
  const ariaSort = (column: SortedColumn) => (sorted.column === column ? sorted.direction : undefined);

  return (
    <TableFrame>
      <Table className="min-w-[52rem]">
        <caption className="sr-only">Orders, {orderSortLabels[sort].toLowerCase()}</caption>
        <TableHead>
          <tr>
            <TableHeader className="whitespace-nowrap">Order</TableHeader>
            <TableHeader className="whitespace-nowrap" aria-sort={ariaSort('placed')}>
              Placed
            </TableHeader>
            <TableHeader className="whitespace-nowrap">Customer</TableHeader>
            <TableHeader align="right" className="whitespace-nowrap">
              Bags
            </TableHeader>
            <TableHeader align="right" className="whitespace-nowrap" aria-sort={ariaSort('total')}>
              Total
            </TableHeader>
            <TableHeader className="whitespace-nowrap" aria-sort={ariaSort('status')}>
              Status
            </TableHeader>
            <TableHeader className="whitespace-nowrap" aria-sort={ariaSort('roastDate')}>
              Roast date
            </TableHeader>
            <TableHeader className="whitespace-nowrap">Ship date</TableHeader>
          </tr>
        </TableHead>
        <TableBody>
          {orders.map((order) => (
            <tr key={order.id}>
              <TableRowHeader>
                <Link to={paths.roastery.order.getHref(order.id)} className="font-semibold text-leaf underline">
                  <span className="sr-only">Order </span>
                  {orderReference(order.id)}
                </Link>
                <span className="block text-caption text-ink-muted">{orderKindLabels[order.kind]}</span>
              </TableRowHeader>
              <TableCell className="whitespace-nowrap">{clock.dateTime(order.placedAt)}</TableCell>
              <TableCell>
                {order.customer.name}
                <span className="block text-caption break-all text-ink-muted">{order.customer.email}</span>
              </TableCell>
              <TableCell align="right">{order.bagCount}</TableCell>
              <TableCell align="right">{money(order.totalCents)}</TableCell>
              <TableCell>
                <StaffOrderStatus status={order.status} />
              </TableCell>
              <TableCell className="whitespace-nowrap">{order.roastDate ? formatDay(order.roastDate) : <NotSet />}</TableCell>
              <TableCell className="whitespace-nowrap">{order.shipDate ? formatDay(order.shipDate) : <NotSet />}</TableCell>
            </tr>
          ))}
        </TableBody>
      </Table>
    </TableFrame>
  );
}

function NotSet() {
  return (
    <span className="text-ink-muted">
      <span aria-hidden="true">—</span>
      <span className="sr-only">not set</span>
    </span>
  );
}
