import type { LotDetail, LotListResponse } from '@shared/schemas/lots';
import type { ShippingRules } from '@shared/schemas/shipping';
import { AppError } from '../../lib/app-error';
import type { LotsService } from '../lots';
import { lotProductJsonLd, type PageHead } from './page-head';

/** What the server puts into a page's HTML: its head, and the API answers its first render needs. */
export interface StorefrontPage {
  status: 200 | 404;
  head: PageHead;
  /** GET answers keyed by the exact path the client asks for, so the first render needs no round trip. */
  preloaded: Record<string, unknown>;
}

export interface StorefrontDeps {
  lots: LotsService;
  baseUrl: string;
  /** The published shipping rules: the shop's currency and bands, which every public page reads. */
  shippingRules: () => Promise<ShippingRules>;
}

const shopDescription = 'Green coffee lots for home roasters, coffee roasted to order by subscription, and the roastery behind both.';

/** Public pages a search engine may list, with their titles; every other path is kept out of the index. */
const publicPages: Record<string, { title: string; description: string }> = {
  '/': { title: 'Restday: green coffee for home roasters, roasted coffee by subscription', description: shopDescription },
  '/lots': {
    title: 'Green coffee lots | Restday',
    description: 'Every green coffee lot in stock: origin, process, variety, altitude, tasting notes and price per kilogram.',
  },
  '/subscribe': {
    title: 'Roasted coffee by subscription | Restday',
    description: 'Coffee roasted to order on a set roast day, rested, and shipped to arrive ready to brew. Pick a lot, a roast level and how often.',
  },
  '/roasting-basics': {
    title: 'Roasting basics | Restday',
    description: 'How to roast green coffee at home: equipment, stages, first crack, resting and safety.',
  },
};

const lotPathPattern = /^\/lots\/([^/]+)$/;

export function createStorefrontService({ lots, baseUrl, shippingRules }: StorefrontDeps) {
  const urlOf = (path: string) => `${baseUrl}${path === '/' ? '/' : path}`;

  async function lotPage(code: string, shipping: ShippingRules): Promise<StorefrontPage> {
    let lot: LotDetail;
    try {
      lot = await lots.get(code);
    } catch (error) {
      if (error instanceof AppError && error.status === 404) {
        return {
          status: 404,
          head: { title: 'Lot not found | Restday', description: shopDescription, canonicalUrl: urlOf('/lots'), indexable: false, openGraphType: 'website' },
          preloaded: {},
        };
      }
      throw error;
    }
    const path = `/lots/${encodeURIComponent(lot.code)}`;
    const imageUrls = lot.photos.map((photo) => (photo.startsWith('http') ? photo : `${baseUrl}${photo}`));
    const notes = lot.tastingNotes.length > 0 ? ` Tasting notes: ${lot.tastingNotes.join(', ')}.` : '';
    return {
      status: 200,
      head: {
        title: `${lot.name}, green coffee from ${lot.origin} | Restday`,
        description: `${lot.origin}, ${lot.region}: ${lot.variety}, ${lot.process}, grown at ${lot.altitudeM} m.${notes}`,
        canonicalUrl: urlOf(path),
        indexable: true,
        openGraphType: 'product',
        ...(imageUrls[0] ? { imageUrl: imageUrls[0] } : {}),
        jsonLd: lotProductJsonLd(lot, { url: urlOf(path), imageUrls, currency: shipping.currency }),
      },
      preloaded: { '/api/shipping': shipping, [`/api/lots/${encodeURIComponent(code)}`]: lot },
    };
  }

  return {
    /** The page for a path (the query string is not part of it: filters are the client's). */
    async pageFor(path: string): Promise<StorefrontPage> {
      const shipping = await shippingRules();
      const lotCode = lotPathPattern.exec(path)?.[1];
      if (lotCode) return lotPage(decodeURIComponent(lotCode), shipping);
      const known = publicPages[path];
      const head: PageHead = known
        ? { ...known, canonicalUrl: urlOf(path), indexable: true, openGraphType: 'website' }
        : { title: 'Restday', description: shopDescription, canonicalUrl: urlOf(path), indexable: false, openGraphType: 'website' };
      const wantsLots = path === '/' || path === '/lots' || path === '/subscribe';
      const preloaded: Record<string, unknown> = known ? { '/api/shipping': shipping } : {};
      if (wantsLots) preloaded['/api/lots'] = { items: await lots.list({}) } satisfies LotListResponse;
      return { status: 200, head, preloaded };
    },

    /** Every page worth indexing: the public pages and each listed lot. */
    async sitemapUrls(): Promise<string[]> {
      const listed = await lots.list({});
      return [...Object.keys(publicPages), ...listed.map((lot) => `/lots/${encodeURIComponent(lot.code)}`)].map(urlOf);
    },
  };
}

export type StorefrontService = ReturnType<typeof createStorefrontService>;
