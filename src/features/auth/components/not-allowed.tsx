import { ShieldX } from 'lucide-react';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { buttonStyles } from '@/components/ui/button';
import { paths } from '@/config/paths';

/** Shown in place of a page the signed-in person's role does not open, instead of a blank screen. */
export function NotAllowed({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="mx-auto max-w-prose rounded-card border border-rule bg-sheet p-6 text-center shadow-card sm:p-10">
      <PageTitle title={title} />
      <ShieldX aria-hidden="true" className="mx-auto size-8 text-ember" />
      <h1 className="mt-3 text-h1">{title}</h1>
      <div className="mt-3 text-ink-muted">{children}</div>
      <div className="mt-6 flex flex-wrap justify-center gap-3">
        <Link to={paths.home.getHref()} className={buttonStyles('primary')}>
          Go to the shop
        </Link>
        <Link to={paths.account.overview.getHref()} className={buttonStyles('secondary')}>
          Your account
        </Link>
      </div>
    </section>
  );
}
