import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { buttonStyles } from '@/components/ui/button';
import { paths } from '@/config/paths';

export function NotFoundMessage({ title = 'Page not found', children }: { title?: string; children?: ReactNode }) {
  return (
    <div className="mx-auto max-w-prose py-12 text-center">
      <p className="font-heading font-semibold text-display text-ember" aria-hidden="true">
        404
      </p>
      <h1 className="mt-2 text-h1">{title}</h1>
      <p className="mt-3 text-lead text-ink-muted">{children ?? 'There is nothing at this address. It may have moved, or the link may be mistyped.'}</p>
      <div className="mt-8 flex flex-wrap justify-center gap-3">
        <Link to={paths.home.getHref()} className={buttonStyles('primary')}>
          Go to the home page
        </Link>
        <Link to={paths.lots.getHref()} className={buttonStyles('secondary')}>
          Browse Green Lots
        </Link>
      </div>
    </div>
  );
}
