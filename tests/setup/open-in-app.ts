import type { Page } from 'playwright-core';

/**
 * Loads a Restday page and waits until the app has taken it over: a public page arrives drawn by
 * the server, and a click or a typed value before then would not reach the app.
 */
export async function openInApp(page: Page, url: string) {
  await page.goto(url);
  await page.locator('#root[data-app-ready]').waitFor({ state: 'attached' });
}
