import { existsSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { Router } from 'express';
import expressStaticGzip from 'express-static-gzip';
import { AppError } from '../../lib/app-error';
import type { Logger } from '../../lib/logger';
import { headTags, scriptJson } from './page-head';
import type { StorefrontService } from './storefront.service';

type StorefrontLog = Pick<Logger, 'error'>;

/** The id of the script block holding a page's preloaded API answers (read by src/lib/api-client.ts). */
export const preloadedScriptId = 'restday-preloaded';

/** Kept out of search engines: people's own pages, the Roastery, and the API. */
const disallowedPaths = ['/roastery', '/account', '/api', '/checkout', '/cart', '/orders', '/subscriptions'];

/** The id of the script block holding the query cache a server-rendered page was drawn from (read by src/main.tsx). */
export const queryStateScriptId = 'restday-query-state';

/** What the server render (src/entry-server.tsx, built into dist/.ssr) draws for a page. */
export type RenderPage = (url: string, answers: Record<string, unknown>) => Promise<{ html: string; queryState: unknown } | null>;

/**
 * The server render as built, imported once: its lazy chunks import the entry by its plain URL, so
 * a second copy (a cache-busting import) would split React Router's context in two.
 */
function builtRenderer(file: string, log: StorefrontLog) {
  let loading: Promise<RenderPage | undefined> | undefined;
  return () => {
    if (loading) return loading;
    if (!existsSync(file)) return Promise.resolve(undefined);
    loading = import(pathToFileURL(file).href).then(
      (module: { renderPage: RenderPage }) => module.renderPage,
      (error: unknown) => {
        log.error({ err: error }, 'The server render could not be loaded; pages are drawn in the browser alone');
        return undefined;
      },
    );
    return loading;
  };
}

/** index.html as built, read again only when a new build replaces it. */
function builtIndexHtml(file: string) {
  let cached: { modifiedMs: number; html: string } | undefined;
  return () => {
    if (!existsSync(file)) return undefined;
    const modifiedMs = statSync(file).mtimeMs;
    if (cached?.modifiedMs !== modifiedMs) cached = { modifiedMs, html: readFileSync(file, 'utf8') };
    return cached.html;
  };
}

const precompressed = { enableBrotli: true, orderPreference: ['br', 'gz'] };

/**
 * The hashed build assets (scripts, styles, fonts): precompressed, kept a year, and sent with only the
 * headers a subresource needs. Mounted ahead of the request log and the page security headers: a first
 * visit loads some forty of these files, and a document's headers would add about 1 kB to each.
 */
export function builtAssetsRoutes(staticDir: string): Router {
  const router = Router();
  router.use(
    '/assets',
    (_req, res, next) => {
      res.setHeader('X-Content-Type-Options', 'nosniff');
      res.setHeader('Cross-Origin-Resource-Policy', 'same-origin');
      next();
    },
    expressStaticGzip(path.join(path.resolve(staticDir), 'assets'), {
      ...precompressed,
      serveStatic: { immutable: true, maxAge: '1y', etag: false, lastModified: false, acceptRanges: false },
    }),
    (_req, res) => {
      res.status(404).type('text/plain').send('Not found');
    },
  );
  return router;
}

/**
 * The built shop: static files at the root served precompressed (brotli or gzip, made at build time), and
 * every other GET answered with index.html carrying the page's own head (title, description,
 * canonical URL, Open Graph, JSON-LD) and the public API answers its first render needs.
 */
export function storefrontRoutes(service: StorefrontService, options: { staticDir: string; baseUrl: string; log: StorefrontLog }): Router {
  const router = Router();
  const staticDir = path.resolve(options.staticDir);
  const indexHtml = builtIndexHtml(path.join(staticDir, 'index.html'));
  const renderer = builtRenderer(path.join(staticDir, '.ssr', 'entry-server.js'), options.log);

  router.use(expressStaticGzip(staticDir, { ...precompressed, index: false, serveStatic: { index: false, maxAge: '1h' } }));

  router.get('/robots.txt', (_req, res) => {
    res.type('text/plain').setHeader('Cache-Control', 'public, max-age=3600');
    res.send(
      ['User-agent: *', ...disallowedPaths.map((disallowed) => `Disallow: ${disallowed}`), '', `Sitemap: ${options.baseUrl}/sitemap.xml`, ''].join('\n'),
    );
  });

  router.get('/sitemap.xml', async (_req, res) => {
    const urls = await service.sitemapUrls();
    const escape = (url: string) => url.replace(/&/g, '&amp;').replace(/</g, '&lt;');
    res.type('application/xml').setHeader('Cache-Control', 'public, max-age=600');
    res.send(
      `<?xml version="1.0" encoding="UTF-8"?>\n<urlset xmlns="http://www.sitemaps.org/schemas/sitemap/0.9">\n${urls.map((url) => `  <url><loc>${escape(url)}</loc></url>`).join('\n')}\n</urlset>\n`,
    );
  });

  /** The page drawn on the server for its first paint; null when only the browser can draw it. */
  async function drawOnServer(url: string, answers: Record<string, unknown>) {
    const render = await renderer();
    if (!render) return null;
    try {
      return await render(url, answers);
    } catch (error) {
      options.log.error({ err: error, url }, 'The server render failed; the page is drawn in the browser alone');
      return null;
    }
  }

  // Every other GET is a client-side route: the SPA decides what to show (its own 404 included).
  router.get('/{*splat}', async (req, res, next) => {
    const html = indexHtml();
    // Without a build (API-only runs), answer through the error handler so every header still applies.
    if (!html) return next(new AppError(404, 'client_not_built', 'The shop client is not built yet: run npm run build.'));
    const page = await service.pageFor(req.path);
    const drawn = page.head.indexable ? await drawOnServer(`${options.baseUrl}${req.originalUrl}`, page.preloaded) : null;
    const startingData = drawn
      ? `<script type="application/json" id="${queryStateScriptId}">${scriptJson(drawn.queryState)}</script>\n    `
      : Object.keys(page.preloaded).length > 0
        ? `<script type="application/json" id="${preloadedScriptId}">${scriptJson(page.preloaded)}</script>\n    `
        : '';
    const rendered = html
      .replace(/<title>[^<]*<\/title>/, '')
      .replace(/<meta name="description"[^>]*>/, '')
      .replace('</head>', `  ${headTags(page.head)}\n    ${startingData}</head>`)
      .replace('<div id="root"></div>', () => `<div id="root">${drawn?.html ?? ''}</div>`);
    res.status(page.status).setHeader('Cache-Control', 'no-cache');
    res.type('html').send(rendered);
  });

  return router;
}
