import { CircleAlert, CircleCheck } from 'lucide-react';
import type { ReactNode } from 'react';

/**
 * A message about a whole form: `alert` for a failure the person must act on (read out at once),
 * `status` for a quiet confirmation.
 */
export function FormAlert({ tone = 'alert', children }: { tone?: 'alert' | 'status'; children: ReactNode }) {
  const isAlert = tone === 'alert';
  return (
    <div
      role={isAlert ? 'alert' : 'status'}
      className={
        isAlert
          ? 'flex items-start gap-2 rounded-control border border-alert/40 bg-alert-wash px-4 py-3 text-ink'
          : 'flex items-start gap-2 rounded-control border border-ok/30 bg-ok-wash px-4 py-3 text-ink'
      }
    >
      {isAlert ? (
        <CircleAlert aria-hidden="true" className="mt-1 size-4 shrink-0 text-alert" />
      ) : (
        <CircleCheck aria-hidden="true" className="mt-1 size-4 shrink-0 text-ok" />
      )}
      <div>{children}</div>
    </div>
  );
}
