import { CircleAlert } from 'lucide-react';
import type { ReactNode } from 'react';

/** The ids a control points at with `aria-describedby`: its hint, then its error. */
export function fieldDescribedBy(id: string, hint: ReactNode, error: string | undefined): string | undefined {
  const ids = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter((part) => part !== null);
  return ids.length > 0 ? ids.join(' ') : undefined;
}

type FieldProps = {
  /** The control's id; the label points at it, and the hint and error hang off it. */
  id: string;
  label: string;
  hint?: ReactNode;
  error?: string;
  className?: string;
  children: ReactNode;
};

/** Label above, hint under the label, the control, then its error: each tied to the control by id. */
export function Field({ id, label, hint, error, className, children }: FieldProps) {
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-small font-semibold">
        {label}
      </label>
      {hint ? (
        <p id={`${id}-hint`} className="mt-0.5 text-small text-ink-muted">
          {hint}
        </p>
      ) : null}
      <div className="mt-1">{children}</div>
      {error ? (
        <p id={`${id}-error`} className="mt-1 flex items-start gap-1.5 text-small font-semibold text-alert">
          <CircleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0" />
          {error}
        </p>
      ) : null}
    </div>
  );
}
