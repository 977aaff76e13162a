import { PackageCheck, Truck } from 'lucide-react';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { grindLabels, roastLevelLabels } from '@shared/domain/vocabulary';
import type { PackListResponse, PackOrder } from '@shared/schemas/packing';
import { orderReference } from '@shared/domain/order-reference';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { FormAlert } from '@/components/ui/form-alert';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { formatDayShort } from '@/lib/dates';
import { Table, TableBody, TableCell, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';
import { DownloadLink } from '@/components/ui/download-link';
import { labelsPdfPath } from '../api/get-pack-list';
import { useMarkPacked } from '../api/mark-packed';
import { canPack, packStageCounts, packStageLabels, packStageOf, packStages, packStatusOf, type PackStage } from '../utils/pack-status';
import { ShipPackedDialog } from './ship-packed-dialog';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { ShipOrderDialog } from './ship-order-dialog';

function day(date: string | null): string {
  return date ? formatDayShort(date) : '—';
}

function OrderBags({ order, canTrace }: { order: PackOrder; canTrace: boolean }) {
  return (
    <div className="overflow-x-auto">
      <Table variant="sheet">
        <caption className="sr-only">Bags of order {orderReference(order.orderId)}</caption>
        <TableHead>
          <tr>
            {['Bag', 'Coffee', 'Level', 'Grind', 'Net weight', 'Roasted', 'Ready from', 'Best before', ...(canTrace ? ['Batch'] : [])].map((heading) => (
              <TableHeader key={heading}>{heading}</TableHeader>
            ))}
          </tr>
        </TableHead>
        <TableBody>
          {order.bags.map((bag) => (
            <tr key={`${bag.orderItemId}-${bag.bagNumber}`}>
              <TableCell>
                {bag.bagNumber} of {order.bags.length}
              </TableCell>
              <TableRowHeader className="font-semibold">
                {bag.coffee}
                {bag.lotCode ? <span className="block text-small font-normal text-ink-muted">{bag.lotCode}</span> : null}
              </TableRowHeader>
              <TableCell>{bag.roastLevel ? roastLevelLabels[bag.roastLevel] : 'Green'}</TableCell>
              <TableCell>{bag.grind ? grindLabels[bag.grind] : '—'}</TableCell>
              <TableCell>{bag.netLabel}</TableCell>
              <TableCell>{day(bag.roastDate)}</TableCell>
              <TableCell>{day(bag.readyFrom)}</TableCell>
              <TableCell>{day(bag.bestBefore)}</TableCell>
              {canTrace ? (
                <TableCell>
                  {bag.batchId ? (
                    <Link to={paths.roastery.batch.getHref(bag.batchId)} className="font-semibold text-leaf underline">
                      Trace<span className="sr-only"> the batch of bag {bag.bagNumber}</span>
                    </Link>
                  ) : (
                    '—'
                  )}
                </TableCell>
              ) : null}
            </tr>
          ))}
        </TableBody>
      </Table>
    </div>
  );
}

const wholeGrams = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });

function bagList(bagNumbers: readonly number[]): string {
  return `${bagNumbers.length === 1 ? 'bag' : 'bags'} ${bagNumbers.join(', ')}`;
}

/** Which bags go in which box, as shipping was priced: whole bags, each parcel within its weight band. */
function OrderParcels({ order }: { order: PackOrder }) {
  if (order.parcelNote) return <p className="mt-3 text-small font-semibold text-alert">{order.parcelNote}</p>;
  if (order.parcels.length === 0) return null;
  return (
    <div className="mt-3">
      <h3 className="text-small font-semibold">{order.parcels.length === 1 ? 'One parcel' : `${order.parcels.length} parcels`}</h3>
      <ul aria-label={`Parcels for ${order.customerName}`} className="mt-1 text-small">
        {order.parcels.map((parcel) => (
          <li key={parcel.parcelNumber}>
            Parcel {parcel.parcelNumber}: {bagList(parcel.bagNumbers)} · {wholeGrams.format(parcel.grams)} g packed (band up to{' '}
            {wholeGrams.format(parcel.bandMaxGrams)} g)
          </li>
        ))}
      </ul>
    </div>
  );
}

function PackOrderCard({ order, date, onShip, canTrace }: { order: PackOrder; date: string; onShip: (order: PackOrder) => void; canTrace: boolean }) {
  const markPacked = useMarkPacked(date);
  const [failure, setFailure] = useState<string>();
  const [confirming, setConfirming] = useState(false);
  const status = packStatusOf(order);
  const headingId = `pack-order-${order.orderId}`;

  async function pack() {
    setFailure(undefined);
    try {
      await markPacked.mutateAsync(order.orderId);
    } catch (error) {
      setFailure(error instanceof ApiError ? error.message : 'That did not work. Please try again.');
    } finally {
      setConfirming(false);
    }
  }

  return (
    <li aria-labelledby={headingId} className="rounded-card border border-rule bg-sheet p-5 shadow-card print:break-inside-avoid print:shadow-none">
      <div className="flex flex-wrap items-center gap-2">
        <h2 id={headingId} className="text-h3">
          {order.customerName} <span className="font-body text-small font-semibold text-ink-muted">order {orderReference(order.orderId)}</span>
        </h2>
        <Badge tone={status.tone}>{status.label}</Badge>
      </div>
      {order.status === 'shipped' ? (
        <p className="mt-1 text-small">
          Shipped with {order.carrier}, tracking {order.trackingNumber}.
        </p>
      ) : null}
      <div className="mt-3">
        <OrderBags order={order} canTrace={canTrace} />
      </div>
      <OrderParcels order={order} />
      {failure ? (
        <p role="alert" className="mt-3 text-small font-semibold text-alert">
          {failure}
        </p>
      ) : null}
      <div className="mt-4 flex flex-wrap items-center gap-2 print:hidden">
        {canPack(order.status) ? (
          <Button variant="secondary" disabled={markPacked.isPending} aria-describedby={headingId} onClick={() => setConfirming(true)}>
            <PackageCheck aria-hidden="true" className="size-4" />
            Mark packed
          </Button>
        ) : null}
        <ConfirmDialog
          open={confirming}
          title={`Mark ${order.customerName}’s order packed?`}
          confirmLabel={markPacked.isPending ? 'Marking…' : 'Mark packed'}
          cancelLabel="Not yet"
          busy={markPacked.isPending}
          onConfirm={() => void pack()}
          onCancel={() => setConfirming(false)}
        >
          {`All ${order.bags.length} ${order.bags.length === 1 ? 'bag is' : 'bags are'} in the box and labelled.${order.kind === 'roasted' ? ' Each roasted bag is filled from a batch of its coffee, and the customer gets the roasted e-mail.' : ''}`}
        </ConfirmDialog>
        {order.status === 'packed' ? (
          <Button aria-describedby={headingId} onClick={() => onShip(order)}>
            <Truck aria-hidden="true" className="size-4" />
            Mark shipped
          </Button>
        ) : null}
        {canTrace ? (
          <Link to={paths.roastery.orderTrace.getHref(order.orderId)} className="ml-auto font-semibold text-leaf underline">
            Trace this order<span className="sr-only"> for {order.customerName}</span>
          </Link>
        ) : null}
      </div>
    </li>
  );
}

type PackFilter = 'open' | PackStage;

/** The day's orders to pack and ship, bag by bag, with the labels to print for them. Shipped orders stay out of the way unless asked for. */
type PackListViewProps = {
  packList: PackListResponse;
  /** Whether the person may open batch and order traces (staff may, a packer may not). */
  canTrace?: boolean;
  /** The shop has no place of business yet, so the labels cannot print. */
  labelsNeedAddress?: boolean;
  /** The names of the shop's carriers, offered when marking orders shipped. */
  carrierNames?: readonly string[];
};

export function PackListView({ packList, canTrace = true, labelsNeedAddress = false, carrierNames = [] }: PackListViewProps) {
  const [shipping, setShipping] = useState<PackOrder>();
  const [shipped, setShipped] = useState<string>();
  const [shippingAll, setShippingAll] = useState(false);
  const [filter, setFilter] = useState<PackFilter>('open');
  const { date, orders } = packList;
  const counts = packStageCounts(orders);
  const packed = orders.filter((order) => order.status === 'packed');
  const shown = orders.filter((order) => {
    const stage = packStageOf(order.status);
    return filter === 'open' ? stage !== 'shipped' : stage === filter;
  });

  return (
    <div>
      {labelsNeedAddress ? (
        <div className="mb-6 print:hidden">
          <FormAlert>Bag labels print the shop’s postal address, and none is set yet. The owner enters it in Settings, under Place of business.</FormAlert>
        </div>
      ) : (
        <div className="mb-6 flex flex-wrap items-center gap-2 print:hidden">
          <DownloadLink href={labelsPdfPath(date)}>Labels (PDF)</DownloadLink>
          <DownloadLink href={labelsPdfPath(date, 'letter-10')}>Letter sheet (PDF)</DownloadLink>
          <DownloadLink href={labelsPdfPath(date, 'a4-10')}>A4 sheet (PDF)</DownloadLink>
          <p className="text-small text-ink-muted">
            One label a bag, with the shop’s name and address and both net weights: 4 × 3 in for a label printer, or sheets of ten (4 × 2 in on US Letter, 99.1
            × 57 mm on A4).
          </p>
        </div>
      )}
      {orders.length > 0 ? (
        <div className="mb-6 grid gap-4 print:hidden">
          <ChoiceGroup
            legend="Show"
            name="pack-filter"
            columns={4}
            value={filter}
            onChange={setFilter}
            choices={[
              { value: 'open' as const, label: `Still to ship (${counts['to-pack'] + counts.packed})` },
              ...packStages.map((stage) => ({ value: stage, label: `${packStageLabels[stage]} (${counts[stage]})` })),
            ]}
          />
          {packed.length > 0 ? (
            <div>
              <Button onClick={() => setShippingAll(true)}>
                <Truck aria-hidden="true" className="size-4" />
                Mark all packed orders shipped ({packed.length})
              </Button>
            </div>
          ) : null}
        </div>
      ) : null}
      {shipped ? (
        <div className="mb-4">
          <FormAlert tone="status">{shipped}</FormAlert>
        </div>
      ) : null}
      {orders.length === 0 ? (
        <EmptyState title="Nothing ships this day">Orders appear here on the day they are due to ship.</EmptyState>
      ) : shown.length === 0 ? (
        <p className="text-ink-muted">No orders here.</p>
      ) : (
        <ul aria-label="Orders to pack" className="grid gap-4">
          {shown.map((order) => (
            <PackOrderCard key={order.orderId} order={order} date={date} onShip={setShipping} canTrace={canTrace} />
          ))}
        </ul>
      )}
      {shipping ? (
        <ShipOrderDialog
          order={shipping}
          date={date}
          carrierNames={carrierNames}
          onClose={() => setShipping(undefined)}
          onShipped={(order) =>
            setShipped(`${order.customerName}’s order is marked shipped (${order.carrier} ${order.trackingNumber}); the shipped e-mail is on its way.`)
          }
        />
      ) : null}
      {shippingAll ? (
        <ShipPackedDialog
          orders={packed}
          date={date}
          carrierNames={carrierNames}
          onClose={() => setShippingAll(false)}
          onShipped={(count, carrier) =>
            setShipped(`${count} ${count === 1 ? 'order is' : 'orders are'} marked shipped with ${carrier}; each customer’s shipped e-mail is on its way.`)
          }
        />
      ) : null}
    </div>
  );
}
