import type { ReactNode } from 'react';

export function PageHeader({ eyebrow, title, lead }: { eyebrow?: string; title: string; lead?: ReactNode }) {
  return (
    <header className="mb-8">
      {eyebrow ? <p className="text-small font-semibold tracking-wide text-ember uppercase">{eyebrow}</p> : null}
      <h1 className="mt-1 text-h1">{title}</h1>
      {lead ? <p className="mt-3 max-w-prose text-lead text-ink-muted">{lead}</p> : null}
    </header>
  );
}
