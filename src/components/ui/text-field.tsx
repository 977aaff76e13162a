import clsx from 'clsx';
import { useId, type InputHTMLAttributes, type ReactNode, type Ref } from 'react';
import { controlStyles } from './control-styles';
import { Field, fieldDescribedBy } from './field';

type TextFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> & {
  label: string;
  hint?: ReactNode;
  error?: string;
  ref?: Ref<HTMLInputElement>;
};

/** A labelled text input whose hint and error are read out with it. */
export function TextField({ label, hint, error, className, ref, ...props }: TextFieldProps) {
  const id = useId();
  return (
    <Field id={id} label={label} hint={hint} error={error} className={className}>
      <input
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={fieldDescribedBy(id, hint, error)}
        className={clsx(controlStyles, error && 'border-alert')}
        {...props}
      />
    </Field>
  );
}
