import clsx from 'clsx';

/** A placeholder block shown while content loads; purely visual. */
export function Skeleton({ className }: { className?: string }) {
  return <div aria-hidden="true" className={clsx('rounded-control bg-paper-shade motion-safe:animate-pulse', className)} />;
}
