import { zodResolver } from '@hookform/resolvers/zod';
import { Plus, Trash2 } from 'lucide-react';
import { useState, type ReactNode } from 'react';
import { useFieldArray, useForm, useWatch, type Path } from 'react-hook-form';
import { TRACKING_PLACEHOLDER } from '@shared/domain/carriers';
import { shopCurrencies } from '@shared/domain/money';
import { roastedBagSizes, roastLevelLabels, roastLevels, shipPolicies, shipPolicyLabels, weekdayLabels, weekdays } from '@shared/domain/vocabulary';
import { shopSettingsUpdateSchema, type PlaceOfBusiness, type ShopSettings, type ShopSettingsInput } from '@shared/schemas/settings';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useUpdateShopSettings } from '../api/update-shop-settings';
import { fieldPaths } from '../utils/settings-paths';
import { CentsField } from './cents-field';

type SettingsPath = Path<ShopSettingsInput>;

const emptyPlaceOfBusiness: PlaceOfBusiness = { line1: '', line2: null, city: '', region: '', postalCode: '', country: 'US' };

/** The zones this browser knows, with the saved one kept even where the list lacks it (e.g. UTC). */
function timeZoneChoices(saved: string): string[] {
  const zones = Intl.supportedValuesOf('timeZone');
  return zones.includes(saved) ? zones : [saved, ...zones];
}

const bagSizeLabels = { '12oz': '12 oz bag', '1lb': '1 lb bag', '2lb': '2 lb bag' } as const;

function Group({ title, description, children }: { title: string; description?: string; children: ReactNode }) {
  return (
    <fieldset className="rounded-card border border-rule bg-sheet p-5 shadow-card">
      <legend className="px-1 font-heading text-h3 font-semibold">{title}</legend>
      {description ? <p className="mb-4 text-small text-ink-muted">{description}</p> : null}
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">{children}</div>
    </fieldset>
  );
}

/** Every shop setting in one form, checked by the same schema the server uses. */
export function ShopSettingsForm({ settings }: { settings: ShopSettings }) {
  const form = useForm<ShopSettingsInput, unknown, ShopSettings>({
    resolver: zodResolver(shopSettingsUpdateSchema),
    // A shop that has not entered its place of business yet starts from empty address fields.
    defaultValues: { ...settings, placeOfBusiness: settings.placeOfBusiness ?? emptyPlaceOfBusiness },
  });
  const bands = useFieldArray({ control: form.control, name: 'shipping.bands' });
  const carriers = useFieldArray({ control: form.control, name: 'carriers' });
  const save = useUpdateShopSettings();
  const [formError, setFormError] = useState<string>();
  const [saved, setSaved] = useState(false);
  const currency = useWatch({ control: form.control, name: 'currency' }) ?? 'usd';
  // Held by value: the long option list renders after the form first sets the field.
  const timeZone = useWatch({ control: form.control, name: 'timeZone' });

  const errorAt = (name: SettingsPath) => form.getFieldState(name, form.formState).error?.message;
  const number = (name: SettingsPath) => form.register(name, { valueAsNumber: true });
  const numberField = (name: SettingsPath, label: string, hint?: string, step = '1') => (
    <TextField key={name} label={label} hint={hint} type="number" step={step} inputMode="decimal" error={errorAt(name)} {...number(name)} />
  );

  const addressField = (field: keyof PlaceOfBusiness, label: string, autoComplete: string, className?: string, hint?: string) => (
    <TextField
      key={field}
      label={label}
      hint={hint}
      autoComplete={autoComplete}
      className={className}
      error={errorAt(`placeOfBusiness.${field}`) ?? (field === 'line1' ? errorAt('placeOfBusiness') : undefined)}
      {...form.register(`placeOfBusiness.${field}`)}
    />
  );

  const submit = form.handleSubmit(async (values) => {
    setFormError(undefined);
    setSaved(false);
    try {
      const stored = await save.mutateAsync(values);
      form.reset(stored);
      setSaved(true);
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, fieldPaths(settings) as SettingsPath[]));
    }
  });

  function weekdayChoices(name: 'roastWeekdays' | 'shipWeekdays', legend: string) {
    const error = errorAt(name);
    return (
      <fieldset className="sm:col-span-2 lg:col-span-3" aria-describedby={error ? `${name}-error` : undefined}>
        <legend className="text-small font-semibold">{legend}</legend>
        <div className="mt-1 flex flex-wrap gap-x-4">
          {weekdays.map((weekday) => (
            <label key={weekday} className="flex min-h-11 items-center gap-2">
              <input type="checkbox" value={weekday} className="size-5 accent-leaf" {...form.register(name)} />
              {weekdayLabels[weekday]}
            </label>
          ))}
        </div>
        {error ? (
          <p id={`${name}-error`} className="mt-1 text-small font-semibold text-alert">
            {error}
          </p>
        ) : null}
      </fieldset>
    );
  }

  return (
    <form noValidate onSubmit={(event) => void submit(event)} className="grid gap-6">
      {formError ? <FormAlert>{formError}</FormAlert> : null}
      {saved ? <FormAlert tone="status">Settings saved.</FormAlert> : null}

      <Group title="Shop" description="Days and times are read in the shop’s time zone.">
        <SelectField label="Time zone" {...form.register('timeZone')} value={timeZone}>
          {timeZoneChoices(settings.timeZone).map((zone) => (
            <option key={zone} value={zone}>
              {zone.replaceAll('_', ' ')}
            </option>
          ))}
        </SelectField>
        <SelectField label="Currency" {...form.register('currency')}>
          {shopCurrencies.map((code) => (
            <option key={code} value={code}>
              {code.toUpperCase()}
            </option>
          ))}
        </SelectField>
      </Group>

      <Group title="Roast and ship days" description="An order paid before the cutoff is roasted on the next open roast day.">
        {weekdayChoices('roastWeekdays', 'Roast days')}
        <TextField label="Order cutoff time" hint="24-hour HH:MM." autoComplete="off" error={errorAt('cutoff.time')} {...form.register('cutoff.time')} />
        {numberField('cutoff.daysBefore', 'Cutoff, days before the roast')}
        {weekdayChoices('shipWeekdays', 'Ship days')}
        {numberField('transitDays', 'Transit days')}
        {numberField('degasHoldDays', 'Degassing hold before shipping (days)')}
        <fieldset className="sm:col-span-2 lg:col-span-3">
          <legend className="text-small font-semibold">When roasted coffee ships</legend>
          <div className="mt-1 grid gap-1">
            {shipPolicies.map((policy) => (
              <label key={policy} className="flex min-h-11 items-center gap-2">
                <input type="radio" value={policy} className="size-5 accent-leaf" {...form.register('shipPolicy')} />
                {shipPolicyLabels[policy]}
              </label>
            ))}
          </div>
          <p className="text-small text-ink-muted">
            Ready on arrival holds a bag until it will have rested by the time it lands (ship date at least the ready-from date less the transit days).
          </p>
        </fieldset>
        <label className="flex min-h-11 items-center gap-2 sm:col-span-2 lg:col-span-3">
          <input type="checkbox" className="size-5 accent-leaf" {...form.register('holdOverWeekend')} />
          No parcel sits over a weekend: hold a roasted parcel that would be in transit on a Saturday or Sunday until a ship day from which it is not
        </label>
        <p className="text-small text-ink-muted sm:col-span-2 lg:col-span-3">
          US federal holidays are neither ship days nor transit days; close or open shipping on any day on the Roast Calendar.
        </p>
      </Group>

      <Group title="Rest and best-before" description="The ready-from date is the roast date plus the rest for the brew method and the level’s adjustment.">
        {numberField('restDays.filter', 'Rest for filter (days)')}
        {numberField('restDays.espresso', 'Rest for espresso (days)')}
        {numberField('bestBeforeDays', 'Best-before, days after roasting')}
        {roastLevels.map((level) => numberField(`restAdjustDays.${level}`, `Rest adjustment, ${roastLevelLabels[level]} (days)`, 'From −14 to 14.'))}
      </Group>

      <Group title="Roaster and capacity">
        {numberField('roaster.capacityGrams', 'Roaster capacity (g of green a batch)')}
        {numberField('roaster.minLoadPct', 'Preferred minimum load (%)', undefined, '0.01')}
        {numberField('roaster.maxLoadPct', 'Preferred maximum load (%)', undefined, '0.01')}
        {numberField('dayCapacityGrams', 'Daily capacity (g of green)', 'Each roast day can override it on the Roast Calendar.')}
        {numberField('overagePct', 'Overage (%)', 'Extra roasted weight planned per line.', '0.01')}
      </Group>

      <Group
        title="Loss model"
        description="The roast loss planned for each level until a lot has enough batches of its own; batches outside the range are flagged."
      >
        {numberField('lossModelMinBatches', 'Batches before a lot’s own loss is used')}
        {roastLevels.map((level) => (
          <fieldset key={level} className="sm:col-span-2 lg:col-span-3">
            <legend className="text-small font-semibold">{roastLevelLabels[level]}</legend>
            <div className="mt-1 grid gap-4 sm:grid-cols-3">
              {numberField(`lossModel.${level}.minPct`, 'Lowest loss (%)', undefined, '0.01')}
              {numberField(`lossModel.${level}.defaultPct`, 'Planned loss (%)', undefined, '0.01')}
              {numberField(`lossModel.${level}.maxPct`, 'Highest loss (%)', undefined, '0.01')}
            </div>
          </fieldset>
        ))}
      </Group>

      <Group title="Prices and reminders">
        {roastedBagSizes.map((size) => (
          <CentsField
            key={size}
            control={form.control}
            name={`roastedBagPriceCents.${size}`}
            label={`Roasted ${bagSizeLabels[size]}`}
            currency={currency}
            error={errorAt(`roastedBagPriceCents.${size}`)}
          />
        ))}
        {numberField('subscriptionDiscountPct', 'Subscription discount (%)', undefined, '0.01')}
        {numberField('renewalReminderDays', 'Renewal reminder, days before the charge', '0 sends none.')}
      </Group>

      <Group
        title="Place of business"
        description="The shop’s street address. Every bag label prints it under the shop’s name, as a packed food label must say where it was packed."
      >
        {addressField('line1', 'Street address', 'address-line1', 'sm:col-span-2')}
        {addressField('line2', 'Second line (optional)', 'address-line2')}
        {addressField('city', 'City or town', 'address-level2')}
        {addressField('region', 'State or region', 'address-level1')}
        {addressField('postalCode', 'Postal code', 'postal-code')}
        {addressField('country', 'Country', 'country', undefined, 'Two letters, e.g. US.')}
      </Group>

      <Group title="Shipping" description="Parcel weight is the coffee, each bag’s tare and the box; the first band it fits sets the price.">
        {numberField('shipping.bagTareGrams', 'Bag tare (g)')}
        {numberField('shipping.boxTareGrams', 'Box tare (g)')}
        <div className="sm:col-span-2 lg:col-span-3">
          <ol aria-label="Weight bands" className="grid gap-3">
            {bands.fields.map((band, index) => (
              <li key={band.id} className="flex flex-wrap items-end gap-3">
                <TextField
                  label={`Band ${index + 1}: up to (g)`}
                  type="number"
                  step="1"
                  error={errorAt(`shipping.bands.${index}.maxGrams`)}
                  {...number(`shipping.bands.${index}.maxGrams`)}
                />
                <CentsField
                  control={form.control}
                  name={`shipping.bands.${index}.cents`}
                  label={`Band ${index + 1}: price`}
                  currency={currency}
                  error={errorAt(`shipping.bands.${index}.cents`)}
                />
                <Button variant="secondary" disabled={bands.fields.length === 1} onClick={() => bands.remove(index)}>
                  <Trash2 aria-hidden="true" className="size-4" />
                  Remove band {index + 1}
                </Button>
              </li>
            ))}
          </ol>
          {errorAt('shipping.bands') ? <p className="mt-2 text-small font-semibold text-alert">{errorAt('shipping.bands')}</p> : null}
          <Button variant="secondary" className="mt-3" onClick={() => bands.append({ maxGrams: Number.NaN, cents: 0 })}>
            <Plus aria-hidden="true" className="size-4" />
            Add a band
          </Button>
        </div>
      </Group>

      <Group
        title="Carriers"
        description={`The shipped e-mail links a listed carrier’s tracking page, with the tracking number where ${TRACKING_PLACEHOLDER} stands; any other carrier’s e-mail shows the number alone.`}
      >
        <div className="sm:col-span-2 lg:col-span-3">
          <ol aria-label="Carriers" className="grid gap-3">
            {carriers.fields.map((carrier, index) => (
              <li key={carrier.id} className="flex flex-wrap items-end gap-3">
                <TextField
                  label={`Carrier ${index + 1}: name`}
                  autoComplete="off"
                  error={errorAt(`carriers.${index}.name`)}
                  {...form.register(`carriers.${index}.name`)}
                />
                <TextField
                  label={`Carrier ${index + 1}: tracking page`}
                  hint={`https://… with ${TRACKING_PLACEHOLDER}`}
                  type="url"
                  autoComplete="off"
                  spellCheck={false}
                  error={errorAt(`carriers.${index}.trackingUrlTemplate`)}
                  {...form.register(`carriers.${index}.trackingUrlTemplate`)}
                />
                <Button variant="secondary" onClick={() => carriers.remove(index)}>
                  <Trash2 aria-hidden="true" className="size-4" />
                  Remove carrier {index + 1}
                </Button>
              </li>
            ))}
          </ol>
          {errorAt('carriers') ? <p className="mt-2 text-small font-semibold text-alert">{errorAt('carriers')}</p> : null}
          <Button variant="secondary" className="mt-3" onClick={() => carriers.append({ name: '', trackingUrlTemplate: '' })}>
            <Plus aria-hidden="true" className="size-4" />
            Add a carrier
          </Button>
        </div>
      </Group>

      <div>
        <Button type="submit" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? 'Saving…' : 'Save settings'}
        </Button>
      </div>
    </form>
  );
}
