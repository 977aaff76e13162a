import type { Offer, Product, WithContext } from 'schema-dts';
import type { LotDetail } from '@shared/schemas/lots';
import { greenBagSizes } from '@shared/domain/vocabulary';
import { bagFillGrams } from '@shared/domain/units';
import { greenBagPrice, pricePerKgFor } from '@shared/domain/pricing';

/** What a page's HTML says about it before any script runs: for search engines, link previews and the first paint. */
export interface PageHead {
  title: string;
  description: string;
  /** Absolute URL of the page as it should be indexed (no query string). */
  canonicalUrl: string;
  /** False keeps the page out of search results (accounts, the Roastery, checkout). */
  indexable: boolean;
  imageUrl?: string;
  openGraphType: 'website' | 'product';
  jsonLd?: WithContext<Product>;
}

const escapes: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
const escapeHtml = (text: string) => text.replace(/[&<>"']/g, (character) => escapes[character]!);

/**
 * JSON inside a <script> block: `<` is written as \u003c so no value can close the block, and
 * U+2028/U+2029 are escaped for older parsers.
 */
export function scriptJson(value: unknown): string {
  return JSON.stringify(value)
    .replace(/</g, '\\u003c')
    .replace(/\u2028/g, '\\u2028')
    .replace(/\u2029/g, '\\u2029');
}

export function headTags(head: PageHead): string {
  const tags = [
    `<title>${escapeHtml(head.title)}</title>`,
    `<meta name="description" content="${escapeHtml(head.description)}" />`,
    `<link rel="canonical" href="${escapeHtml(head.canonicalUrl)}" />`,
    ...(head.indexable ? [] : ['<meta name="robots" content="noindex" />']),
    `<meta property="og:type" content="${head.openGraphType}" />`,
    `<meta property="og:site_name" content="Restday" />`,
    `<meta property="og:title" content="${escapeHtml(head.title)}" />`,
    `<meta property="og:description" content="${escapeHtml(head.description)}" />`,
    `<meta property="og:url" content="${escapeHtml(head.canonicalUrl)}" />`,
    ...(head.imageUrl ? [`<meta property="og:image" content="${escapeHtml(head.imageUrl)}" />`] : []),
    ...(head.jsonLd ? [`<script type="application/ld+json">${scriptJson(head.jsonLd)}</script>`] : []),
  ];
  return tags.join('\n    ');
}

/** A price in minor units as schema.org wants it: a plain decimal in the currency's own digits (ISO 4217 via Intl). */
export function schemaPrice(minorUnits: number, currency: string): string {
  const digits = new Intl.NumberFormat('en-US', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
  return (minorUnits / 10 ** digits).toFixed(digits);
}

/**
 * schema.org `Product` for a green lot: one `Offer` per green bag size, a single bag priced as the
 * lot page prices it, in stock while the lot can fill that bag.
 */
export function lotProductJsonLd(lot: LotDetail, options: { url: string; imageUrls: string[]; currency: string }): WithContext<Product> {
  const offers: Offer[] = greenBagSizes.map((size) => {
    const grams = bagFillGrams(size);
    return {
      '@type': 'Offer',
      name: `${lot.name}, ${size} green`,
      sku: `${lot.code}-${size}`,
      price: schemaPrice(greenBagPrice(size, pricePerKgFor(grams, lot)), options.currency),
      priceCurrency: options.currency.toUpperCase(),
      availability: lot.stockGrams >= grams ? 'https://schema.org/InStock' : 'https://schema.org/OutOfStock',
      itemCondition: 'https://schema.org/NewCondition',
      url: options.url,
    };
  });
  return {
    '@context': 'https://schema.org',
    '@type': 'Product',
    name: lot.name,
    description: lot.description || `${lot.origin}, ${lot.region}: ${lot.variety}, ${lot.process}.`,
    sku: lot.code,
    category: 'Green coffee beans',
    countryOfOrigin: { '@type': 'Country', name: lot.origin },
    ...(options.imageUrls.length > 0 ? { image: options.imageUrls } : {}),
    offers,
  };
}
