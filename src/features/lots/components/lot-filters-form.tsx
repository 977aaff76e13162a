import clsx from 'clsx';
import { Search } from 'lucide-react';
import type { FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { processes, processLabels, roastLevelLabels, roastLevels, type Process, type RoastLevel } from '@shared/domain/vocabulary';
import { Button } from '@/components/ui/button';
import { CheckboxField } from '@/components/ui/checkbox-field';
import { controlStyles } from '@/components/ui/control-styles';
import { SelectField } from '@/components/ui/select-field';
import { paths } from '@/config/paths';
import { lotSorts, type LotSort } from '@shared/schemas/lots';
import { hasActiveFilters, type LotFilters } from '../utils/lot-filters';
import type { PriceUnit } from '../utils/price-per-unit';
import { PriceRangeForm } from './price-range-form';

type LotFiltersFormProps = {
  filters: LotFilters;
  /** Origins to offer; the current origin is always offered. */
  origins: string[];
  onChange: (change: Partial<LotFilters>) => void;
  priceUnit: PriceUnit;
  onPriceUnitChange: (unit: PriceUnit) => void;
};

const sortLabels: Record<LotSort, string> = {
  origin: 'Origin, A to Z',
  name: 'Name, A to Z',
  'price-asc': 'Price, lowest first',
  'price-desc': 'Price, highest first',
  newest: 'Newest crop first',
  altitude: 'Altitude, highest first',
};

function isLotSort(value: string): value is LotSort {
  return (lotSorts as readonly string[]).includes(value);
}

function isProcess(value: string): value is Process {
  return (processes as readonly string[]).includes(value);
}

function isRoastLevel(value: string): value is RoastLevel {
  return (roastLevels as readonly string[]).includes(value);
}

export function LotFiltersForm({ filters, origins, onChange, priceUnit, onPriceUnitChange }: LotFiltersFormProps) {
  const originOptions = filters.origin && !origins.includes(filters.origin) ? [filters.origin, ...origins] : origins;

  function submitSearch(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const q = new FormData(event.currentTarget).get('q');
    onChange({ q: typeof q === 'string' && q.trim() !== '' ? q.trim() : undefined });
  }

  return (
    <div className="rounded-card border border-rule bg-sheet p-4 sm:p-5">
      {/* Remounted when the URL's search word changes, so the box always shows what is applied. */}
      <form key={filters.q ?? ''} role="search" aria-label="Search green lots" onSubmit={submitSearch}>
        <label htmlFor="lot-search" className="block text-small font-semibold">
          Search
        </label>
        <div className="mt-1 flex gap-2">
          <input
            id="lot-search"
            name="q"
            type="search"
            defaultValue={filters.q ?? ''}
            placeholder="Name, region or tasting note"
            maxLength={100}
            className={clsx(controlStyles, 'min-w-0 flex-1')}
          />
          <Button type="submit" aria-label="Search">
            <Search aria-hidden="true" className="size-5" />
            <span className="hidden sm:inline">Search</span>
          </Button>
        </div>
      </form>

      <div className="mt-4 grid grid-cols-2 gap-x-3 gap-y-4 lg:grid-cols-4 lg:items-end">
        <SelectField label="Origin" value={filters.origin ?? ''} onChange={(event) => onChange({ origin: event.target.value || undefined })}>
          <option value="">Any origin</option>
          {originOptions.map((origin) => (
            <option key={origin} value={origin}>
              {origin}
            </option>
          ))}
        </SelectField>
        <SelectField
          label="Process"
          value={filters.process ?? ''}
          onChange={(event) => onChange({ process: isProcess(event.target.value) ? event.target.value : undefined })}
        >
          <option value="">Any process</option>
          {processes.map((process) => (
            <option key={process} value={process}>
              {processLabels[process]}
            </option>
          ))}
        </SelectField>
        <SelectField
          label="Suggested roast"
          value={filters.level ?? ''}
          onChange={(event) => onChange({ level: isRoastLevel(event.target.value) ? event.target.value : undefined })}
        >
          <option value="">Any roast level</option>
          {roastLevels.map((level) => (
            <option key={level} value={level}>
              {roastLevelLabels[level]}
            </option>
          ))}
        </SelectField>
        <CheckboxField
          className="col-span-2 lg:col-span-1"
          label="In stock only"
          checked={filters.inStock === true}
          onChange={(event) => onChange({ inStock: event.target.checked || undefined })}
        />
      </div>

      <div className="mt-4 grid gap-4 border-t border-rule pt-4 lg:grid-cols-[1fr_auto] lg:items-start">
        <PriceRangeForm
          range={{ minPricePerKgCents: filters.minPricePerKgCents, maxPricePerKgCents: filters.maxPricePerKgCents }}
          unit={priceUnit}
          onUnitChange={onPriceUnitChange}
          onChange={onChange}
        />
        <SelectField
          label="Sort by"
          value={filters.sort ?? 'origin'}
          onChange={(event) => onChange({ sort: isLotSort(event.target.value) ? event.target.value : undefined })}
        >
          {lotSorts.map((sort) => (
            <option key={sort} value={sort}>
              {sortLabels[sort]}
            </option>
          ))}
        </SelectField>
      </div>

      {hasActiveFilters(filters) ? (
        <p className="mt-3 text-small">
          <Link to={paths.lots.getHref()} className="font-semibold text-leaf underline">
            Clear all filters
          </Link>
        </p>
      ) : null}
    </div>
  );
}
