import clsx from 'clsx';
import { useId, type ReactNode, type Ref, type TextareaHTMLAttributes } from 'react';
import { controlStyles } from './control-styles';
import { Field, fieldDescribedBy } from './field';

type TextAreaFieldProps = Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> & {
  label: string;
  hint?: ReactNode;
  error?: string;
  ref?: Ref<HTMLTextAreaElement>;
};

/** A labelled multi-line input whose hint and error are read out with it. */
export function TextAreaField({ label, hint, error, className, ref, rows = 4, ...props }: TextAreaFieldProps) {
  const id = useId();
  return (
    <Field id={id} label={label} hint={hint} error={error} className={className}>
      <textarea
        id={id}
        ref={ref}
        rows={rows}
        aria-invalid={error ? true : undefined}
        aria-describedby={fieldDescribedBy(id, hint, error)}
        className={clsx(controlStyles, error && 'border-alert')}
        {...props}
      />
    </Field>
  );
}
