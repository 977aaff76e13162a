import { Link } from 'react-router-dom';
import { orderReference } from '@shared/domain/order-reference';
import type { OrderSort, OrderSummary } from '@shared/schemas/orders';
import { paths } from '@/config/paths';
import { useShopMoney } from '@/lib/shop-currency';
import { formatDay, formatInstant } from '@/lib/dates';
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

const headerCell = 'px-3 py-3 font-semibold whitespace-nowrap';
const cell = 'px-3 py-3 align-top';

export function RoasteryOrderTable({ orders, sort }: { orders: OrderSummary[]; sort: OrderSort }) {
  const { money } = useShopMoney();
  const sorted = sortedColumn[sort];
  const ariaSort = (column: SortedColumn) => (sorted.column === column ? sorted.direction : undefined);

  return (
    <div className="overflow-x-auto rounded-card border border-rule bg-sheet">
      <table className="w-full min-w-[52rem] border-collapse text-left text-small">
        <caption className="sr-only">Orders, {orderSortLabels[sort].toLowerCase()}</caption>
        <thead className="bg-paper-shade">
          <tr>
            <th scope="col" className={headerCell}>
              Order
            </th>
            <th scope="col" className={headerCell} aria-sort={ariaSort('placed')}>
              Placed
            </th>
            <th scope="col" className={headerCell}>
              Customer
            </th>
            <th scope="col" className={`${headerCell} text-right`}>
              Bags
            </th>
            <th scope="col" className={`${headerCell} text-right`} aria-sort={ariaSort('total')}>
              Total
            </th>
            <th scope="col" className={headerCell} aria-sort={ariaSort('status')}>
              Status
            </th>
            <th scope="col" className={headerCell} aria-sort={ariaSort('roastDate')}>
              Roast date
            </th>
            <th scope="col" className={headerCell}>
              Ship date
            </th>
          </tr>
        </thead>
        <tbody>
          {orders.map((order) => (
            <tr key={order.id} className="border-t border-rule">
              <th scope="row" className={`${cell} font-normal`}>
                <Link to={paths.roastery.order.getHref(order.id)} className="font-semibold text-leaf underline">
                  <span className="sr-only">Order </span>
                  {orderReference(order.id)}
                </Link>
                <span className="block text-caption text-ink-muted">{orderKindLabels[order.kind]}</span>
              </th>
              <td className={`${cell} whitespace-nowrap`}>{formatInstant(order.placedAt)}</td>
              <td className={cell}>
                {order.customer.name}
                <span className="block text-caption break-all text-ink-muted">{order.customer.email}</span>
              </td>
              <td className={`${cell} text-right tabular-nums`}>{order.bagCount}</td>
              <td className={`${cell} text-right tabular-nums`}>{money(order.totalCents)}</td>
              <td className={cell}>
                <StaffOrderStatus status={order.status} />
              </td>
              <td className={`${cell} whitespace-nowrap`}>{order.roastDate ? formatDay(order.roastDate) : <NotSet />}</td>
              <td className={`${cell} whitespace-nowrap`}>{order.shipDate ? formatDay(order.shipDate) : <NotSet />}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
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
