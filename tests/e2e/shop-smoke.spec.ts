import type { Browser, Route } from 'playwright-core';
import { lotListResponseSchema } from '@shared/schemas/lots';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { launchChromium } from '../setup/chromium';

const baseUrl = inject('baseUrl');
let browser: Browser;

beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

async function openPage(path: string) {
  const context = await browser.newContext();
  const page = await context.newPage();
  const problems: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error' || message.type() === 'warning') problems.push(`${message.type()}: ${message.text()}`);
  });
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  await page.goto(`${baseUrl}${path}`);
  return { page, problems, close: () => context.close() };
}

describe('the shop in a real browser', () => {
  it('home page shows seeded lots with no console errors under the strict CSP', async () => {
    const { page, problems, close } = await openPage('/');
    await page.getByTestId('lot-card').first().waitFor();
    expect(await page.getByTestId('lot-card').count()).toBeGreaterThan(0);
    expect(await page.title()).toMatch(/Restday|Wrenfield/);
    expect(problems).toEqual([]);
    await close();
  });

  it('Green Lots lists every seeded lot and a filter narrows it through the URL', async () => {
    const { page, problems, close } = await openPage('/lots');
    await page.getByTestId('lot-card').first().waitFor();
    const all = await page.getByTestId('lot-card').count();
    expect(all).toBeGreaterThanOrEqual(8);

    await page.goto(`${baseUrl}/lots?process=natural`);
    await page.getByTestId('lot-card').first().waitFor();
    const naturals = await page.getByTestId('lot-card').count();
    expect(naturals).toBeGreaterThan(0);
    expect(naturals).toBeLessThan(all);
    expect(problems).toEqual([]);
    await close();
  });

  it('a lot page shows its name before any /api answer arrives: the server sends the lot with the page', async () => {
    const [lot] = lotListResponseSchema.parse(await (await fetch(`${baseUrl}/api/lots`)).json()).items;
    const context = await browser.newContext();
    const page = await context.newPage();
    // Every API request the page makes is held back until the name is on screen.
    const held: Route[] = [];
    await page.route('**/api/**', (route) => void held.push(route));
    await page.goto(`${baseUrl}/lots/${lot!.code}`);
    await page.getByRole('heading', { level: 1, name: lot!.name }).waitFor();
    expect(await page.getByText(/\$\d+\.\d{2}/).count()).toBeGreaterThan(0);
    await Promise.all(held.map((route) => route.abort().catch(() => undefined)));
    await context.close();
  });

  it('the public pages arrive drawn: with JavaScript off, the home page lists lots and a lot page shows its name and prices', async () => {
    const [lot] = lotListResponseSchema.parse(await (await fetch(`${baseUrl}/api/lots`)).json()).items;
    const context = await browser.newContext({ javaScriptEnabled: false });
    const page = await context.newPage();
    await page.goto(`${baseUrl}/`);
    expect(await page.getByTestId('lot-card').count()).toBeGreaterThan(0);
    await page.goto(`${baseUrl}/lots/${lot!.code}`);
    expect(await page.getByRole('heading', { level: 1, name: lot!.name }).count()).toBe(1);
    expect(await page.getByText(/\$\d+\.\d{2}/).count()).toBeGreaterThan(0);
    await context.close();
  });

  it('the browser takes over a drawn lot page without redrawing it, and the page then works as an app', async () => {
    const [lot] = lotListResponseSchema.parse(await (await fetch(`${baseUrl}/api/lots`)).json()).items;
    const context = await browser.newContext();
    const page = await context.newPage();
    const problems: string[] = [];
    page.on('console', (message) => {
      if (message.type() === 'error' || message.type() === 'warning') problems.push(`${message.type()}: ${message.text()}`);
    });
    // Notes whether the heading the server drew is ever taken out of the page.
    await page.addInitScript(() => {
      document.addEventListener('DOMContentLoaded', () => {
        const drawn = document.querySelector('h1');
        const record = window as unknown as { drawnHeadingRemoved: boolean };
        record.drawnHeadingRemoved = !drawn;
        new MutationObserver(() => {
          if (drawn && !drawn.isConnected) record.drawnHeadingRemoved = true;
        }).observe(document.body, { childList: true, subtree: true });
      });
    });
    const whoAmI = page.waitForResponse((response) => response.url().endsWith('/api/auth/me'));
    await page.goto(`${baseUrl}/lots/${lot!.code}`);
    // The header asks who is signed in once the app runs.
    await whoAmI;
    await page.waitForTimeout(300);
    expect(await page.evaluate(() => (window as unknown as { drawnHeadingRemoved: boolean }).drawnHeadingRemoved)).toBe(false);
    await page.getByRole('link', { name: 'Green Lots' }).first().click();
    await page.waitForURL(`${baseUrl}/lots`);
    await page.getByTestId('lot-card').first().waitFor();
    expect(problems).toEqual([]);
    await context.close();
  });

  it('an unknown address shows the 404 page from the SPA', async () => {
    const { page, close } = await openPage('/no-such-page');
    await page.getByRole('heading', { level: 1 }).waitFor();
    expect(await page.getByRole('link', { name: /home|shop/i }).count()).toBeGreaterThan(0);
    await close();
  });
});
