import { zodResolver } from '@hookform/resolvers/zod';
import { useState, type ReactNode } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';
import { isAtReorderPoint } from '@shared/domain/stock-cover';
import type { GreenStockItem } from '@shared/schemas/green-stock';
import { lotUpdateSchema } from '@shared/schemas/lots';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { ApiError } from '@/lib/api-client';
import { formatDayWithWeekday } from '@/lib/dates';
import { applyServerErrors } from '@/lib/form-errors';
import { useUpdateLot } from '../api/save-lot';
import { fieldErrorText } from '../utils/field-error';
import { numberFromText, gramsFromWeightText } from '../utils/lot-form-values';
import { formatGramsAndPounds } from '../utils/weights';
import { CoverText } from './cover-text';

type SettingsValues = z.input<typeof lotUpdateSchema>;

/** What a lot holds and how long it lasts, its reorder point and whether Green Lots lists it. */
export function LotStockSettings({ item, windowDays }: { item: GreenStockItem; windowDays: number }) {
  return (
    <div className="grid gap-6">
      <dl className="grid grid-cols-2 gap-3 lg:grid-cols-4">
        <Figure label="On hand" value={formatGramsAndPounds(item.stockGrams)} />
        <Figure label="Reorder point" value={item.reorderPointGrams > 0 ? formatGramsAndPounds(item.reorderPointGrams) : 'None set'} />
        <Figure label="Days of cover" value={<CoverText item={item} windowDays={windowDays} />} />
        <Figure label="Green Lots" value={item.isListed ? 'Listed' : 'Not listed'} />
      </dl>
      {item.reorderAlert ? (
        <FormAlert>
          <span className="font-semibold">Time to reorder.</span>{' '}
          {isAtReorderPoint(item.stockGrams, item.reorderPointGrams)
            ? `Stock is at or below the reorder point of ${formatGramsAndPounds(item.reorderPointGrams)}.`
            : `At the coming weeks’ needs the lot runs out within its supplier lead time of ${item.supplierLeadTimeDays} days.`}
        </FormAlert>
      ) : item.reorderBy ? (
        <p className="text-small">
          Green planning: reorder by <strong>{formatDayWithWeekday(item.reorderBy)}</strong> (the run-out day less the {item.supplierLeadTimeDays}-day lead
          time).
        </p>
      ) : null}
      <div className="grid gap-6 md:grid-cols-2">
        <NumberSettingForm item={item} field="reorderPointGrams" />
        <NumberSettingForm item={item} field="supplierLeadTimeDays" />
        <ListingToggle item={item} />
      </div>
    </div>
  );
}

function Figure({ label, value }: { label: string; value: ReactNode }) {
  return (
    <div className="rounded-card border border-rule bg-sheet p-4">
      <dt className="text-small text-ink-muted">{label}</dt>
      <dd className="mt-1 font-semibold">{value}</dd>
    </div>
  );
}

type NumberSetting = 'reorderPointGrams' | 'supplierLeadTimeDays';

type NumberSettingCopy = {
  formLabel: string;
  inputLabel: string;
  /** The field's name in an error message, and an example of a good value. */
  errorName: string;
  errorExample: string;
  hint: (value: unknown) => string;
  saved: (value: number) => string;
  button: string;
  /** Reads the typed text as the field's number. */
  parse: (text: unknown) => number;
  inputMode: 'numeric' | 'text';
};

const numberSettingCopy: Record<NumberSetting, NumberSettingCopy> = {
  reorderPointGrams: {
    formLabel: 'Reorder point',
    inputLabel: 'Reorder point',
    errorName: 'The reorder point',
    errorExample: 'Enter a weight, e.g. 5 kg or 11 lb.',
    hint: (grams) =>
      typeof grams === 'number' && Number.isFinite(grams) && grams > 0
        ? `In g, kg or lb. Flag the lot at or below this. That is ${formatGramsAndPounds(grams)}.`
        : 'In g, kg or lb, e.g. 5 kg or 11 lb. Flag the lot at or below this; 0 for none.',
    saved: (grams) => (grams > 0 ? `Reorder point set to ${formatGramsAndPounds(grams)}.` : 'Reorder point removed.'),
    button: 'Save reorder point',
    parse: gramsFromWeightText,
    inputMode: 'text',
  },
  supplierLeadTimeDays: {
    formLabel: 'Supplier lead time',
    inputLabel: 'Supplier lead time (days)',
    errorName: 'The supplier lead time',
    errorExample: 'Enter whole days from 0 to 365, e.g. 14.',
    hint: () => 'Days from ordering more of this lot to having it on the shelf. Green planning asks for the order this long before the lot runs out.',
    saved: (days) => `Supplier lead time set to ${days} ${days === 1 ? 'day' : 'days'}.`,
    button: 'Save lead time',
    parse: numberFromText,
    inputMode: 'numeric',
  },
};

/** One of the lot's numeric Roastery settings, saved on its own. */
function NumberSettingForm({ item, field }: { item: GreenStockItem; field: NumberSetting }) {
  const copy = numberSettingCopy[field];
  const form = useForm<SettingsValues, unknown, z.output<typeof lotUpdateSchema>>({
    resolver: zodResolver(lotUpdateSchema),
    defaultValues: { [field]: item[field] },
  });
  const updateLot = useUpdateLot();
  const [message, setMessage] = useState<{ tone: 'alert' | 'status'; text: string }>();
  const value = useWatch({ control: form.control, name: field });

  const submit = form.handleSubmit(async (values) => {
    setMessage(undefined);
    try {
      const saved = await updateLot.mutateAsync({ code: item.code, patch: { [field]: values[field] } });
      form.reset({ [field]: saved[field] });
      setMessage({ tone: 'status', text: copy.saved(saved[field]) });
    } catch (error) {
      const left = applyServerErrors(error, form.setError, [field]);
      if (left) setMessage({ tone: 'alert', text: left });
    }
  });

  return (
    <form
      noValidate
      aria-label={copy.formLabel}
      onSubmit={(event) => void submit(event)}
      className="grid content-start gap-3 rounded-card border border-rule bg-sheet p-4"
    >
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      <TextField
        label={copy.inputLabel}
        inputMode={copy.inputMode}
        hint={copy.hint(value)}
        error={fieldErrorText(form.formState.errors[field], copy.errorName, copy.errorExample)}
        {...form.register(field, { setValueAs: copy.parse })}
      />
      <div>
        <Button type="submit" variant="secondary" disabled={form.formState.isSubmitting}>
          {copy.button}
        </Button>
      </div>
    </form>
  );
}

function ListingToggle({ item }: { item: GreenStockItem }) {
  const updateLot = useUpdateLot();
  const [failure, setFailure] = useState<string>();
  async function toggle() {
    setFailure(undefined);
    try {
      await updateLot.mutateAsync({ code: item.code, patch: { isListed: !item.isListed } });
    } catch (error) {
      setFailure(error instanceof ApiError ? error.message : 'That did not work. Please try again.');
    }
  }
  return (
    <div className="grid content-start gap-3 rounded-card border border-rule bg-sheet p-4">
      <p className="flex flex-wrap items-center gap-2">
        <span className="text-small font-semibold">Green Lots</span>
        {item.isListed ? <Badge tone="ok">Listed</Badge> : <Badge>Not listed</Badge>}
      </p>
      <p className="text-small text-ink-muted">{item.isListed ? 'Customers can find and buy this lot.' : 'Hidden from customers; staff still see it here.'}</p>
      {failure ? (
        <p role="alert" className="text-small font-semibold text-alert">
          {failure}
        </p>
      ) : null}
      <div>
        <Button variant="secondary" disabled={updateLot.isPending} onClick={() => void toggle()}>
          {item.isListed ? 'Take off Green Lots' : 'List in Green Lots'}
        </Button>
      </div>
    </div>
  );
}
