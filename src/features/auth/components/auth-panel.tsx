import type { ReactNode } from 'react';
import { PageTitle } from '@/components/seo/page-title';

type AuthPanelProps = {
  title: string;
  lead?: ReactNode;
  children: ReactNode;
  /** Links to the neighbouring steps (create an account, back to sign in). */
  footer?: ReactNode;
};

/** The narrow card every sign-in step sits on. */
export function AuthPanel({ title, lead, children, footer }: AuthPanelProps) {
  return (
    <div className="mx-auto w-full max-w-md">
      <PageTitle title={title} />
      <div className="rounded-card border border-rule bg-sheet p-6 shadow-card sm:p-8">
        <h1 className="text-h1">{title}</h1>
        {lead ? <p className="mt-2 text-ink-muted">{lead}</p> : null}
        <div className="mt-6">{children}</div>
      </div>
      {footer ? <div className="mt-5 text-center">{footer}</div> : null}
    </div>
  );
}
