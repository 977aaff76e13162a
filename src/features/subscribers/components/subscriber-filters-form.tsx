import { cadences, roastersRotationName, roastLevelLabels, roastLevels, subscriptionStatuses } from '@shared/domain/vocabulary';
import { rotationLotFilter, type SubscriberSort } from '@shared/schemas/subscribers';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { cadenceLabel, subscriptionStatusLabels } from '@/lib/subscription-labels';
import type { SubscriberFilters } from '../utils/subscriber-filters';

type SubscriberFiltersFormProps = {
  filters: SubscriberFilters;
  /** Lots a subscriber may be on, by code and name. */
  lots: readonly { code: string; name: string }[];
  onChange: (change: Partial<SubscriberFilters>) => void;
};

const sortLabels: Record<SubscriberSort, string> = {
  newest: 'Newest first',
  oldest: 'Oldest first',
  name: 'Name',
  'next-roast': 'Next roast day',
};

/** Each filter applies as soon as it changes and lives in the URL, so a filtered view can be shared. */
export function SubscriberFiltersForm({ filters, lots, onChange }: SubscriberFiltersFormProps) {
  return (
    <form
      role="search"
      aria-label="Filter subscribers"
      className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3 xl:grid-cols-6"
      onSubmit={(event) => event.preventDefault()}
    >
      <TextField
        label="Name or e-mail"
        type="search"
        defaultValue={filters.q ?? ''}
        onChange={(event) => onChange({ q: event.target.value.trim() || undefined, page: 1 })}
      />
      <SelectField
        label="Status"
        value={filters.status ?? ''}
        onChange={(event) => onChange({ status: (event.target.value || undefined) as SubscriberFilters['status'], page: 1 })}
      >
        <option value="">All but unpaid</option>
        {subscriptionStatuses.map((status) => (
          <option key={status} value={status}>
            {subscriptionStatusLabels[status].label}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Roast level"
        value={filters.level ?? ''}
        onChange={(event) => onChange({ level: (event.target.value || undefined) as SubscriberFilters['level'], page: 1 })}
      >
        <option value="">Every level</option>
        {roastLevels.map((level) => (
          <option key={level} value={level}>
            {roastLevelLabels[level]}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Cadence"
        value={filters.cadence === undefined ? '' : String(filters.cadence)}
        onChange={(event) => onChange({ cadence: event.target.value ? Number(event.target.value) : undefined, page: 1 })}
      >
        <option value="">Any cadence</option>
        {cadences.map((weeks) => (
          <option key={weeks} value={weeks}>
            {cadenceLabel(weeks)}
          </option>
        ))}
      </SelectField>
      <SelectField label="Coffee" value={filters.lot ?? ''} onChange={(event) => onChange({ lot: event.target.value || undefined, page: 1 })}>
        <option value="">Every coffee</option>
        <option value={rotationLotFilter}>{roastersRotationName}</option>
        {lots.map((lot) => (
          <option key={lot.code} value={lot.code}>
            {lot.name} ({lot.code})
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Sort by"
        value={filters.sort ?? 'newest'}
        onChange={(event) => onChange({ sort: event.target.value === 'newest' ? undefined : (event.target.value as SubscriberSort), page: 1 })}
      >
        {Object.entries(sortLabels).map(([sort, label]) => (
          <option key={sort} value={sort}>
            {label}
          </option>
        ))}
      </SelectField>
    </form>
  );
}
