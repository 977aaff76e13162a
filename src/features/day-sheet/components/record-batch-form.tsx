import { zodResolver } from '@hookform/resolvers/zod';
import { useId, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { z } from 'zod';
import { DRUM_DTR_TARGET_PCT, batchMetrics } from '@shared/domain/roast-metrics';
import { defaultLossModel } from '@shared/domain/roast-loss';
import { roastLevelLabels, type RoastLevel } from '@shared/domain/vocabulary';
import type { BatchCreate, BatchCreated } from '@shared/schemas/roastery';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { controlStyles } from '@/components/ui/control-styles';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { formatDayLongNoYear } from '@/lib/dates';
import { applyServerErrors } from '@/lib/form-errors';
import { useRecordBatch } from '../api/record-batch';
import { formatLossPct, parseMinutesSeconds } from '../utils/roast-day-format';

const wholeGramsText = z.string().trim().regex(/^\d+$/, 'Enter whole grams, e.g. 4200.');
const timerText = z
  .string()
  .trim()
  .refine((text) => text === '' || parseMinutesSeconds(text) !== null, 'Use minutes:seconds, e.g. 11:45.');

/** What the person types; times as the roast timer shows them (mm:ss). */
const recordBatchFieldsSchema = z.object({
  greenGramsIn: wholeGramsText,
  roastedGramsOut: wholeGramsText,
  totalSeconds: timerText,
  firstCrackSeconds: timerText,
  notes: z.string().max(1_000, 'Keep the notes to 1,000 characters.'),
});
type RecordBatchFields = z.infer<typeof recordBatchFieldsSchema>;
const fieldNames = ['greenGramsIn', 'roastedGramsOut', 'totalSeconds', 'firstCrackSeconds', 'notes'] as const;
const isFieldName = (name: string): name is (typeof fieldNames)[number] => (fieldNames as readonly string[]).includes(name);

type BatchLine = { roastDate: string; lotCode: string; lotName: string; roastLevel: RoastLevel };

function toBatchInput(line: BatchLine, fields: Partial<RecordBatchFields>): BatchCreate {
  const seconds = (text: string | undefined) => (text ? (parseMinutesSeconds(text) ?? undefined) : undefined);
  const notes = fields.notes?.trim();
  return {
    roastDate: line.roastDate,
    lotCode: line.lotCode,
    roastLevel: line.roastLevel,
    greenGramsIn: Number(fields.greenGramsIn),
    roastedGramsOut: Number(fields.roastedGramsOut),
    totalSeconds: seconds(fields.totalSeconds),
    firstCrackSeconds: seconds(fields.firstCrackSeconds),
    ...(notes ? { notes } : {}),
  };
}

/**
 * Loss and development time ratio as the person types, from the same trade engine the server uses.
 * Whether the loss is inside the level's range is the server's to say: it knows the shop's loss model.
 */
function LivePreview({ line, fields }: { line: BatchLine; fields: Partial<RecordBatchFields> }) {
  const input = toBatchInput(line, fields);
  const ready = wholeGramsText.safeParse(fields.greenGramsIn).success && wholeGramsText.safeParse(fields.roastedGramsOut).success;
  const metrics = ready ? batchMetrics(input, defaultLossModel) : null;
  let text = 'Loss and development time ratio appear here as you type the weights and times.';
  if (metrics?.ok) {
    const ratio = metrics.value.developmentTimeRatio;
    text = `Loss ${formatLossPct(metrics.value.lossPct)}`;
    text +=
      ratio === undefined
        ? '. Add both times for the development time ratio.'
        : ` · development time ratio ${formatLossPct(ratio)} (drum target ${DRUM_DTR_TARGET_PCT.min}–${DRUM_DTR_TARGET_PCT.max} %).`;
  } else if (metrics && !metrics.ok) {
    text = Object.values(metrics.fields)[0] ?? text;
  }
  return (
    <output aria-live="polite" className="block rounded-control bg-paper-shade px-3 py-2 text-small font-semibold">
      {text}
    </output>
  );
}

/** What the server said of a saved batch: its loss against the level's range, and how the Roast List now plans the lot. */
export function ServerAnswer({ batch, level }: { batch: BatchCreated; level: RoastLevel }) {
  const range = `${formatLossPct(batch.expectedLossPct.min)}–${formatLossPct(batch.expectedLossPct.max)}`;
  const ratio = batch.developmentTimeRatio === undefined ? '' : ` Development time ratio ${formatLossPct(batch.developmentTimeRatio)}.`;
  const planning = `The Roast List now plans this lot at ${formatLossPct(batch.plannedLossPct)} (${
    batch.lossSource === 'lot' ? 'this lot’s batches' : 'level default'
  }).`;
  return (
    <FormAlert tone={batch.withinExpected ? 'status' : 'alert'}>
      <p className="font-semibold">
        {batch.withinExpected
          ? `Batch recorded. Loss ${formatLossPct(batch.lossPct)} is within the expected ${range} for ${roastLevelLabels[level]}.`
          : `Batch recorded and flagged: loss ${formatLossPct(batch.lossPct)} is ${batch.lossPosition} the expected ${range} for ${roastLevelLabels[level]}. Check both weights and note what happened.`}
      </p>
      <p className="text-small">
        {ratio} {planning}{' '}
        <Link to={paths.roastery.batch.getHref(batch.id)} className="font-semibold text-leaf underline">
          Trace this batch
        </Link>
      </p>
    </FormAlert>
  );
}

type RecordBatchFormProps = {
  line: BatchLine;
  suggestedGreenGrams?: number;
  /** The shop's today: a batch for a later roast day is saved only once the person confirms it. */
  today?: string;
  /** Called with the server's answer once the batch is saved (the line then closes its form). */
  onRecorded: (batch: BatchCreated) => void;
};

/** Records one batch of a Roast List line: green in, roasted out, and the roast's times. */
export function RecordBatchForm({ line, suggestedGreenGrams, today, onRecorded }: RecordBatchFormProps) {
  const form = useForm<RecordBatchFields>({
    resolver: zodResolver(recordBatchFieldsSchema),
    defaultValues: {
      greenGramsIn: suggestedGreenGrams ? String(suggestedGreenGrams) : '',
      roastedGramsOut: '',
      totalSeconds: '',
      firstCrackSeconds: '',
      notes: '',
    },
  });
  const watched = useWatch({ control: form.control });
  const record = useRecordBatch();
  const [formError, setFormError] = useState<string>();
  const [awaitingConfirmation, setAwaitingConfirmation] = useState<BatchCreate>();
  const notesId = useId();
  const { errors } = form.formState;
  const forLaterDay = today !== undefined && line.roastDate > today;

  async function save(input: BatchCreate) {
    setAwaitingConfirmation(undefined);
    try {
      onRecorded(await record.mutateAsync(input));
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, fieldNames));
    }
  }

  const submit = form.handleSubmit(async (fields) => {
    setFormError(undefined);
    const input = toBatchInput(line, fields);
    // The same cross-field rules as the server (roasted below green, first crack before the end).
    const checked = batchMetrics(input, defaultLossModel);
    if (!checked.ok) {
      Object.entries(checked.fields).forEach(([name, message], index) => {
        if (isFieldName(name)) form.setError(name, { type: 'validate', message }, { shouldFocus: index === 0 });
      });
      return;
    }
    // A batch for a day still ahead is most often a slip of the date switcher: ask first.
    if (forLaterDay) setAwaitingConfirmation(input);
    else await save(input);
  });

  return (
    <form
      noValidate
      onSubmit={(event) => void submit(event)}
      aria-label={`Record a batch of ${line.lotName}, ${roastLevelLabels[line.roastLevel]}`}
      className="grid gap-4"
    >
      {formError ? <FormAlert>{formError}</FormAlert> : null}
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <TextField label="Green in (g)" inputMode="numeric" autoComplete="off" error={errors.greenGramsIn?.message} {...form.register('greenGramsIn')} />
        <TextField
          label="Roasted out (g)"
          inputMode="numeric"
          autoComplete="off"
          error={errors.roastedGramsOut?.message}
          {...form.register('roastedGramsOut')}
        />
        <TextField
          label="Total time (mm:ss)"
          hint="Optional"
          inputMode="numeric"
          autoComplete="off"
          placeholder="11:45"
          error={errors.totalSeconds?.message}
          {...form.register('totalSeconds')}
        />
        <TextField
          label="First crack at (mm:ss)"
          hint="Optional"
          inputMode="numeric"
          autoComplete="off"
          placeholder="9:10"
          error={errors.firstCrackSeconds?.message}
          {...form.register('firstCrackSeconds')}
        />
      </div>
      <div>
        <label htmlFor={notesId} className="block text-small font-semibold">
          Notes <span className="font-normal text-ink-muted">(optional)</span>
        </label>
        <textarea
          id={notesId}
          rows={2}
          aria-invalid={errors.notes ? true : undefined}
          aria-describedby={errors.notes ? `${notesId}-error` : undefined}
          className={`${controlStyles} mt-1`}
          {...form.register('notes')}
        />
        {errors.notes ? (
          <p id={`${notesId}-error`} className="mt-1 text-small font-semibold text-alert">
            {errors.notes.message}
          </p>
        ) : null}
      </div>
      <LivePreview line={line} fields={watched} />
      <div>
        <Button type="submit" disabled={form.formState.isSubmitting || record.isPending}>
          {form.formState.isSubmitting || record.isPending ? 'Saving…' : 'Save batch'}
        </Button>
      </div>
      <ConfirmDialog
        open={awaitingConfirmation !== undefined}
        title={`Record this batch for ${formatDayLongNoYear(line.roastDate)}?`}
        confirmLabel="Record it for that day"
        cancelLabel="Go back"
        busy={record.isPending}
        onConfirm={() => {
          if (awaitingConfirmation) void save(awaitingConfirmation);
        }}
        onCancel={() => setAwaitingConfirmation(undefined)}
      >
        {`That roast day is still ahead: today is ${today ? formatDayLongNoYear(today) : 'earlier'}. Its green comes out of stock now.`}
      </ConfirmDialog>
    </form>
  );
}
