import { Controller, useFormContext } from 'react-hook-form';
import { cadences, grindLabels, grinds, roastedBagSizes, roastLevelLabels, type RoastLevel } from '@shared/domain/vocabulary';
import { maxBagsPerDelivery } from '@shared/schemas/subscriptions';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { TextField } from '@/components/ui/text-field';
import type { SubscriptionChoiceFields } from '../utils/subscription-form';
import { bagSizeNetLabel, bagSizeShort, brewMethodLabels, cadenceLabel } from '@/lib/subscription-labels';

type SubscriptionChoiceFieldsProps = {
  /** The levels the coffee may be roasted to. */
  allowedLevels: readonly RoastLevel[];
  /** Keeps radio names unique when two forms share a page. */
  idPrefix: string;
  /** Each bag size's price as the subscriber pays it, shown beside the size. */
  bagPrices?: Partial<Record<(typeof roastedBagSizes)[number], string>>;
};

/**
 * Roast level, bag size, bags, brew method, grind and cadence, each a labelled group, inside the
 * builder's or the change form's `FormProvider` (both hold these fields).
 */
export function SubscriptionChoiceFieldset({ allowedLevels, idPrefix, bagPrices }: SubscriptionChoiceFieldsProps) {
  const { control, register, formState } = useFormContext<SubscriptionChoiceFields>();
  const { errors } = formState;
  return (
    <div className="grid gap-6">
      <Controller
        control={control}
        name="roastLevel"
        render={({ field }) => (
          <ChoiceGroup
            legend="Roast level"
            hint={allowedLevels.length < 5 ? 'The levels this coffee is roasted to.' : undefined}
            name={`${idPrefix}-roast-level`}
            choices={allowedLevels.map((level) => ({ value: level, label: roastLevelLabels[level] }))}
            value={field.value as RoastLevel | undefined}
            onChange={field.onChange}
            error={errors.roastLevel?.message}
          />
        )}
      />
      <Controller
        control={control}
        name="bagSize"
        render={({ field }) => (
          <ChoiceGroup
            legend="Bag size"
            name={`${idPrefix}-bag-size`}
            choices={roastedBagSizes.map((size) => ({
              value: size,
              label: bagSizeShort(size),
              detail: bagPrices?.[size] ? `${bagSizeNetLabel(size)} · ${bagPrices[size]} a bag` : bagSizeNetLabel(size),
            }))}
            value={field.value as (typeof roastedBagSizes)[number] | undefined}
            onChange={field.onChange}
            error={errors.bagSize?.message}
          />
        )}
      />
      <TextField
        label="Bags per delivery"
        type="number"
        inputMode="numeric"
        min={1}
        max={maxBagsPerDelivery}
        step={1}
        className="w-40"
        hint={`From 1 to ${maxBagsPerDelivery}.`}
        error={errors.bagsPerDelivery?.message}
        {...register('bagsPerDelivery', { valueAsNumber: true })}
      />
      <Controller
        control={control}
        name="brewMethod"
        render={({ field }) => (
          <ChoiceGroup
            legend="Brew method"
            hint="It sets the rest: espresso rests longer than filter before it is ready to brew, so its ready-from date comes later."
            name={`${idPrefix}-brew-method`}
            columns={2}
            choices={[
              { value: 'filter', label: brewMethodLabels.filter, detail: 'Pour-over, drip, French press, cold brew' },
              { value: 'espresso', label: brewMethodLabels.espresso, detail: 'Espresso machine, moka pot' },
            ]}
            value={field.value as 'filter' | 'espresso' | undefined}
            onChange={field.onChange}
            error={errors.brewMethod?.message}
          />
        )}
      />
      <Controller
        control={control}
        name="grind"
        render={({ field }) => (
          <ChoiceGroup
            legend="Grind"
            hint="Whole bean keeps best; or we grind it for your brewer on the roast day."
            name={`${idPrefix}-grind`}
            columns={4}
            choices={grinds.map((grind) => ({ value: grind, label: grindLabels[grind] }))}
            value={field.value as (typeof grinds)[number] | undefined}
            onChange={field.onChange}
            error={errors.grind?.message}
          />
        )}
      />
      <Controller
        control={control}
        name="cadenceWeeks"
        render={({ field }) => (
          <ChoiceGroup
            legend="How often"
            name={`${idPrefix}-cadence`}
            columns={4}
            choices={cadences.map((weeks) => ({ value: String(weeks), label: cadenceLabel(weeks) }))}
            value={field.value === undefined ? undefined : String(field.value)}
            onChange={(value) => field.onChange(Number(value))}
            error={errors.cadenceWeeks?.message}
          />
        )}
      />
    </div>
  );
}
