import clsx from 'clsx';
import { CircleAlert, Plus, Trash2 } from 'lucide-react';
import type { ReactNode } from 'react';
import { Controller, useFieldArray, useWatch, type UseFormReturn } from 'react-hook-form';
import { processes, processLabels, roastLevelLabels, roastLevels } from '@shared/domain/vocabulary';
import { Button } from '@/components/ui/button';
import { CheckboxField } from '@/components/ui/checkbox-field';
import { ParsedTextField } from '@/components/ui/parsed-text-field';
import { SelectField } from '@/components/ui/select-field';
import { TextAreaField } from '@/components/ui/text-area-field';
import { TextField } from '@/components/ui/text-field';
import { fieldErrorText } from '../utils/field-error';
import {
  centsFromDollars,
  dollarsFromCents,
  notesFromText,
  gramsFromWeightText,
  numberFromText,
  numberOrNullFromText,
  textFromNotes,
  textOrNull,
  type LotFormOutput,
  type LotFormValues,
} from '../utils/lot-form-values';
import { formatPounds } from '../utils/weights';

export type LotForm = UseFormReturn<LotFormValues, unknown, LotFormOutput>;

function Group({ legend, children, className }: { legend: string; children: ReactNode; className?: string }) {
  return (
    <fieldset className="rounded-card border border-rule bg-sheet p-4 sm:p-5">
      <legend className="px-1 font-heading text-h3 font-semibold">{legend}</legend>
      <div className={clsx('mt-2 grid gap-4', className)}>{children}</div>
    </fieldset>
  );
}

function GroupError({ id, message }: { id: string; message: string | undefined }) {
  if (!message) return null;
  return (
    <p id={id} className="flex items-start gap-1.5 text-small font-semibold text-alert">
      <CircleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0" />
      {message}
    </p>
  );
}

const money = 'Enter dollars and cents, e.g. 24.50.';

/**
 * Every descriptor of a lot, labelled and with its error tied to it. `isNew`: the code can be
 * chosen (it never changes afterwards) and the reorder point and listing are set here too.
 */
export function LotFields({ form, isNew }: { form: LotForm; isNew: boolean }) {
  const { register, control, formState } = form;
  const { errors } = formState;
  const priceBreaks = useFieldArray({ control, name: 'priceBreaks' });
  const error = (name: Exclude<keyof LotFormValues, 'priceBreaks' | 'tastingNotes' | 'allowedLevels'>, label: string, notANumber?: string) =>
    fieldErrorText(errors[name], label, notANumber);
  const priceBreaksError = fieldErrorText(errors.priceBreaks?.root ?? errors.priceBreaks, 'Price breaks');
  const allowedLevelsError = fieldErrorText(errors.allowedLevels?.root ?? errors.allowedLevels, 'Allowed levels');
  const tastingNotesError = fieldErrorText(Array.isArray(errors.tastingNotes) ? errors.tastingNotes.find(Boolean) : errors.tastingNotes, 'Each tasting note');

  return (
    <div className="grid gap-6">
      <Group legend="The lot" className="sm:grid-cols-2">
        {isNew ? (
          <TextField
            label="Lot code"
            hint="Capital letters, digits and hyphens, e.g. RD-26-ETH-01. It cannot be changed later."
            autoCapitalize="characters"
            spellCheck={false}
            error={error('code', 'Lot code')}
            {...register('code')}
          />
        ) : null}
        <TextField label="Name" error={error('name', 'Name')} {...register('name')} />
        <TextField label="Origin" hint="The country." error={error('origin', 'Origin')} {...register('origin')} />
        <TextField label="Region" error={error('region', 'Region')} {...register('region')} />
        <TextField label="Producer" error={error('producer', 'Producer')} {...register('producer')} />
        <TextField label="Variety" error={error('variety', 'Variety')} {...register('variety')} />
        <SelectField label="Process" {...register('process')}>
          {processes.map((process) => (
            <option key={process} value={process}>
              {processLabels[process]}
            </option>
          ))}
        </SelectField>
        <TextField
          label="Crop year"
          inputMode="numeric"
          error={error('cropYear', 'Crop year', 'Enter a year, e.g. 2025.')}
          {...register('cropYear', { setValueAs: numberFromText })}
        />
      </Group>

      <Group legend="Green coffee measures" className="sm:grid-cols-2 lg:grid-cols-3">
        <TextField
          label="Altitude (m)"
          hint="Metres above sea level."
          inputMode="numeric"
          error={error('altitudeM', 'Altitude', 'Enter whole metres, e.g. 1850.')}
          {...register('altitudeM', { setValueAs: numberFromText })}
        />
        <TextField
          label="Moisture (%)"
          inputMode="decimal"
          error={error('moisturePct', 'Moisture', 'Enter a percentage, e.g. 10.8.')}
          {...register('moisturePct', { setValueAs: numberFromText })}
        />
        <TextField
          label="Density (g/L)"
          hint="Leave empty if not measured."
          inputMode="numeric"
          error={error('densityGPerL', 'Density')}
          {...register('densityGPerL', { setValueAs: numberOrNullFromText })}
        />
        <TextField
          label="Screen size"
          hint="e.g. 17/18. Leave empty if not graded."
          error={error('screenSize', 'Screen size')}
          {...register('screenSize', { setValueAs: textOrNull })}
        />
        <TextField
          label="Cupping score"
          hint="0 to 100. Leave empty if not cupped."
          inputMode="decimal"
          error={error('cuppingScore', 'Cupping score')}
          {...register('cuppingScore', { setValueAs: numberOrNullFromText })}
        />
      </Group>

      <Group legend="How it tastes">
        <Controller
          control={control}
          name="tastingNotes"
          render={({ field }) => (
            <ParsedTextField
              label="Tasting notes"
              hint="Separate them with commas, e.g. bergamot, apricot, cane sugar."
              value={field.value ?? []}
              onValueChange={field.onChange}
              onBlur={field.onBlur}
              name={field.name}
              ref={field.ref}
              format={textFromNotes}
              parse={notesFromText}
              error={tastingNotesError}
            />
          )}
        />
        <TextAreaField label="Description" rows={5} error={error('description', 'Description')} {...register('description')} />
      </Group>

      <Group legend="Roast levels">
        <SelectField
          label="Suggested level"
          aria-invalid={errors.suggestedLevel ? true : undefined}
          aria-describedby={errors.suggestedLevel ? 'suggested-level-error' : undefined}
          {...register('suggestedLevel')}
        >
          {roastLevels.map((level) => (
            <option key={level} value={level}>
              {roastLevelLabels[level]}
            </option>
          ))}
        </SelectField>
        <GroupError id="suggested-level-error" message={error('suggestedLevel', 'Suggested level')} />
        <fieldset aria-describedby={allowedLevelsError ? 'allowed-levels-error' : undefined}>
          <legend className="text-small font-semibold">Allowed levels</legend>
          <div className="mt-1 flex flex-wrap gap-x-5">
            {roastLevels.map((level) => (
              <CheckboxField key={level} label={roastLevelLabels[level]} value={level} {...register('allowedLevels')} />
            ))}
          </div>
          <GroupError id="allowed-levels-error" message={allowedLevelsError} />
        </fieldset>
      </Group>

      <Group legend="Price">
        <Controller
          control={control}
          name="pricePerKgCents"
          render={({ field }) => (
            <ParsedTextField
              label="Price per kg ($)"
              inputMode="decimal"
              className="max-w-xs"
              value={field.value}
              onValueChange={field.onChange}
              onBlur={field.onBlur}
              name={field.name}
              ref={field.ref}
              format={dollarsFromCents}
              parse={centsFromDollars}
              error={fieldErrorText(errors.pricePerKgCents, 'Price per kg', money)}
            />
          )}
        />
        <fieldset aria-describedby={priceBreaksError ? 'price-breaks-error' : undefined}>
          <legend className="text-small font-semibold">Quantity breaks</legend>
          <p className="text-small text-ink-muted">A lower price per kg from a weight up, e.g. from 2268 g (5 lb). Each must cost less than the list price.</p>
          <ol className="mt-2 grid gap-3">
            {priceBreaks.fields.map((priceBreak, index) => (
              <li key={priceBreak.id} className="flex flex-wrap items-start gap-3">
                <TextField
                  label={`Break ${index + 1}: from (g)`}
                  inputMode="numeric"
                  className="w-44"
                  hint={<BreakWeightHint form={form} index={index} />}
                  error={fieldErrorText(errors.priceBreaks?.[index]?.minGrams, 'The weight', 'Enter whole grams.')}
                  {...register(`priceBreaks.${index}.minGrams`, { setValueAs: numberFromText })}
                />
                <Controller
                  control={control}
                  name={`priceBreaks.${index}.pricePerKgCents`}
                  render={({ field }) => (
                    <ParsedTextField
                      label={`Break ${index + 1}: price per kg ($)`}
                      inputMode="decimal"
                      className="w-52"
                      value={field.value ?? Number.NaN}
                      onValueChange={field.onChange}
                      onBlur={field.onBlur}
                      name={field.name}
                      ref={field.ref}
                      format={dollarsFromCents}
                      parse={centsFromDollars}
                      error={fieldErrorText(errors.priceBreaks?.[index]?.pricePerKgCents, 'The price', money)}
                    />
                  )}
                />
                <Button variant="secondary" className="mt-6" onClick={() => priceBreaks.remove(index)}>
                  <Trash2 aria-hidden="true" className="size-4" />
                  Remove break {index + 1}
                </Button>
              </li>
            ))}
          </ol>
          <Button variant="secondary" className="mt-3" onClick={() => priceBreaks.append({ minGrams: Number.NaN, pricePerKgCents: Number.NaN })}>
            <Plus aria-hidden="true" className="size-4" />
            Add a quantity break
          </Button>
          <GroupError id="price-breaks-error" message={priceBreaksError} />
        </fieldset>
      </Group>

      {isNew ? (
        <Group legend="In the Roastery" className="sm:grid-cols-2 sm:items-start">
          <TextField
            label="Reorder point"
            hint="In g, kg or lb, e.g. 5000, 5 kg or 11 lb. Green Stock flags the lot at or below this. 0 for none."
            error={error('reorderPointGrams', 'Reorder point', 'Enter a weight, e.g. 5 kg or 11 lb.')}
            {...register('reorderPointGrams', { setValueAs: gramsFromWeightText })}
          />
          <CheckboxField label="List it in Green Lots" className="sm:mt-6" {...register('isListed')} />
        </Group>
      ) : null}
    </div>
  );
}

function BreakWeightHint({ form, index }: { form: LotForm; index: number }) {
  const grams = useWatch({ control: form.control, name: `priceBreaks.${index}.minGrams` });
  return typeof grams === 'number' && Number.isFinite(grams) && grams > 0 ? <>{formatPounds(grams)}</> : <>Whole grams</>;
}
