import clsx from 'clsx';
import { Download } from 'lucide-react';
import { useId } from 'react';
import { Link } from 'react-router-dom';
import { orderSorts, type OrderSort } from '@shared/schemas/orders';
import { orderKinds, orderStatuses, type OrderKind, type OrderStatus } from '@shared/domain/vocabulary';
import { Button } from '@/components/ui/button';
import { controlStyles } from '@/components/ui/control-styles';
import { Field, fieldDescribedBy } from '@/components/ui/field';
import { TextField } from '@/components/ui/text-field';
import { SelectField } from '@/components/ui/select-field';
import { DownloadLink } from '@/components/ui/download-link';
import { paths } from '@/config/paths';
import { hasActiveFilters, ordersCsvHref, roasteryOrderFilterProblems, type RoasteryOrderFilters } from '../utils/order-filters';
import { orderKindLabels, orderSortLabels, staffStatusLabels } from '../utils/order-labels';

type OrderFiltersFormProps = {
  filters: RoasteryOrderFilters;
  onChange: (change: Partial<RoasteryOrderFilters>) => void;
};

const oneOf =
  <T extends string>(values: readonly T[]) =>
  (value: string): T | undefined =>
    (values as readonly string[]).includes(value) ? (value as T) : undefined;

function DateFilter({
  label,
  value,
  error,
  onChange,
}: {
  label: string;
  value: string | undefined;
  error?: string;
  onChange: (value: string | undefined) => void;
}) {
  const id = useId();
  return (
    <Field id={id} label={label} error={error}>
      <input
        id={id}
        type="date"
        value={value ?? ''}
        aria-invalid={error ? true : undefined}
        aria-describedby={fieldDescribedBy(id, undefined, error)}
        onChange={(event) => onChange(event.target.value || undefined)}
        className={clsx(controlStyles, error && 'border-alert')}
      />
    </Field>
  );
}

/** Filters apply as they change and go into the URL; the CSV link carries the same ones. */
export function OrderFiltersForm({ filters, onChange }: OrderFiltersFormProps) {
  const problems = roasteryOrderFilterProblems(filters);
  return (
    <div className="rounded-card border border-rule bg-sheet p-4 sm:p-5">
      <form aria-label="Filter orders" onSubmit={(event) => event.preventDefault()} className="grid grid-cols-2 gap-x-3 gap-y-4 lg:grid-cols-6 lg:items-start">
        <TextField
          label="Search"
          type="search"
          hint="Name, e-mail or order reference"
          className="col-span-2 lg:col-span-6"
          defaultValue={filters.q ?? ''}
          onChange={(event) => onChange({ q: event.target.value.trim() || undefined })}
        />
        <SelectField
          label="Status"
          value={filters.status ?? ''}
          onChange={(event) => onChange({ status: oneOf<OrderStatus>(orderStatuses)(event.target.value) })}
        >
          <option value="">Any status</option>
          {orderStatuses.map((status) => (
            <option key={status} value={status}>
              {staffStatusLabels[status].label}
            </option>
          ))}
        </SelectField>
        <SelectField label="Kind" value={filters.kind ?? ''} onChange={(event) => onChange({ kind: oneOf<OrderKind>(orderKinds)(event.target.value) })}>
          <option value="">Green and roasted</option>
          {orderKinds.map((kind) => (
            <option key={kind} value={kind}>
              {orderKindLabels[kind]}
            </option>
          ))}
        </SelectField>
        <DateFilter label="Placed from" value={filters.from} error={problems.from} onChange={(from) => onChange({ from })} />
        <DateFilter label="Placed until" value={filters.to} error={problems.to} onChange={(to) => onChange({ to })} />
        <DateFilter label="Roast date" value={filters.roastDate} error={problems.roastDate} onChange={(roastDate) => onChange({ roastDate })} />
        <SelectField label="Sort" value={filters.sort} onChange={(event) => onChange({ sort: oneOf<OrderSort>(orderSorts)(event.target.value) ?? 'newest' })}>
          {orderSorts.map((sort) => (
            <option key={sort} value={sort}>
              {orderSortLabels[sort]}
            </option>
          ))}
        </SelectField>
      </form>
      <div className="mt-4 flex flex-wrap items-center justify-between gap-3">
        {hasActiveFilters(filters) ? (
          <Link to={paths.roastery.orders.getHref()} className="text-small font-semibold text-leaf underline">
            Clear all filters
          </Link>
        ) : (
          <span className="text-small text-ink-muted">Showing every order.</span>
        )}
        {Object.keys(problems).length > 0 ? (
          <Button variant="secondary" disabled>
            <Download aria-hidden="true" className="size-4" />
            Download CSV
          </Button>
        ) : (
          <DownloadLink href={ordersCsvHref(filters)}>Download CSV</DownloadLink>
        )}
      </div>
    </div>
  );
}
