import { zodResolver } from '@hookform/resolvers/zod';
import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { rotationPickSchema, type RotationDay } from '@shared/schemas/rotation';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { formatGrams } from '@/lib/format';
import { formatDayWithWeekday } from '@/lib/dates';
import { usePickRotationLot } from '../api/pick-rotation-lot';

type RotationDayFormProps = {
  day: RotationDay;
  lots: readonly { code: string; name: string; stockGrams: number }[];
  range: { from: string; to: string };
};

type Outcome = { tone: 'status' | 'alert'; lines: string[] };

/** One roast day of the Roaster's Rotation: who is on it, and the lot they get. */
export function RotationDayForm({ day, lots, range }: RotationDayFormProps) {
  const headingId = useId();
  const pick = usePickRotationLot(range);
  const [outcome, setOutcome] = useState<Outcome>();
  const form = useForm<z.input<typeof rotationPickSchema>, unknown, z.output<typeof rotationPickSchema>>({
    resolver: zodResolver(rotationPickSchema),
    defaultValues: { lotCode: day.lotCode ?? '', note: day.note },
  });
  const { errors } = form.formState;

  const submit = form.handleSubmit(async (values) => {
    setOutcome(undefined);
    try {
      const saved = await pick.mutateAsync({ roastDate: day.roastDate, pick: values });
      setOutcome({
        tone: saved.warnings.length > 0 ? 'alert' : 'status',
        lines: [`${saved.coffee} is the Roaster’s Rotation on ${formatDayWithWeekday(saved.roastDate)}.`, ...saved.warnings.map((warning) => warning.message)],
      });
    } catch (error) {
      const rest = applyServerErrors(error, form.setError, ['lotCode', 'note']);
      if (rest) setOutcome({ tone: 'alert', lines: [rest] });
    }
  });

  return (
    <li aria-labelledby={headingId} className="rounded-card border border-rule bg-sheet p-4 sm:p-5">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={headingId} className="text-h3">
          {formatDayWithWeekday(day.roastDate)}
        </h2>
        <p className="text-small text-ink-muted">
          {day.subscribers} {day.subscribers === 1 ? 'subscriber' : 'subscribers'} · {day.bags} {day.bags === 1 ? 'bag' : 'bags'} ·{' '}
          {formatGrams(day.roastedGrams)} roasted
        </p>
      </div>
      <p className="mt-1 text-small">
        {day.coffee ? (
          <>
            Picked: <span className="font-semibold">{day.coffee}</span>
          </>
        ) : (
          'No lot picked yet.'
        )}
      </p>
      <form
        noValidate
        aria-labelledby={headingId}
        onSubmit={(event) => void submit(event)}
        className="mt-3 grid gap-3 sm:grid-cols-[1fr_1fr_auto] sm:items-end"
      >
        <div>
          <SelectField
            label="Lot"
            aria-invalid={errors.lotCode ? true : undefined}
            aria-describedby={errors.lotCode ? `${headingId}-lot-error` : undefined}
            {...form.register('lotCode')}
          >
            <option value="">Choose a lot</option>
            {lots.map((lot) => (
              <option key={lot.code} value={lot.code}>
                {lot.name} ({lot.code}, {formatGrams(lot.stockGrams)} green)
              </option>
            ))}
          </SelectField>
          {errors.lotCode?.message ? (
            <p id={`${headingId}-lot-error`} className="mt-1 text-small font-semibold text-alert">
              {errors.lotCode.message}
            </p>
          ) : null}
        </div>
        <TextField label="Note for the team (optional)" error={errors.note?.message} {...form.register('note')} />
        <Button type="submit" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? 'Saving…' : 'Save the pick'}
        </Button>
      </form>
      {outcome ? (
        <div className="mt-3">
          <FormAlert tone={outcome.tone}>
            {outcome.lines.map((line) => (
              <p key={line}>{line}</p>
            ))}
          </FormAlert>
        </div>
      ) : null}
    </li>
  );
}
