// The shop's public pages rendered on the server, so the first paint has the real content before
// any JavaScript runs (decision 0077). Built with `vite build --ssr` into dist/.ssr and loaded by
// the server's storefront module; the browser starts from the same query cache (src/main.tsx).
import { AsyncLocalStorage } from 'node:async_hooks';
import { dehydrate, QueryClientProvider, type DehydratedState, type QueryClient } from '@tanstack/react-query';
import { renderToString } from 'react-dom/server';
import { createStaticHandler, createStaticRouter, StaticRouterProvider } from 'react-router-dom';
import { createAppRoutes } from './app/router';
import { takeFirstAnswersFrom } from './lib/api-client';
import { createQueryClient } from './lib/query-client';

export interface RenderedPage {
  /** The markup inside #root. */
  html: string;
  /** The query cache the markup was rendered from, for the browser's first render. */
  queryState: DehydratedState;
}

const pageAnswers = new AsyncLocalStorage<Map<string, unknown>>();
takeFirstAnswersFrom((url) => pageAnswers.getStore()?.get(url));

/** Runs every query the page has asked for so far, from the page's answers. */
async function settle(queryClient: QueryClient) {
  const waiting = queryClient
    .getQueryCache()
    .getAll()
    .filter((query) => query.state.status === 'pending');
  await Promise.allSettled(waiting.map((query) => query.fetch()));
  // A query the server had no answer for stays pending, as it is in the browser before it asks.
  queryClient.removeQueries({ predicate: (query) => query.state.status === 'error' });
}

/**
 * Renders `url` with the API answers the storefront loaded for it. Null when the page cannot be
 * rendered here (a redirect, or a route that failed): the browser then renders it alone.
 */
export async function renderPage(url: string, answers: Record<string, unknown>): Promise<RenderedPage | null> {
  return pageAnswers.run(new Map(Object.entries(answers)), async () => {
    const queryClient = createQueryClient();
    // No retries and no garbage-collection timers: the cache lives for this one render.
    queryClient.setDefaultOptions({ queries: { ...queryClient.getDefaultOptions().queries, retry: false, gcTime: Infinity } });
    const handler = createStaticHandler(createAppRoutes(queryClient));
    const context = await handler.query(new Request(url));
    if (context instanceof Response || context.errors) return null;
    const router = createStaticRouter(handler.dataRoutes, context);
    const render = () =>
      renderToString(
        <QueryClientProvider client={queryClient}>
          <StaticRouterProvider router={router} context={context} hydrate={false} />
        </QueryClientProvider>,
      );
    // The first pass lets the page's components ask for their queries; the second has their data.
    render();
    await settle(queryClient);
    const page = { html: render(), queryState: dehydrate(queryClient) };
    queryClient.clear();
    return page;
  });
}
