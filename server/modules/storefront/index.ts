import type { Config } from '../../config';
import { publicBaseUrl } from '../../config';
import type { Db } from '../../db/client';
import type { Logger } from '../../lib/logger';
import type { LotsService } from '../lots';
import { publishedShippingRules } from '../shipping';
import { builtAssetsRoutes, storefrontRoutes } from './storefront.routes';
import { createStorefrontService } from './storefront.service';

/** The built shop at the site's root (not under /api): assets, pages with their own head, sitemap and robots. */
export function createStorefront({ config, db, lots, logger }: { config: Config; db: Db; lots: LotsService; logger: Logger }) {
  const baseUrl = publicBaseUrl(config);
  const service = createStorefrontService({ lots, baseUrl, shippingRules: () => publishedShippingRules(db) });
  return storefrontRoutes(service, { staticDir: config.STATIC_DIR, baseUrl, log: logger });
}

/** The hashed build assets, mounted before the request log and page headers (see builtAssetsRoutes). */
export function createBuiltAssets(config: Config) {
  return builtAssetsRoutes(config.STATIC_DIR);
}
