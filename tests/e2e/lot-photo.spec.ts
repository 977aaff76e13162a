import { deflateSync } from 'node:zlib';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { LotDetail } from '../../shared/schemas/lots';
import { launchChromium } from '../setup/chromium';
import { openInApp } from '../setup/open-in-app';

const baseUrl = inject('baseUrl');
// The demo seed's invented roaster (server/db/seed).
const roaster = { email: 'roaster@wrenfield.test', password: 'restday-demo' };

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

/** A real 4 × 3 PNG (one colour), built from the PNG specification's chunks, so the browser can draw it. */
function smallPng(): Buffer {
  const crcTable = Array.from({ length: 256 }, (_, n) => {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    return c >>> 0;
  });
  const crc = (bytes: Buffer) => {
    let c = 0xffffffff;
    for (const byte of bytes) c = (crcTable[(c ^ byte) & 0xff] as number) ^ (c >>> 8);
    return (c ^ 0xffffffff) >>> 0;
  };
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
    const length = Buffer.alloc(4);
    length.writeUInt32BE(data.length);
    const check = Buffer.alloc(4);
    check.writeUInt32BE(crc(body));
    return Buffer.concat([length, body, check]);
  };
  const header = Buffer.alloc(13);
  header.writeUInt32BE(4, 0);
  header.writeUInt32BE(3, 4);
  header.set([8, 2, 0, 0, 0], 8); // 8-bit RGB
  const rows = Buffer.concat(Array.from({ length: 3 }, () => Buffer.from([0, ...Array.from({ length: 4 }, () => [0x6b, 0x4a, 0x2f]).flat()])));
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(rows)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

describe('a lot photo under the default uploads folder (.data/uploads)', () => {
  it('staff upload a photo in Green Stock and a visitor sees it drawn on the lot page', async () => {
    const staff = await browser.newContext();
    const page = await staff.newPage();
    page.setDefaultTimeout(10_000);
    await openInApp(page, `${baseUrl}/sign-in?redirectTo=%2Froastery%2Fgreen-stock`);
    await page.getByLabel('E-mail').fill(roaster.email);
    await page.getByLabel('Password', { exact: true }).fill(roaster.password);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(/\/roastery\/green-stock$/);
    const lots = (await (await page.request.get(`${baseUrl}/api/lots`)).json()) as { items: { code: string }[] };
    const code = lots.items[0]!.code;
    await openInApp(page, `${baseUrl}/roastery/green-stock/${code}`);
    await page.getByLabel('Add a photo').setInputFiles({ name: 'invented-lot.png', mimeType: 'image/png', buffer: smallPng() });
    await page.getByRole('status').filter({ hasText: /./ }).first().waitFor();
    const lot = (await (await page.request.get(`${baseUrl}/api/lots/${code}`)).json()) as LotDetail;
    const photoUrl = lot.photos.at(-1)!;
    await staff.close();

    const visitor = await browser.newContext();
    const shop = await visitor.newPage();
    const answers: number[] = [];
    shop.on('response', (response) => {
      if (response.url().endsWith(photoUrl)) answers.push(response.status());
    });
    await openInApp(shop, `${baseUrl}/lots/${code}`);
    const image = shop.locator(`img[src$="${photoUrl}"]`).first();
    await image.scrollIntoViewIfNeeded();
    await expect.poll(() => image.evaluate((element: HTMLImageElement) => element.complete && element.naturalWidth), { timeout: 10_000 }).toBe(4);
    expect(answers).toContain(200);
    await visitor.close();
  });
});
