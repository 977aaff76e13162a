import { zodResolver } from '@hookform/resolvers/zod';
import { useState, type ReactNode } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';
import type { GreenStockItem } from '@shared/schemas/green-stock';
import { lotUpdateSchema } from '@shared/schemas/lots';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { ApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useUpdateLot } from '../api/save-lot';
import { fieldErrorText } from '../utils/field-error';
import { numberFromText } from '../utils/lot-form-values';
import { formatGramsAndPounds, formatPounds } from '../utils/weights';
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
          <span className="font-semibold">Time to reorder.</span> Stock is at or below the reorder point of {formatGramsAndPounds(item.reorderPointGrams)}.
        </FormAlert>
      ) : null}
      <div className="grid gap-6 md:grid-cols-2">
        <ReorderPointForm item={item} />
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

function ReorderPointForm({ item }: { item: GreenStockItem }) {
  const form = useForm<SettingsValues, unknown, z.output<typeof lotUpdateSchema>>({
    resolver: zodResolver(lotUpdateSchema),
    defaultValues: { reorderPointGrams: item.reorderPointGrams },
  });
  const updateLot = useUpdateLot();
  const [message, setMessage] = useState<{ tone: 'alert' | 'status'; text: string }>();
  const grams = useWatch({ control: form.control, name: 'reorderPointGrams' });

  const submit = form.handleSubmit(async ({ reorderPointGrams }) => {
    setMessage(undefined);
    try {
      const saved = await updateLot.mutateAsync({ code: item.code, patch: { reorderPointGrams } });
      form.reset({ reorderPointGrams: saved.reorderPointGrams });
      setMessage({
        tone: 'status',
        text: saved.reorderPointGrams > 0 ? `Reorder point set to ${formatGramsAndPounds(saved.reorderPointGrams)}.` : 'Reorder point removed.',
      });
    } catch (error) {
      const left = applyServerErrors(error, form.setError, ['reorderPointGrams']);
      if (left) setMessage({ tone: 'alert', text: left });
    }
  });

  const hint =
    typeof grams === 'number' && Number.isFinite(grams) && grams > 0
      ? `Flag the lot at or below this. That is ${formatPounds(grams)}.`
      : 'Flag the lot at or below this; 0 for none.';
  return (
    <form
      noValidate
      aria-label="Reorder point"
      onSubmit={(event) => void submit(event)}
      className="grid content-start gap-3 rounded-card border border-rule bg-sheet p-4"
    >
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      <TextField
        label="Reorder point (g)"
        inputMode="numeric"
        hint={hint}
        error={fieldErrorText(form.formState.errors.reorderPointGrams, 'The reorder point', 'Enter whole grams, e.g. 5000.')}
        {...form.register('reorderPointGrams', { setValueAs: numberFromText })}
      />
      <div>
        <Button type="submit" variant="secondary" disabled={form.formState.isSubmitting}>
          Save reorder point
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
