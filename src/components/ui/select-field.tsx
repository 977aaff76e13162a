import clsx from 'clsx';
import { useId, type ReactNode, type Ref, type SelectHTMLAttributes } from 'react';
import { controlStyles } from './control-styles';

type SelectFieldProps = Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> & { label: string; children: ReactNode; ref?: Ref<HTMLSelectElement> };

export function SelectField({ label, children, className, ...props }: SelectFieldProps) {
  const id = useId();
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-small font-semibold">
        {label}
      </label>
      <select id={id} className={clsx(controlStyles, 'mt-1')} {...props}>
        {children}
      </select>
    </div>
  );
}
