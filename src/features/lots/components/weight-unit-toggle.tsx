import clsx from 'clsx';
import { useId } from 'react';
import type { WeightUnit } from '../utils/weight-unit';

const units: { unit: WeightUnit; label: string }[] = [
  { unit: 'g', label: 'Grams' },
  { unit: 'oz', label: 'Ounces' },
];

/** Switches the lot page's weights between grams and ounces. */
export function WeightUnitToggle({ unit, onChange }: { unit: WeightUnit; onChange: (unit: WeightUnit) => void }) {
  const labelId = useId();
  return (
    <div className="flex flex-wrap items-center gap-3">
      <span id={labelId} className="text-small text-ink-muted">
        Show weights in
      </span>
      <div role="group" aria-labelledby={labelId} className="inline-flex rounded-control border border-rule-strong bg-sheet p-0.5">
        {units.map((each) => (
          <button
            key={each.unit}
            type="button"
            aria-pressed={unit === each.unit}
            onClick={() => onChange(each.unit)}
            className={clsx(
              'min-h-10 rounded-control px-3 text-small font-semibold',
              unit === each.unit ? 'bg-leaf text-sheet' : 'text-ink hover:bg-paper-shade',
            )}
          >
            {each.label}
          </button>
        ))}
      </div>
    </div>
  );
}
