import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import { load } from 'cheerio';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { lotDetailSchema, lotListResponseSchema } from '@shared/schemas/lots';
import { shippingRulesSchema } from '@shared/schemas/shipping';
import { schemaOrgProblems } from '../setup/schema-org';
import { createTestApp } from '../setup/test-app';
import { createLotForSale } from '../factories/index';

const publicUrl = 'https://shop.restday.test';
// A stand-in for `vite build`'s output: an index.html and one hashed script with its precompressed copies.
const staticDir = mkdtempSync(path.join(tmpdir(), 'restday-storefront-'));
const script = `console.log(${JSON.stringify('a line of the shop client '.repeat(200))});\n`;
let app: ReturnType<typeof createTestApp>;
let lot: Awaited<ReturnType<typeof createLotForSale>>;

beforeAll(async () => {
  mkdirSync(path.join(staticDir, 'assets'));
  writeFileSync(
    path.join(staticDir, 'index.html'),
    '<!doctype html><html lang="en-US"><head><meta charset="UTF-8" /><meta name="description" content="the built default" /><title>Restday</title></head><body><div id="root"></div><script type="module" src="/assets/index-abc123.js"></script></body></html>',
  );
  writeFileSync(path.join(staticDir, 'assets', 'index-abc123.js'), script);
  writeFileSync(path.join(staticDir, 'assets', 'index-abc123.js.br'), brotliCompressSync(script));
  writeFileSync(path.join(staticDir, 'assets', 'index-abc123.js.gz'), gzipSync(script));
  // A stand-in for the server render (`vite build --ssr`): it draws the roasting basics page, fails
  // on the subscription page, and would draw any other page it were asked for.
  mkdirSync(path.join(staticDir, '.ssr'));
  writeFileSync(
    path.join(staticDir, '.ssr', 'entry-server.js'),
    `export async function renderPage(url, answers) {
      if (url.includes('/subscribe')) throw new Error('the render broke');
      if (url.includes('/lots')) return null;
      return { html: '<main><h1>Drawn for ' + new URL(url).pathname + '</h1></main>', queryState: { answers } };
    }\n`,
  );
  app = createTestApp({ env: { STATIC_DIR: staticDir, PUBLIC_URL: publicUrl } });
  lot = await createLotForSale(1000);
});

afterAll(() => rmSync(staticDir, { recursive: true, force: true }));

describe('the built shop, compressed', () => {
  it('GET /assets/… — with Accept-Encoding br, then the brotli copy made at build time, with Vary and a year of cache', async () => {
    const response = await request(app).get('/assets/index-abc123.js').set('Accept-Encoding', 'gzip, br');

    expect(response.status).toBe(200);
    expect(response.headers['content-encoding']).toBe('br');
    expect(response.headers['vary']).toMatch(/Accept-Encoding/i);
    expect(response.headers['content-type']).toMatch(/javascript/);
    expect(response.headers['cache-control']).toMatch(/immutable/);
    // The bytes on the wire are the brotli file's (supertest decodes them for the check below).
    expect(Number(response.headers['content-length'])).toBe(brotliCompressSync(script).length);
    expect(response.text).toBe(script);
    // A subresource carries only the headers it needs: no document policy, no request id, no validators.
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['content-security-policy']).toBeUndefined();
    expect(response.headers['x-request-id']).toBeUndefined();
    expect(response.headers['etag']).toBeUndefined();
  });

  it('GET /assets/… of a file the build did not make — 404, not the shop page', async () => {
    const response = await request(app).get('/assets/index-gone000.js');
    expect(response.status).toBe(404);
    expect(response.headers['content-type']).toMatch(/text\/plain/);
  });

  it('GET /assets/… — with gzip only, then the gzip copy; with no Accept-Encoding, then the file as it is', async () => {
    const gzipped = await request(app).get('/assets/index-abc123.js').set('Accept-Encoding', 'gzip');
    expect(gzipped.headers['content-encoding']).toBe('gzip');
    expect(gzipped.text).toBe(script);

    const plain = await request(app).get('/assets/index-abc123.js').set('Accept-Encoding', '');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.text).toBe(script);
  });

  it('GET /api/lots — a large JSON answer is compressed when the client accepts it, and not when it does not', async () => {
    await Promise.all(Array.from({ length: 5 }, () => createLotForSale(5000)));
    const compressed = await request(app).get('/api/lots').set('Accept-Encoding', 'gzip');
    expect(compressed.status).toBe(200);
    expect(compressed.headers['content-encoding']).toBe('gzip');
    expect(lotListResponseSchema.parse(compressed.body).items.length).toBeGreaterThan(5);

    const plain = await request(app).get('/api/lots').set('Accept-Encoding', '');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body).toEqual(compressed.body);
  });

  it('GET /api/lots — brotli when accepted, and 304 with no body for a client that holds the same list', async () => {
    const brotli = await request(app).get('/api/lots').set('Accept-Encoding', 'br, gzip');
    expect(brotli.headers['content-encoding']).toBe('br');
    expect(brotli.headers['vary']).toMatch(/Accept-Encoding/i);
    const etag = brotli.headers['etag'];
    expect(etag).toMatch(/^".+"$/);

    const again = await request(app).get('/api/lots').set('If-None-Match', etag!);
    expect(again.status).toBe(304);
    expect(again.text).toBe('');
  });
});

describe('pages found and shared', () => {
  it("GET /lots/:code — the lot's own title, description, canonical URL, Open Graph tags, Product JSON-LD and the lot itself for the first render", async () => {
    const response = await request(app).get(`/lots/${lot.code}`);

    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toMatch(/text\/html/);
    const $ = load(response.text);
    expect($('title').length).toBe(1);
    expect($('title').text()).toBe(`${lot.name}, green coffee from Testland | Restday`);
    expect($('meta[name="description"]').length).toBe(1);
    expect($('meta[name="description"]').attr('content')).toContain('Testland, High Meadow: Bourbon, washed');
    expect($('link[rel="canonical"]').attr('href')).toBe(`${publicUrl}/lots/${lot.code}`);
    expect($('meta[property="og:type"]').attr('content')).toBe('product');
    expect($('meta[property="og:title"]').attr('content')).toBe($('title').text());
    expect($('meta[property="og:url"]').attr('content')).toBe(`${publicUrl}/lots/${lot.code}`);
    expect($('meta[name="robots"]').length).toBe(0);

    const preloaded = JSON.parse($('script#restday-preloaded').text()) as Record<string, unknown>;
    expect(lotDetailSchema.parse(preloaded[`/api/lots/${lot.code}`]).name).toBe(lot.name);
    // Prices read in the shop's currency from the first render: its published shipping rules come along.
    expect(shippingRulesSchema.parse(preloaded['/api/shipping']).currency).toBe('usd');

    const jsonLd = JSON.parse($('script[type="application/ld+json"]').text()) as Record<string, unknown>;
    expect(jsonLd).toMatchObject({ '@context': 'https://schema.org', '@type': 'Product', name: lot.name, sku: lot.code });
    // $40.00/kg on exact declared weights (1 lb = 453.59237 g, the international avoirdupois pound of
    // 1959; 1 oz = 1/16 lb), rounded half up to the cent: worked by hand.
    expect(jsonLd['offers']).toEqual([
      expect.objectContaining({ '@type': 'Offer', sku: `${lot.code}-8oz`, price: '9.07', priceCurrency: 'USD', availability: 'https://schema.org/InStock' }),
      expect.objectContaining({ '@type': 'Offer', sku: `${lot.code}-1lb`, price: '18.14', priceCurrency: 'USD', availability: 'https://schema.org/InStock' }),
      expect.objectContaining({ '@type': 'Offer', sku: `${lot.code}-2lb`, price: '36.29', priceCurrency: 'USD', availability: 'https://schema.org/InStock' }),
      // 1,000 g in stock cannot fill a 5 lb bag (2,268 g).
      expect.objectContaining({
        '@type': 'Offer',
        sku: `${lot.code}-5lb`,
        price: '90.72',
        priceCurrency: 'USD',
        availability: 'https://schema.org/OutOfStock',
      }),
    ]);
    expect(schemaOrgProblems(jsonLd)).toEqual([]);
  });

  it('the schema.org check itself refuses a type, a property and a value the vocabulary does not have', () => {
    const offer = { '@type': 'Offer', price: '9.07', priceCurrency: 'USD', availability: 'https://schema.org/InStock' };
    expect(schemaOrgProblems({ '@context': 'https://schema.org', '@type': 'Product', name: 'A lot', offers: [offer] })).toEqual([]);
    expect(schemaOrgProblems({ '@type': 'GreenCoffeeLot', name: 'A lot' })).toEqual(['$: "GreenCoffeeLot" is not a schema.org type']);
    const problems = schemaOrgProblems({
      '@type': 'Product',
      name: 'A lot',
      roastLevel: 'light',
      offers: [{ ...offer, availability: 'https://schema.org/Plenty' }],
    });
    expect(problems).toEqual(
      expect.arrayContaining([expect.stringContaining('"roastLevel" is not a property of this type'), expect.stringMatching(/^\$\.offers\[0\]\/availability/)]),
    );
  });

  it('GET /lots/:code — for no such lot, then 404 with a page kept out of the index', async () => {
    const response = await request(app).get('/lots/NO-SUCH-LOT');

    expect(response.status).toBe(404);
    const $ = load(response.text);
    expect($('meta[name="robots"]').attr('content')).toBe('noindex');
    expect($('script#restday-preloaded').length).toBe(0);
  });

  it('GET / and /lots — titles of their own and the lot list preloaded; /roastery and /account pages are kept out of the index', async () => {
    const home = load((await request(app).get('/')).text);
    const lotsPage = load((await request(app).get('/lots?origin=Testland')).text);
    const roastery = load((await request(app).get('/roastery/orders')).text);

    expect(home('title').text()).not.toBe(lotsPage('title').text());
    expect(lotsPage('link[rel="canonical"]').attr('href')).toBe(`${publicUrl}/lots`);
    const preloadedLots = (JSON.parse(lotsPage('script#restday-preloaded').text()) as Record<string, unknown>)['/api/lots'];
    expect(lotListResponseSchema.parse(preloadedLots).items.map((item) => item.code)).toContain(lot.code);
    expect(roastery('meta[name="robots"]').attr('content')).toBe('noindex');
    expect(roastery('script#restday-preloaded').length).toBe(0);
  });

  it('GET /roasting-basics — drawn on the server into #root, with the query state it was drawn from instead of the preloaded answers', async () => {
    const response = await request(app).get('/roasting-basics');

    const $ = load(response.text);
    expect($('#root h1').text()).toBe('Drawn for /roasting-basics');
    const state = JSON.parse($('script#restday-query-state').text()) as { answers: Record<string, unknown> };
    expect(shippingRulesSchema.parse(state.answers['/api/shipping']).currency).toBe('usd');
    expect($('script#restday-preloaded').length).toBe(0);
  });

  it('a page the server cannot draw (it fails, or declines) and a private page are sent for the browser to draw', async () => {
    const failed = load((await request(app).get('/subscribe')).text);
    const declined = load((await request(app).get(`/lots/${lot.code}`)).text);
    const account = load((await request(app).get('/account')).text);

    for (const page of [failed, declined, account]) {
      expect(page('#root').html()).toBe('');
      expect(page('script#restday-query-state').length).toBe(0);
    }
    // What the browser needs for its first render still comes with the public pages.
    expect(failed('script#restday-preloaded').length).toBe(1);
    expect(declined('script#restday-preloaded').length).toBe(1);
  });

  it('a lot name that looks like markup stays text in the head and cannot close the JSON blocks', async () => {
    const tricky = await createLotForSale(1000);
    const { getTestDb } = await import('../setup/test-db');
    const { lots } = await import('../../server/db/schema/index');
    const { eq } = await import('drizzle-orm');
    await getTestDb().update(lots).set({ name: '</script><script>alert(1)</script> & "Co"' }).where(eq(lots.id, tricky.id));

    const response = await request(app).get(`/lots/${tricky.code}`);

    const $ = load(response.text);
    expect($('title').text()).toBe('</script><script>alert(1)</script> & "Co", green coffee from Testland | Restday');
    expect($('script:not([type])').length + $('script[type="module"]').length).toBe(1);
    expect((JSON.parse($('script[type="application/ld+json"]').text()) as { name: string }).name).toBe('</script><script>alert(1)</script> & "Co"');
  });

  it('GET /sitemap.xml lists the public pages and every listed lot; GET /robots.txt points to it and keeps private areas out', async () => {
    const sitemap = await request(app).get('/sitemap.xml');
    const robots = await request(app).get('/robots.txt');

    expect(sitemap.status).toBe(200);
    expect(sitemap.headers['content-type']).toMatch(/application\/xml/);
    const $ = load(sitemap.text, { xml: true });
    const locations = $('urlset > url > loc')
      .map((_index, element) => $(element).text())
      .get();
    expect(locations).toEqual(expect.arrayContaining([`${publicUrl}/`, `${publicUrl}/lots`, `${publicUrl}/subscribe`, `${publicUrl}/lots/${lot.code}`]));
    expect(locations.some((location) => location.includes('/roastery'))).toBe(false);

    expect(robots.status).toBe(200);
    expect(robots.text).toContain(`Sitemap: ${publicUrl}/sitemap.xml`);
    for (const area of ['/roastery', '/account', '/api']) expect(robots.text).toContain(`Disallow: ${area}\n`);
  });
});
