import clsx from 'clsx';
import type { ReactNode } from 'react';

export type BadgeTone = 'neutral' | 'ok' | 'alert';

const tones: Record<BadgeTone, string> = {
  neutral: 'bg-paper-shade text-ink',
  ok: 'bg-ok-wash text-ok',
  alert: 'bg-alert-wash text-alert',
};

export function Badge({ tone = 'neutral', children, className }: { tone?: BadgeTone; children: ReactNode; className?: string }) {
  return (
    <span className={clsx('inline-flex items-center gap-1 rounded-pill px-2.5 py-0.5 text-caption font-semibold', tones[tone], className)}>{children}</span>
  );
}
