import { zodResolver } from '@hookform/resolvers/zod';
import clsx from 'clsx';
import { useEffect, useId, useRef, useState } from 'react';
import { Controller, useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';
import { stockAdjustmentReasons, stockAdjustmentSchema } from '@shared/schemas/lots';
import { Button } from '@/components/ui/button';
import { controlStyles } from '@/components/ui/control-styles';
import { Field, fieldDescribedBy } from '@/components/ui/field';
import { FormAlert } from '@/components/ui/form-alert';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { formatGrams } from '@/lib/format';
import { applyServerErrors } from '@/lib/form-errors';
import { useAdjustStock } from '../api/stock';
import { fieldErrorText } from '../utils/field-error';
import { adjustmentReasonHints, movementReasonLabels } from '../utils/stock-labels';
import { formatGramsAndPounds, stockUnits, typedAmountToGrams, type StockUnit } from '../utils/weights';

type AdjustmentValues = z.input<typeof stockAdjustmentSchema>;

const blank: AdjustmentValues = { deltaGrams: Number.NaN, reason: 'arrival', note: '' };

/** The change typed in grams or pounds; the form holds it in grams, as the API takes it. */
function ChangeField({
  value,
  onChange,
  onBlur,
  inputRef,
  reasonHint,
  error,
  resetCount,
}: {
  value: number;
  onChange: (grams: number) => void;
  onBlur: () => void;
  inputRef: (element: HTMLInputElement | null) => void;
  reasonHint: string;
  error: string | undefined;
  resetCount: number;
}) {
  const id = useId();
  const [text, setText] = useState('');
  const [unit, setUnit] = useState<StockUnit>('g');
  const [seenReset, setSeenReset] = useState(resetCount);
  if (seenReset !== resetCount) {
    setSeenReset(resetCount);
    setText('');
  }
  const hint = (
    <>
      {reasonHint}
      {unit === 'lb' && Number.isFinite(value) ? <> That is {formatGrams(value)}.</> : null}
    </>
  );
  return (
    <Field id={id} label="Change" hint={hint} error={error}>
      <div className="flex gap-2">
        <input
          id={id}
          ref={inputRef}
          inputMode="decimal"
          value={text}
          onBlur={onBlur}
          aria-invalid={error ? true : undefined}
          aria-describedby={fieldDescribedBy(id, hint, error)}
          onChange={(event) => {
            setText(event.target.value);
            onChange(typedAmountToGrams(event.target.value, unit));
          }}
          className={clsx(controlStyles, 'min-w-0 flex-1', error && 'border-alert')}
        />
        <select
          aria-label="Unit"
          value={unit}
          onChange={(event) => {
            const next = event.target.value === 'lb' ? 'lb' : 'g';
            setUnit(next);
            onChange(typedAmountToGrams(text, next));
          }}
          className={clsx(controlStyles, 'w-24')}
        >
          {stockUnits.map((each) => (
            <option key={each} value={each}>
              {each === 'g' ? 'grams' : 'pounds'}
            </option>
          ))}
        </select>
      </div>
    </Field>
  );
}

/** Records an arrival, a sample, a loss or a count correction, with a note. */
export function StockAdjustmentForm({ code }: { code: string }) {
  const form = useForm<AdjustmentValues, unknown, z.output<typeof stockAdjustmentSchema>>({
    resolver: zodResolver(stockAdjustmentSchema),
    defaultValues: blank,
  });
  const adjust = useAdjustStock();
  const [message, setMessage] = useState<{ tone: 'alert' | 'status'; text: string }>();
  const [resetCount, setResetCount] = useState(0);
  const messageRef = useRef<HTMLDivElement>(null);
  const { errors } = form.formState;
  const reason = useWatch({ control: form.control, name: 'reason' });

  useEffect(() => {
    if (message) messageRef.current?.focus();
  }, [message]);

  const submit = form.handleSubmit(async (adjustment) => {
    setMessage(undefined);
    try {
      const { stockGrams } = await adjust.mutateAsync({ code, adjustment });
      form.reset(blank);
      setResetCount((count) => count + 1);
      setMessage({ tone: 'status', text: `${movementReasonLabels[adjustment.reason]} recorded. On hand now: ${formatGramsAndPounds(stockGrams)}.` });
    } catch (error) {
      const left = applyServerErrors(error, form.setError, ['deltaGrams', 'reason', 'note']);
      if (left) setMessage({ tone: 'alert', text: left });
    }
  });

  return (
    <form noValidate aria-label="Adjust stock" onSubmit={(event) => void submit(event)} className="grid gap-4">
      {message ? (
        <div ref={messageRef} tabIndex={-1} className="outline-none">
          <FormAlert tone={message.tone}>{message.text}</FormAlert>
        </div>
      ) : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label="Reason" {...form.register('reason')}>
          {stockAdjustmentReasons.map((each) => (
            <option key={each} value={each}>
              {movementReasonLabels[each]}
            </option>
          ))}
        </SelectField>
        <Controller
          control={form.control}
          name="deltaGrams"
          render={({ field }) => (
            <ChangeField
              value={field.value}
              onChange={field.onChange}
              onBlur={field.onBlur}
              inputRef={field.ref}
              reasonHint={adjustmentReasonHints[reason]}
              error={fieldErrorText(errors.deltaGrams, 'The change', 'Enter an amount, e.g. 2500 or -250.')}
              resetCount={resetCount}
            />
          )}
        />
      </div>
      <TextField
        label="Note"
        hint="Optional: the delivery, who took the sample, what was found."
        maxLength={500}
        error={fieldErrorText(errors.note, 'The note')}
        {...form.register('note')}
      />
      <div>
        <Button type="submit" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? 'Recording…' : 'Record the change'}
        </Button>
      </div>
    </form>
  );
}
