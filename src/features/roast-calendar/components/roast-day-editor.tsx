import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useRef, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { z } from 'zod';
import type { CalendarDay, CalendarDayUpdate, CalendarDayUpdateResponse } from '@shared/schemas/roastery';
import { orderReference } from '@shared/domain/order-reference';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { formatDayLongNoYear, formatDayShortWithWeekday } from '@/lib/dates';
import { useUpdateRoastDay } from '../api/update-roast-day';

const roastDayFieldsSchema = z.object({
  open: z.enum(['open', 'closed']),
  shipping: z.enum(['usual', 'open', 'closed']),
  capacityGrams: z
    .string()
    .trim()
    .refine((text) => text === '' || /^\d+$/.test(text), 'Enter whole grams of green, or leave it empty.'),
  note: z.string().trim().max(200, 'Keep the note to 200 characters.'),
});
type RoastDayFields = z.infer<typeof roastDayFieldsSchema>;

function toUpdate(fields: RoastDayFields): CalendarDayUpdate {
  return {
    open: fields.open === 'open',
    shipOpen: fields.shipping === 'usual' ? null : fields.shipping === 'open',
    capacityGrams: fields.capacityGrams === '' ? null : Number(fields.capacityGrams),
    note: fields.note,
  };
}

/** What closing moved, so staff can see whom it touched. */
function MovedSummary({ result }: { result: CalendarDayUpdateResponse }) {
  const { moved, movedDeliveries, shipMoved } = result;
  if (moved.length === 0 && movedDeliveries.length === 0 && shipMoved.length === 0) {
    return <FormAlert tone="status">Saved {formatDayLongNoYear(result.date)}. Nothing needed to move.</FormAlert>;
  }
  return (
    <FormAlert tone="status">
      {moved.length > 0 || movedDeliveries.length > 0 ? (
        <p className="font-semibold">
          Saved {formatDayLongNoYear(result.date)}: {moved.length} {moved.length === 1 ? 'order' : 'orders'} and {movedDeliveries.length} scheduled{' '}
          {movedDeliveries.length === 1 ? 'delivery' : 'deliveries'} moved; each customer is e-mailed the new dates.
        </p>
      ) : (
        <p className="font-semibold">Saved {formatDayLongNoYear(result.date)}.</p>
      )}
      {shipMoved.length > 0 ? (
        <p className="mt-1">
          {shipMoved.length} {shipMoved.length === 1 ? 'parcel ships' : 'parcels ship'} on another day now.
        </p>
      ) : null}
      <ul className="mt-2 list-disc pl-5 text-small">
        {moved.map((order) => (
          <li key={order.orderId}>
            Order {orderReference(order.orderId)}: {formatDayShortWithWeekday(order.from)} → {formatDayShortWithWeekday(order.to)}
          </li>
        ))}
        {movedDeliveries.map((delivery) => (
          <li key={delivery.deliveryId}>
            Subscription delivery: {formatDayShortWithWeekday(delivery.from)} → {formatDayShortWithWeekday(delivery.to)}
          </li>
        ))}
        {shipMoved.map((parcel) => (
          <li key={parcel.orderId ?? parcel.deliveryId}>
            {parcel.orderId ? `Order ${orderReference(parcel.orderId)}` : 'Subscription delivery'} ships {formatDayShortWithWeekday(parcel.from)} →{' '}
            {formatDayShortWithWeekday(parcel.to)}
          </li>
        ))}
      </ul>
    </FormAlert>
  );
}

/** Opens or closes one roast day and sets its capacity and note; closing asks first. */
export function RoastDayEditor({ day, onDone }: { day: CalendarDay; onDone: () => void }) {
  const headingRef = useRef<HTMLHeadingElement>(null);
  const confirmRef = useRef<HTMLDivElement>(null);
  const update = useUpdateRoastDay();
  const [confirming, setConfirming] = useState(false);
  const [formError, setFormError] = useState<string>();
  const [result, setResult] = useState<CalendarDayUpdateResponse>();
  const form = useForm<RoastDayFields>({
    resolver: zodResolver(roastDayFieldsSchema),
    defaultValues: {
      open: day.open ? 'open' : 'closed',
      shipping: day.shipOverride === null ? 'usual' : day.shipOverride ? 'open' : 'closed',
      capacityGrams: day.overridden && day.open ? String(day.capacityGrams) : '',
      note: day.note ?? '',
    },
  });
  const openChoice = useWatch({ control: form.control, name: 'open' });
  const { errors } = form.formState;
  const closing = day.open && openChoice === 'closed';

  useEffect(() => headingRef.current?.focus(), []);
  useEffect(() => {
    if (confirming) confirmRef.current?.focus();
  }, [confirming]);

  async function save(fields: RoastDayFields) {
    setFormError(undefined);
    try {
      const saved = await update.mutateAsync({ date: day.date, update: toUpdate(fields) });
      setResult(saved);
      setConfirming(false);
    } catch (error) {
      setConfirming(false);
      setFormError(applyServerErrors(error, form.setError, ['capacityGrams', 'note']));
    }
  }

  const submit = form.handleSubmit(async (fields) => {
    if (closing && !confirming) {
      setConfirming(true);
      return;
    }
    await save(fields);
  });

  return (
    <section aria-labelledby="roast-day-editor" className="rounded-card border border-rule bg-sheet p-5 shadow-card">
      <h2 id="roast-day-editor" ref={headingRef} tabIndex={-1} className="text-h3">
        Change {formatDayLongNoYear(day.date)}
      </h2>
      <form noValidate onSubmit={(event) => void submit(event)} className="mt-4 grid gap-4">
        {formError ? <FormAlert>{formError}</FormAlert> : null}
        {result ? <MovedSummary result={result} /> : null}
        <fieldset>
          <legend className="text-small font-semibold">Roasting</legend>
          <div className="mt-1 flex flex-wrap gap-4">
            <label className="flex min-h-11 items-center gap-2">
              <input type="radio" value="open" className="size-5 accent-leaf" {...form.register('open')} />
              Open: roast this day
            </label>
            <label className="flex min-h-11 items-center gap-2">
              <input type="radio" value="closed" className="size-5 accent-leaf" {...form.register('open')} />
              Closed
            </label>
          </div>
        </fieldset>
        <fieldset>
          <legend className="text-small font-semibold">Shipping</legend>
          <p className="text-caption text-ink-muted">
            {day.holiday ? `${day.holiday}: carriers are closed, so parcels stay in unless you open shipping. ` : ''}
            Closing shipping keeps roasting as it is; parcels wait for the next ship day.
          </p>
          <div className="mt-1 flex flex-wrap gap-4">
            <label className="flex min-h-11 items-center gap-2">
              <input type="radio" value="usual" className="size-5 accent-leaf" {...form.register('shipping')} />
              As usual (ship days and holidays)
            </label>
            <label className="flex min-h-11 items-center gap-2">
              <input type="radio" value="open" className="size-5 accent-leaf" {...form.register('shipping')} />
              Open: parcels go out
            </label>
            <label className="flex min-h-11 items-center gap-2">
              <input type="radio" value="closed" className="size-5 accent-leaf" {...form.register('shipping')} />
              Closed: no parcels go out
            </label>
          </div>
        </fieldset>
        <TextField
          label="Capacity (g of green)"
          inputMode="numeric"
          autoComplete="off"
          hint="Leave empty to use the shop’s daily capacity."
          error={errors.capacityGrams?.message}
          {...form.register('capacityGrams')}
        />
        <TextField
          label="Note"
          hint="Shown on the calendar, e.g. why the day is closed."
          autoComplete="off"
          error={errors.note?.message}
          {...form.register('note')}
        />

        {confirming ? (
          <div
            ref={confirmRef}
            tabIndex={-1}
            role="alertdialog"
            aria-labelledby="close-day-title"
            aria-describedby="close-day-text"
            className="rounded-control border border-caution/40 bg-caution-wash p-4"
          >
            <p id="close-day-title" className="font-semibold">
              Close roasting on {formatDayLongNoYear(day.date)}?
            </p>
            <p id="close-day-text" className="mt-1 text-small">
              Its {day.ordersCount} {day.ordersCount === 1 ? 'order' : 'orders'} and any scheduled subscription deliveries move to the next open roast day with
              room, their ship, ready-from and best-before dates are worked out again, and each customer gets an e-mail with the new dates.
            </p>
            <div className="mt-3 flex flex-wrap gap-2">
              <Button type="submit" disabled={form.formState.isSubmitting}>
                {form.formState.isSubmitting ? 'Closing…' : 'Close the day and move its orders'}
              </Button>
              <Button variant="secondary" onClick={() => setConfirming(false)}>
                Keep it open
              </Button>
            </div>
          </div>
        ) : (
          <div className="flex flex-wrap gap-2">
            <Button type="submit" disabled={form.formState.isSubmitting}>
              {form.formState.isSubmitting ? 'Saving…' : 'Save day'}
            </Button>
            <Button variant="secondary" onClick={onDone}>
              Done
            </Button>
          </div>
        )}
      </form>
    </section>
  );
}
