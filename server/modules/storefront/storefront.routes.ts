import { existsSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { Router } from 'express';
import expressStaticGzip from 'express-static-gzip';
import { AppError } from '../../lib/app-error';
import { headTags, scriptJson } from './page-head';
import type { StorefrontService } from './storefront.service';

/** The id of the script block holding a page's preloaded API answers (read by src/lib/api-client.ts). */
export const preloadedScriptId = 'restday-preloaded';

/** Kept out of search engines: people's own pages, the Roastery, and the API. */
const disallowedPaths = ['/roastery', '/account', '/api', '/checkout', '/cart', '/orders', '/subscriptions'];

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

/**
 * The built shop: hashed assets served precompressed (brotli or gzip, made at build time), and
 * every other GET answered with index.html carrying the page's own head (title, description,
 * canonical URL, Open Graph, JSON-LD) and the public API answers its first render needs.
 */
export function storefrontRoutes(service: StorefrontService, options: { staticDir: string; baseUrl: string }): Router {
  const router = Router();
  const staticDir = path.resolve(options.staticDir);
  const indexHtml = builtIndexHtml(path.join(staticDir, 'index.html'));
  const precompressed = { enableBrotli: true, orderPreference: ['br', 'gz'] };

  router.use(
    '/assets',
    expressStaticGzip(path.join(staticDir, 'assets'), { ...precompressed, serveStatic: { immutable: true, maxAge: '1y', fallthrough: false } }),
  );
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

  // Every other GET is a client-side route: the SPA decides what to show (its own 404 included).
  router.get('/{*splat}', async (req, res, next) => {
    const html = indexHtml();
    // Without a build (API-only runs), answer through the error handler so every header still applies.
    if (!html) return next(new AppError(404, 'client_not_built', 'The shop client is not built yet: run npm run build.'));
    const page = await service.pageFor(req.path);
    const preloaded =
      Object.keys(page.preloaded).length > 0 ? `<script type="application/json" id="${preloadedScriptId}">${scriptJson(page.preloaded)}</script>\n    ` : '';
    const rendered = html
      .replace(/<title>[^<]*<\/title>/, '')
      .replace(/<meta name="description"[^>]*>/, '')
      .replace('</head>', `  ${headTags(page.head)}\n    ${preloaded}</head>`);
    res.status(page.status).setHeader('Cache-Control', 'no-cache');
    res.type('html').send(rendered);
  });

  return router;
}
