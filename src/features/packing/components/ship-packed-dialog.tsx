import { useId, useState } from 'react';
import { orderReference } from '@shared/domain/order-reference';
import type { PackOrder } from '@shared/schemas/packing';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { ApiError } from '@/lib/api-client';
import { useShipDay } from '../api/ship-day';
import { useOpenDialog } from '../hooks/use-open-dialog';
import { CarrierField } from './carrier-field';

type ShipPackedDialogProps = {
  orders: PackOrder[];
  date: string;
  carrierNames: readonly string[];
  onClose: () => void;
  onShipped: (count: number, carrier: string) => void;
};

/** "Mark all packed orders shipped": one carrier for all, a tracking number for each; all ship together or none does. */
export function ShipPackedDialog({ orders, date, carrierNames, onClose, onShipped }: ShipPackedDialogProps) {
  const { dialogRef, finish } = useOpenDialog();
  const titleId = useId();
  const shipDay = useShipDay(date);
  const [carrier, setCarrier] = useState('');
  const [tracking, setTracking] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string>();

  async function submit() {
    setFormError(undefined);
    if (carrier.trim() === '') return setFormError('Name the carrier.');
    const missing = orders.filter((order) => !tracking[order.orderId]?.trim());
    if (missing.length > 0) return setFormError(`Enter a tracking number for ${missing.map((order) => order.customerName).join(', ')}.`);
    try {
      await shipDay.mutateAsync({
        date,
        body: { carrier, shipments: orders.map((order) => ({ orderId: order.orderId, trackingNumber: tracking[order.orderId]! })) },
      });
      onShipped(orders.length, carrier.trim());
      finish();
    } catch (error) {
      setFormError(error instanceof ApiError ? error.message : 'That did not work. Please try again.');
    }
  }

  return (
    <dialog
      ref={dialogRef}
      aria-labelledby={titleId}
      onClose={onClose}
      className="m-auto w-[min(36rem,calc(100%-2rem))] rounded-card border border-rule bg-sheet p-6 text-ink shadow-card backdrop:bg-ink/50"
    >
      <h2 id={titleId} className="text-h3">
        Mark {orders.length === 1 ? 'the packed order' : `all ${orders.length} packed orders`} shipped
      </h2>
      <p className="mt-1 text-small text-ink-muted">One carrier for all of them; each customer gets the shipped e-mail with their own tracking number.</p>
      <form
        noValidate
        onSubmit={(event) => {
          event.preventDefault();
          void submit();
        }}
        className="mt-4 grid gap-4"
      >
        {formError ? <FormAlert>{formError}</FormAlert> : null}
        <CarrierField carrierNames={carrierNames} value={carrier} onChange={(event) => setCarrier(event.target.value)} />
        {orders.map((order) => (
          <TextField
            key={order.orderId}
            label={`Tracking number for ${order.customerName} (order ${orderReference(order.orderId)})`}
            autoComplete="off"
            autoCapitalize="characters"
            spellCheck={false}
            value={tracking[order.orderId] ?? ''}
            onChange={(event) => setTracking((current) => ({ ...current, [order.orderId]: event.target.value }))}
          />
        ))}
        <div className="flex flex-wrap gap-2">
          <Button type="submit" disabled={shipDay.isPending}>
            {shipDay.isPending ? 'Saving…' : `Mark ${orders.length === 1 ? 'it' : `all ${orders.length}`} shipped`}
          </Button>
          <Button variant="secondary" onClick={() => dialogRef.current?.close()}>
            Cancel
          </Button>
        </div>
      </form>
    </dialog>
  );
}
