import type { ReactNode } from 'react';

export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="rounded-card border border-dashed border-rule-strong bg-sheet px-6 py-10 text-center">
      <h2 className="text-h3">{title}</h2>
      {children ? <div className="mx-auto mt-2 max-w-prose text-ink-muted">{children}</div> : null}
      {action ? <div className="mt-5 flex justify-center">{action}</div> : null}
    </div>
  );
}
