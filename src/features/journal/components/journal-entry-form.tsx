import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { formatClock } from '@shared/domain/journal';
import { homeRoastDeviceLabels, homeRoastDevices, roastLevelLabels, roastLevels } from '@shared/domain/vocabulary';
import { journalFormSchema, type JournalEntry, type JournalEntryInput, type JournalFormValues, type JournalListResponse } from '@shared/schemas/journal';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { SelectField } from '@/components/ui/select-field';
import { TextAreaField } from '@/components/ui/text-area-field';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';

const fieldNames = [
  'lotCode',
  'device',
  'roastedOn',
  'greenGrams',
  'roastedGrams',
  'yellowSeconds',
  'firstCrackSeconds',
  'endSeconds',
  'levelReached',
  'notes',
] as const satisfies readonly (keyof JournalFormValues)[];

type JournalEntryFormProps = {
  lots: JournalListResponse['lots'];
  /** The entry to change; none to log a new roast. */
  entry?: JournalEntry;
  /** The lot to start from (a new roast from an order). */
  lotCode?: string;
  /** Today in the customer's calendar, the roast date a new entry starts with. */
  today: string;
  onSubmit: (input: JournalEntryInput) => Promise<unknown>;
  onCancel: () => void;
};

const clockOf = (seconds: number | undefined) => (seconds === undefined ? '' : formatClock(seconds));

function defaultsOf(entry: JournalEntry | undefined, lotCode: string | undefined, firstLot: string | undefined, today: string): JournalFormValues {
  return {
    lotCode: entry?.lotCode ?? lotCode ?? firstLot ?? '',
    device: entry?.device ?? 'popper',
    roastedOn: entry?.roastedOn ?? today,
    greenGrams: entry ? String(entry.greenGrams) : '',
    roastedGrams: entry ? String(entry.roastedGrams) : '',
    yellowSeconds: clockOf(entry?.yellowSeconds),
    firstCrackSeconds: clockOf(entry?.firstCrackSeconds),
    endSeconds: clockOf(entry?.endSeconds),
    levelReached: entry?.levelReached ?? '',
    notes: entry?.notes ?? '',
  };
}

/** One home roast: the lot, the device, the weights, the times as m:ss from the start, and what the roaster saw. */
export function JournalEntryForm({ lots, entry, lotCode, today, onSubmit, onCancel }: JournalEntryFormProps) {
  const form = useForm<JournalFormValues, unknown, JournalEntryInput>({
    resolver: zodResolver(journalFormSchema),
    defaultValues: defaultsOf(entry, lotCode, lots[0]?.code, today),
  });
  const [formError, setFormError] = useState<string>();
  const { errors, isSubmitting } = form.formState;
  const bought = lots.filter((lot) => lot.bought);
  const others = lots.filter((lot) => !lot.bought);

  const submit = form.handleSubmit(async (input) => {
    setFormError(undefined);
    try {
      await onSubmit(input);
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, fieldNames));
    }
  });

  return (
    <form noValidate onSubmit={(event) => void submit(event)} className="grid gap-4" aria-label={entry ? 'Change this roast' : 'Log a roast'}>
      {formError ? <FormAlert>{formError}</FormAlert> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label="Lot" {...form.register('lotCode')}>
          {bought.length > 0 ? (
            <optgroup label="Lots you bought">
              {bought.map((lot) => (
                <option key={lot.code} value={lot.code}>
                  {lot.name} ({lot.code})
                </option>
              ))}
            </optgroup>
          ) : null}
          <optgroup label={bought.length > 0 ? 'Other lots' : 'Lots'}>
            {others.map((lot) => (
              <option key={lot.code} value={lot.code}>
                {lot.name} ({lot.code})
              </option>
            ))}
          </optgroup>
        </SelectField>
        <SelectField label="Device" {...form.register('device')}>
          {homeRoastDevices.map((device) => (
            <option key={device} value={device}>
              {homeRoastDeviceLabels[device]}
            </option>
          ))}
        </SelectField>
        <TextField label="Roast date" type="date" error={errors.roastedOn?.message} {...form.register('roastedOn')} />
        <SelectField label="Level reached (optional)" {...form.register('levelReached')}>
          <option value="">Not sure</option>
          {roastLevels.map((level) => (
            <option key={level} value={level}>
              {roastLevelLabels[level]}
            </option>
          ))}
        </SelectField>
        <TextField label="Green weight (g)" inputMode="numeric" autoComplete="off" error={errors.greenGrams?.message} {...form.register('greenGrams')} />
        <TextField label="Roasted weight (g)" inputMode="numeric" autoComplete="off" error={errors.roastedGrams?.message} {...form.register('roastedGrams')} />
      </div>
      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-small font-semibold">Times from the start of the roast (m:ss)</legend>
        <TextField label="Yellow (optional)" placeholder="2:30" autoComplete="off" error={errors.yellowSeconds?.message} {...form.register('yellowSeconds')} />
        <TextField
          label="First crack (optional)"
          placeholder="3:00"
          autoComplete="off"
          error={errors.firstCrackSeconds?.message}
          {...form.register('firstCrackSeconds')}
        />
        <TextField label="End" placeholder="3:25" autoComplete="off" error={errors.endSeconds?.message} {...form.register('endSeconds')} />
      </fieldset>
      <TextAreaField label="Notes (optional)" rows={3} error={errors.notes?.message} {...form.register('notes')} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : entry ? 'Save changes' : 'Save roast'}
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
