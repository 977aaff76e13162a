import type { ReactNode } from 'react';
import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { RestdayMark } from '@/components/brand/restday-mark';
import { PageTitle } from '@/components/seo/page-title';
import { Button } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { NotFoundMessage } from './not-found-message';

function isNotFound(error: unknown): boolean {
  if (isRouteErrorResponse(error)) return error.status === 404;
  return error instanceof ApiError && error.status === 404;
}

/**
 * The router's error element. A 404 shows the not-found page; anything else offers a reload and a
 * way home. Inside an area layout it fills the layout's main region; `standalone` (the outermost
 * boundary, when no layout could render) brings its own landmark and the product name.
 */
export function RouteErrorBoundary({ standalone = false }: { standalone?: boolean }) {
  const error = useRouteError();

  const content = isNotFound(error) ? (
    <>
      <PageTitle title="Page not found" />
      <NotFoundMessage />
    </>
  ) : (
    <div className="mx-auto max-w-prose py-12 text-center">
      <PageTitle title="Something went wrong" />
      <h1 className="text-h1">Something went wrong</h1>
      <p className="mt-3 text-lead text-ink-muted">This page stopped working. Reloading usually fixes it; if it keeps happening, try again a little later.</p>
      <div className="mt-8 flex flex-wrap justify-center gap-3">
        <Button onClick={() => window.location.reload()}>Reload the page</Button>
        <Link to={paths.home.getHref()} className="inline-flex min-h-11 items-center px-2 font-semibold text-leaf underline">
          Go to the home page
        </Link>
      </div>
    </div>
  );

  return standalone ? <StandaloneFrame>{content}</StandaloneFrame> : content;
}

function StandaloneFrame({ children }: { children: ReactNode }) {
  return (
    <div className="mx-auto max-w-page px-4 py-6 sm:px-6">
      <a href={paths.home.getHref()} className="inline-flex items-center gap-2 font-heading font-semibold text-h3 text-ink no-underline">
        <RestdayMark className="size-8" />
        Restday
      </a>
      <main id="main">{children}</main>
    </div>
  );
}
