import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useRef, useState } from 'react';
import { useForm, type FieldPath } from 'react-hook-form';
import { lotCreateSchema, type LotDetail, type LotStaffDetail } from '@shared/schemas/lots';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/lib/form-errors';
import { useCreateLot, useUpdateLot } from '../api/save-lot';
import { emptyLotFormValues, lotFormValuesOf, lotPatchOf, type LotFormOutput, type LotFormValues } from '../utils/lot-form-values';
import { LotFields, type LotForm } from './lot-fields';

/** Every field a server error may name, price breaks by position. */
function fieldNamesOf(values: LotFormValues): FieldPath<LotFormValues>[] {
  const names = Object.keys(emptyLotFormValues) as FieldPath<LotFormValues>[];
  (values.priceBreaks ?? []).forEach((_priceBreak, index) => names.push(`priceBreaks.${index}.minGrams`, `priceBreaks.${index}.pricePerKgCents`));
  return names;
}

function useLotForm(defaultValues: LotFormValues): LotForm {
  return useForm<LotFormValues, unknown, LotFormOutput>({ resolver: zodResolver(lotCreateSchema), defaultValues });
}

/** A message about the whole form, focused when it appears so it is read out and seen. */
function FormMessage({ tone, children }: { tone: 'alert' | 'status'; children: string | undefined }) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (children) ref.current?.focus();
  }, [children]);
  if (!children) return null;
  return (
    <div ref={ref} tabIndex={-1} className="outline-none">
      <FormAlert tone={tone}>{children}</FormAlert>
    </div>
  );
}

/** A new lot: every descriptor, its code, reorder point and listing. Stock starts at zero. */
export function NewLotForm({ onCreated }: { onCreated: (lot: LotStaffDetail) => void }) {
  const form = useLotForm(emptyLotFormValues);
  const createLot = useCreateLot();
  const [formError, setFormError] = useState<string>();

  const submit = form.handleSubmit(async (input) => {
    setFormError(undefined);
    try {
      onCreated(await createLot.mutateAsync(input));
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, fieldNamesOf(form.getValues())));
    }
  });

  return (
    <form noValidate aria-label="New lot" onSubmit={(event) => void submit(event)} className="grid gap-6">
      <FormMessage tone="alert">{formError}</FormMessage>
      <LotFields form={form} isNew />
      <div>
        <Button type="submit" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? 'Adding…' : 'Add the lot'}
        </Button>
      </div>
    </form>
  );
}

/** An existing lot's descriptors; only what changed is sent. */
export function LotDescriptorsForm({ lot, settings }: { lot: LotDetail; settings: { reorderPointGrams: number; isListed: boolean } }) {
  // The lot as last loaded or saved: a save sends only what differs from it.
  const [original, setOriginal] = useState(() => lotFormValuesOf(lot, settings));
  const form = useLotForm(original);
  const updateLot = useUpdateLot();
  const [message, setMessage] = useState<{ tone: 'alert' | 'status'; text: string }>();

  const submit = form.handleSubmit(async (values) => {
    setMessage(undefined);
    const patch = lotPatchOf(values, original);
    if (Object.keys(patch).length === 0) {
      setMessage({ tone: 'status', text: 'Nothing has changed, so there was nothing to save.' });
      return;
    }
    try {
      const saved = await updateLot.mutateAsync({ code: lot.code, patch });
      const savedValues = lotFormValuesOf(saved, { reorderPointGrams: saved.reorderPointGrams, isListed: saved.isListed });
      setOriginal(savedValues);
      form.reset(savedValues);
      setMessage({ tone: 'status', text: 'Saved. The lot page shows the changes now.' });
    } catch (error) {
      const left = applyServerErrors(error, form.setError, fieldNamesOf(form.getValues()));
      if (left) setMessage({ tone: 'alert', text: left });
    }
  });

  return (
    <form noValidate aria-label="Lot descriptors" onSubmit={(event) => void submit(event)} className="grid gap-6">
      <FormMessage tone={message?.tone ?? 'status'}>{message?.text}</FormMessage>
      <LotFields form={form} isNew={false} />
      <div>
        <Button type="submit" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? 'Saving…' : 'Save changes'}
        </Button>
      </div>
    </form>
  );
}
