import { zodResolver } from '@hookform/resolvers/zod';
import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { shipOrderBodySchema, type PackOrder } from '@shared/schemas/packing';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useShipOrder } from '../api/ship-order';
import { useOpenDialog } from '../hooks/use-open-dialog';
import { CarrierField } from './carrier-field';

type ShipFields = z.input<typeof shipOrderBodySchema>;

type ShipOrderDialogProps = {
  order: PackOrder;
  date: string;
  carrierNames: readonly string[];
  onClose: () => void;
  onShipped: (order: PackOrder) => void;
};

/** A modal form for the carrier and tracking number; Escape or Cancel closes it and focus goes back. */
export function ShipOrderDialog({ order, date, carrierNames, onClose, onShipped }: ShipOrderDialogProps) {
  const { dialogRef, finish } = useOpenDialog();
  const titleId = useId();
  const ship = useShipOrder(date);
  const [formError, setFormError] = useState<string>();
  const form = useForm<ShipFields, unknown, z.output<typeof shipOrderBodySchema>>({
    resolver: zodResolver(shipOrderBodySchema),
    defaultValues: { carrier: '', trackingNumber: '' },
  });
  const { errors } = form.formState;

  const submit = form.handleSubmit(async (shipment) => {
    setFormError(undefined);
    try {
      const shipped = await ship.mutateAsync({ orderId: order.orderId, shipment });
      onShipped(shipped);
      finish();
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ['carrier', 'trackingNumber']));
    }
  });

  return (
    <dialog
      ref={dialogRef}
      aria-labelledby={titleId}
      onClose={onClose}
      className="m-auto w-[min(32rem,calc(100%-2rem))] rounded-card border border-rule bg-sheet p-6 text-ink shadow-card backdrop:bg-ink/50"
    >
      <h2 id={titleId} className="text-h3">
        Mark {order.customerName}&rsquo;s order shipped
      </h2>
      <p className="mt-1 text-small text-ink-muted">The customer gets the shipped e-mail with the tracking number and the day their coffee is ready.</p>
      <form noValidate onSubmit={(event) => void submit(event)} className="mt-4 grid gap-4">
        {formError ? <FormAlert>{formError}</FormAlert> : null}
        <CarrierField carrierNames={carrierNames} error={errors.carrier?.message} {...form.register('carrier')} />
        <TextField
          label="Tracking number"
          autoComplete="off"
          autoCapitalize="characters"
          spellCheck={false}
          error={errors.trackingNumber?.message}
          {...form.register('trackingNumber')}
        />
        <div className="flex flex-wrap gap-2">
          <Button type="submit" disabled={form.formState.isSubmitting}>
            {form.formState.isSubmitting ? 'Saving…' : 'Mark shipped'}
          </Button>
          <Button variant="secondary" onClick={() => dialogRef.current?.close()}>
            Cancel
          </Button>
        </div>
      </form>
    </dialog>
  );
}
