import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import type { LotFilters } from '../utils/lot-filters';
import { boundToCentsPerKg, centsPerKgToUnit, centsToDollarText, isPriceUnit, parseDollars, type PriceUnit } from '../utils/price-per-unit';

type PriceRange = Pick<LotFilters, 'minPricePerKgCents' | 'maxPricePerKgCents'>;

type PriceRangeFormProps = {
  range: PriceRange;
  unit: PriceUnit;
  onUnitChange: (unit: PriceUnit) => void;
  onChange: (range: PriceRange) => void;
};

type RangeErrors = { min?: string; max?: string };

function shownBound(centsPerKg: number | undefined, unit: PriceUnit): string {
  return centsPerKg === undefined ? '' : centsToDollarText(centsPerKgToUnit(centsPerKg, unit));
}

/**
 * Lowest and highest list price, typed in dollars per kg or per lb. The API filters per kg, so a
 * per-lb bound is converted exactly and rounded never to let in a lot outside the typed range.
 */
export function PriceRangeForm({ range, unit, onUnitChange, onChange }: PriceRangeFormProps) {
  const [errors, setErrors] = useState<RangeErrors>({});
  const per = unit === 'kg' ? 'per kg' : 'per lb';

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const minText = String(form.get('minPrice') ?? '').trim();
    const maxText = String(form.get('maxPrice') ?? '').trim();
    const min = minText === '' ? undefined : parseDollars(minText);
    const max = maxText === '' ? undefined : parseDollars(maxText);
    const found: RangeErrors = {};
    if (min === undefined && minText !== '') found.min = 'Enter dollars and cents, e.g. 18.50.';
    if (max === undefined && maxText !== '') found.max = 'Enter dollars and cents, e.g. 30.';
    if (min !== undefined && max !== undefined && min > max) found.min = 'The lowest price must not be above the highest.';
    setErrors(found);
    if (found.min || found.max) return;
    onChange({
      minPricePerKgCents: min === undefined ? undefined : boundToCentsPerKg(min, unit, 'min'),
      maxPricePerKgCents: max === undefined ? undefined : boundToCentsPerKg(max, unit, 'max'),
    });
  }

  return (
    // Remounted when the applied range or unit changes, so the boxes always show what is applied.
    <form
      key={`${unit}:${range.minPricePerKgCents ?? ''}:${range.maxPricePerKgCents ?? ''}`}
      aria-label="Price range"
      noValidate
      onSubmit={submit}
      className="grid grid-cols-2 gap-x-3 gap-y-4 sm:grid-cols-[auto_1fr_1fr_auto] sm:items-start"
    >
      <SelectField
        label="Prices"
        value={unit}
        className="col-span-2 sm:col-span-1"
        onChange={(event) => isPriceUnit(event.target.value) && onUnitChange(event.target.value)}
      >
        <option value="kg">$ per kg</option>
        <option value="lb">$ per lb</option>
      </SelectField>
      <TextField
        label={`Lowest ($ ${per})`}
        name="minPrice"
        inputMode="decimal"
        autoComplete="off"
        defaultValue={shownBound(range.minPricePerKgCents, unit)}
        error={errors.min}
      />
      <TextField
        label={`Highest ($ ${per})`}
        name="maxPrice"
        inputMode="decimal"
        autoComplete="off"
        defaultValue={shownBound(range.maxPricePerKgCents, unit)}
        error={errors.max}
      />
      <Button type="submit" variant="secondary" className="col-span-2 sm:col-span-1 sm:mt-6">
        Apply price
      </Button>
    </form>
  );
}
