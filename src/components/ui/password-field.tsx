import clsx from 'clsx';
import { Eye, EyeOff } from 'lucide-react';
import { useId, useState, type InputHTMLAttributes, type ReactNode, type Ref } from 'react';
import { controlStyles } from './control-styles';
import { Field, fieldDescribedBy } from './field';

type PasswordFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'id' | 'type' | 'autoComplete'> & {
  label: string;
  /** `current-password` to sign in or confirm, `new-password` to choose one: password managers go by it. */
  autoComplete: 'current-password' | 'new-password';
  hint?: ReactNode;
  error?: string;
  ref?: Ref<HTMLInputElement>;
};

/** A password input with a show/hide toggle; pasting and password managers work as usual. */
export function PasswordField({ label, hint, error, className, ref, ...props }: PasswordFieldProps) {
  const id = useId();
  const [visible, setVisible] = useState(false);
  return (
    <Field id={id} label={label} hint={hint} error={error} className={className}>
      <div className="flex gap-2">
        <input
          id={id}
          ref={ref}
          type={visible ? 'text' : 'password'}
          spellCheck={false}
          autoCapitalize="none"
          aria-invalid={error ? true : undefined}
          aria-describedby={fieldDescribedBy(id, hint, error)}
          className={clsx(controlStyles, 'min-w-0 flex-1', error && 'border-alert')}
          {...props}
        />
        <button
          type="button"
          aria-controls={id}
          aria-pressed={visible}
          aria-label={`Show ${label.toLowerCase()}`}
          onClick={() => setVisible((shown) => !shown)}
          className="inline-flex min-h-11 min-w-11 shrink-0 items-center justify-center gap-1.5 rounded-control border border-rule-strong bg-sheet px-3 text-small font-semibold text-ink hover:bg-paper-shade"
        >
          {visible ? <EyeOff aria-hidden="true" className="size-4" /> : <Eye aria-hidden="true" className="size-4" />}
          <span aria-hidden="true">{visible ? 'Hide' : 'Show'}</span>
        </button>
      </div>
    </Field>
  );
}
