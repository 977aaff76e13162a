import { TriangleAlert } from 'lucide-react';
import type { ReactNode } from 'react';

/** Safety cautions, set apart so a reader cannot miss them. */
export function CautionPanel({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section aria-label={title} className="rounded-card border border-caution/40 bg-caution-wash p-5 sm:p-6">
      <h2 className="flex items-center gap-2 text-h3 text-caution">
        <TriangleAlert aria-hidden="true" className="size-5 shrink-0" />
        {title}
      </h2>
      <div className="mt-3 text-ink">{children}</div>
    </section>
  );
}
