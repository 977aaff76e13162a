import clsx from 'clsx';
import { CircleAlert } from 'lucide-react';
import { useId, type ReactNode } from 'react';

export type Choice<T extends string> = {
  value: T;
  label: ReactNode;
  /** A second line under the label, read out with it. */
  detail?: ReactNode;
  disabled?: boolean;
};

type ChoiceGroupProps<T extends string> = {
  legend: string;
  /** Under the legend; the group is described by it. */
  hint?: ReactNode;
  error?: string;
  /** Radio `name`; unique on the page. */
  name: string;
  choices: readonly Choice<T>[];
  value: T | undefined;
  onChange: (value: T) => void;
  /** Grid columns from the small breakpoint up. */
  columns?: 2 | 3 | 4;
  className?: string;
};

const columnStyles = { 2: 'sm:grid-cols-2', 3: 'sm:grid-cols-3', 4: 'sm:grid-cols-2 lg:grid-cols-4' } as const;

/**
 * One choice among a few, as a fieldset of radio buttons drawn as cards: arrow keys move between
 * them as with any radio group, and the legend, hint and error are read out with the group.
 */
export function ChoiceGroup<T extends string>({ legend, hint, error, name, choices, value, onChange, columns = 3, className }: ChoiceGroupProps<T>) {
  const id = useId();
  const describedBy = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter((part) => part !== null).join(' ') || undefined;
  return (
    <fieldset className={className} aria-describedby={describedBy} aria-invalid={error ? true : undefined}>
      <legend className="text-body font-semibold">{legend}</legend>
      {hint ? (
        <p id={`${id}-hint`} className="mt-0.5 text-small text-ink-muted">
          {hint}
        </p>
      ) : null}
      <div className={clsx('mt-2 grid gap-2', columnStyles[columns])}>
        {choices.map((choice) => {
          const checked = choice.value === value;
          return (
            <label
              key={choice.value}
              className={clsx(
                'flex min-h-11 cursor-pointer items-start gap-2 rounded-control border px-3 py-2 has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-focus',
                checked ? 'border-leaf bg-leaf-wash' : 'border-rule-strong bg-sheet hover:bg-paper-shade',
                choice.disabled && 'cursor-not-allowed opacity-60',
                error && !checked && 'border-alert',
              )}
            >
              <input
                type="radio"
                name={name}
                value={choice.value}
                checked={checked}
                disabled={choice.disabled}
                onChange={() => onChange(choice.value)}
                className="mt-1 size-4 shrink-0 accent-leaf"
              />
              <span className="flex flex-col">
                <span className="font-semibold">{choice.label}</span>
                {choice.detail ? <span className="text-small text-ink-muted">{choice.detail}</span> : null}
              </span>
            </label>
          );
        })}
      </div>
      {error ? (
        <p id={`${id}-error`} className="mt-1 flex items-start gap-1.5 text-small font-semibold text-alert">
          <CircleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0" />
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}
