import clsx from 'clsx';
import type { ButtonHTMLAttributes, Ref } from 'react';

type ButtonVariant = 'primary' | 'secondary';

/** Button looks, shared with links that act as calls to action. */
export function buttonStyles(variant: ButtonVariant = 'primary', className?: string): string {
  return clsx(
    'inline-flex min-h-11 items-center justify-center gap-2 rounded-control px-4 py-2 text-body font-semibold no-underline transition-colors',
    'disabled:cursor-not-allowed disabled:opacity-60',
    variant === 'primary' && 'bg-leaf text-sheet hover:bg-leaf-deep',
    variant === 'secondary' && 'border border-rule-strong bg-sheet text-ink hover:bg-paper-shade',
    className,
  );
}

type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & { variant?: ButtonVariant; ref?: Ref<HTMLButtonElement> };

export function Button({ variant = 'primary', className, type = 'button', ...props }: ButtonProps) {
  return <button type={type} className={buttonStyles(variant, className)} {...props} />;
}
