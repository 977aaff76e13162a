import clsx from 'clsx';
import type { InputHTMLAttributes, Ref } from 'react';

type CheckboxFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'type'> & { label: string; ref?: Ref<HTMLInputElement> };

export function CheckboxField({ label, className, ...props }: CheckboxFieldProps) {
  return (
    <label className={clsx('flex min-h-11 cursor-pointer items-center gap-2 text-body font-semibold', className)}>
      <input type="checkbox" className="size-5 accent-leaf" {...props} />
      {label}
    </label>
  );
}
