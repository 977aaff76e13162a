import { mkdirSync } from 'node:fs';
import AxeBuilder from '@axe-core/playwright';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { addDays, localDateOf } from '../../shared/domain/shop-time';
import { roastLevelLabels } from '../../shared/domain/vocabulary';
import type { PackListResponse } from '../../shared/schemas/packing';
import type { BatchListResponse, RoastListResponse } from '../../shared/schemas/roastery';
import type { ShopSettings } from '../../shared/schemas/settings';
import type { TodayResponse } from '../../shared/schemas/today';
import { launchChromium } from '../setup/chromium';
import { openInApp } from '../setup/open-in-app';

const baseUrl = inject('baseUrl');
// The demo seed's invented team (server/db/seed): every account shares the demo password.
const roaster = { email: 'roaster@wrenfield.test', password: 'restday-demo' };
const owner = { email: 'owner@wrenfield.test', password: 'restday-demo' };
const screenshotDir = 'test-results';

let browser: Browser;

beforeAll(async () => {
  browser = await launchChromium();
  mkdirSync(screenshotDir, { recursive: true });
});
afterAll(async () => {
  await browser?.close();
});

type Session = { context: BrowserContext; page: Page; problems: string[] };

/** A fresh browser profile signed in through the sign-in page; any console error or warning is kept. */
async function signedIn(account: { email: string; password: string }, options: { bypassCSP?: boolean } = {}): Promise<Session> {
  const context = await browser.newContext(options);
  const page = await context.newPage();
  page.setDefaultTimeout(10_000);
  const problems: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error' || message.type() === 'warning') problems.push(`${message.type()}: ${message.text()} (${message.location().url})`);
  });
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  await openInApp(page, `${baseUrl}/sign-in?redirectTo=%2Froastery`);
  await page.getByLabel('E-mail').fill(account.email);
  await page.getByLabel('Password', { exact: true }).fill(account.password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.getByRole('heading', { level: 1, name: 'Today' }).waitFor();
  // The sign-in page's own check of who is signed in answers 401 before signing in; only what follows counts.
  problems.length = 0;
  return { context, page, problems };
}

/** Waits until every chart in the region has drawn (the charting package loads lazily, on first use). */
async function chartsDrawn(region: Locator, expected: number) {
  const figures = region.getByRole('figure');
  await figures.nth(expected - 1).waitFor();
  expect(await figures.count()).toBe(expected);
  // Each chart's own surface is its first; legends draw small ones of their own after it.
  for (let index = 0; index < expected; index += 1) await figures.nth(index).locator('svg.recharts-surface').first().waitFor({ timeout: 20_000 });
}

async function getJson<T>(page: Page, path: string): Promise<T> {
  const response = await page.request.get(`${baseUrl}${path}`);
  expect(response.status(), path).toBe(200);
  return (await response.json()) as T;
}

/** The shop's today and the next two weeks, in the shop's own time zone. */
async function shopDays(page: Page): Promise<string[]> {
  const settings = await getJson<ShopSettings>(page, '/api/roastery/settings');
  const today = localDateOf(new Date(), settings.timeZone);
  return Array.from({ length: 15 }, (_unused, index) => addDays(today, index));
}

/** A seeded roast day ahead with a line whose green is all in stock (so a batch of it can be recorded). */
async function roastDayWithStock(page: Page): Promise<{ date: string; roastList: RoastListResponse; line: RoastListResponse['lines'][number] }> {
  for (const date of await shopDays(page)) {
    const roastList = await getJson<RoastListResponse>(page, `/api/roastery/days/${date}/roast-list`);
    const line = roastList.lines.find(
      (candidate) => candidate.toRoast.batches.length > 0 && roastList.pull.some((pull) => pull.lotCode === candidate.lotCode && pull.shortfallGrams === 0),
    );
    if (line) return { date, roastList, line };
  }
  throw new Error('The demo seed has no roast day with stock in the next two weeks.');
}

/** A ship day ahead with an order still to pack or ship. */
async function packDayWithOrder(page: Page): Promise<{ date: string; order: PackListResponse['orders'][number] }> {
  for (const date of await shopDays(page)) {
    const packList = await getJson<PackListResponse>(page, `/api/roastery/days/${date}/pack-list`);
    const order = packList.orders.find((candidate) => candidate.status === 'roasted' || candidate.status === 'packed');
    if (order) return { date, order };
  }
  throw new Error('The demo seed has no order to pack in the next two weeks.');
}

/** Marks a roasted order packed from its Pack List card, through the one confirmation it asks. */
async function markPackedOnPage(page: Page, card: Locator) {
  await card.getByRole('button', { name: 'Mark packed' }).click();
  await page
    .getByRole('dialog', { name: /order packed\?$/ })
    .getByRole('button', { name: 'Mark packed' })
    .click();
  await card.getByText('Packed', { exact: true }).waitFor();
}

/** A seeded order of the last two weeks whose bags were filled from a batch, for the trace pages. */
async function tracedOrder(page: Page): Promise<{ orderId: string; batchId: string }> {
  const days = await shopDays(page);
  const today = days[0] as string;
  for (let back = 1; back <= 14; back += 1) {
    const date = addDays(today, -back);
    const packList = await getJson<PackListResponse>(page, `/api/roastery/days/${date}/pack-list`);
    for (const order of packList.orders) {
      const batchId = order.bags.find((bag) => bag.batchId)?.batchId;
      if (batchId) return { orderId: order.orderId, batchId };
    }
  }
  throw new Error('The demo seed has no order filled from a batch in the last two weeks.');
}

describe('a roast day in a real browser', () => {
  let session: Session;
  let recordedBatchId: string | undefined;
  let roastDate = '';

  beforeAll(async () => {
    session = await signedIn(roaster);
  });
  afterAll(async () => {
    await session?.context.close();
  });

  it('a roaster opens the Day Sheet of a seeded roast day and records a batch with its loss checked', async () => {
    const { page, problems } = session;
    const { date, line } = await roastDayWithStock(page);
    roastDate = date;
    const before = await getJson<BatchListResponse>(page, `/api/roastery/days/${date}/batches`);

    await openInApp(page, `${baseUrl}/roastery/days/${date}`);
    await page.getByRole('heading', { level: 2, name: 'By lot and roast level' }).waitFor();
    await page.getByText('Safety before you start the roaster').waitFor();

    const level = roastLevelLabels[line.roastLevel];
    await page.getByRole('button', { name: `Record batch of ${line.lotName}, ${level}`, exact: true }).click();
    const form = page.getByRole('form', { name: `Record a batch of ${line.lotName}, ${level}`, exact: true });
    const greenIn = Number(await form.getByLabel('Green in (g)').inputValue());
    // The form suggests the first batch of what is still to roast.
    expect(greenIn).toBe(line.toRoast.batches[0]?.greenGrams);
    // A loss of exactly the planned percentage, whole grams: roasted = round(green × (1 − loss)).
    const roastedOut = Math.round(greenIn * (1 - line.lossPct / 100));
    await form.getByLabel('Roasted out (g)').fill(String(roastedOut));
    await form.getByLabel('Total time (mm:ss)').fill('11:45');
    await form.getByLabel('First crack at (mm:ss)').fill('9:15');
    // (705 − 555) ÷ 705 = 21.28 % (S. Rao, development time ratio).
    await form.getByText('development time ratio 21.28 %').waitFor();
    await form.getByRole('button', { name: 'Save batch' }).click();

    // Saved, the form closes (no second entry one click away) and the verdict stays on the line.
    await page.getByText(/Batch recorded/).waitFor();
    expect(await form.count()).toBe(0);
    const traceHref = await page.getByRole('link', { name: 'Trace this batch' }).getAttribute('href');
    recordedBatchId = traceHref?.split('/').pop();
    const after = await getJson<BatchListResponse>(page, `/api/roastery/days/${date}/batches`);
    expect(after.items).toHaveLength(before.items.length + 1);
    expect(after.items.at(-1)).toMatchObject({
      id: recordedBatchId,
      greenGramsIn: greenIn,
      roastedGramsOut: roastedOut,
      totalSeconds: 705,
      firstCrackSeconds: 555,
    });
    await page
      .getByRole('table', { name: 'Batches recorded for the day' })
      .getByRole('row', { name: new RegExp(line.lotName) })
      .first()
      .waitFor();
    expect(problems).toEqual([]);
  });

  it('prints the Roast List without navigation or buttons', async () => {
    const { page, problems } = session;
    await openInApp(page, `${baseUrl}/roastery/days/${roastDate}`);
    await page.getByRole('heading', { level: 2, name: 'Pull list' }).waitFor();
    expect(await page.getByRole('navigation', { name: 'Roastery' }).isVisible()).toBe(true);
    await page.screenshot({ path: `${screenshotDir}/roast-list-screen.png`, fullPage: true });

    await page.emulateMedia({ media: 'print' });
    await page.screenshot({ path: `${screenshotDir}/roast-list-print.png`, fullPage: true });
    expect(await page.getByRole('navigation', { name: 'Roastery' }).isVisible()).toBe(false);
    expect(await page.getByRole('banner').first().isVisible()).toBe(false);
    expect(await page.locator('button:visible').count()).toBe(0);
    expect(await page.getByRole('tablist').isVisible()).toBe(false);
    // What the roaster needs is still on the page.
    expect(await page.getByRole('heading', { level: 2, name: 'Pull list' }).isVisible()).toBe(true);
    expect(await page.getByRole('heading', { level: 2, name: 'By lot and roast level' }).isVisible()).toBe(true);

    // The printable width of A4 (210 mm) and Letter (8.5 in) inside the stylesheet's 12 mm margins, at 96 px an inch:
    // nothing may run off the side of either sheet.
    const screenViewport = page.viewportSize();
    for (const [paper, widthMm] of [
      ['A4', 210],
      ['Letter', 215.9],
    ] as const) {
      await page.setViewportSize({ width: Math.floor(((widthMm - 24) / 25.4) * 96), height: 1000 });
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
      expect(overflow, `${paper} overflows by ${overflow}px`).toBeLessThanOrEqual(0);
      await page.pdf({ path: `${screenshotDir}/roast-list-${paper.toLowerCase()}.pdf`, format: paper, printBackground: false });
    }
    if (screenViewport) await page.setViewportSize(screenViewport);
    await page.emulateMedia({ media: 'screen' });
    expect(await page.locator('button:visible').count()).toBeGreaterThan(0);
    expect(problems).toEqual([]);
  });

  it('packs an order and marks it shipped from the Pack List', async () => {
    const { page, problems } = session;
    const { date, order } = await packDayWithOrder(page);
    await openInApp(page, `${baseUrl}/roastery/days/${date}`);
    await page.getByRole('tab', { name: /^Pack List/ }).click();
    expect(new URL(page.url()).searchParams.get('tab')).toBe('pack');

    const card = page.getByRole('listitem').filter({ has: page.getByRole('heading', { name: new RegExp(`order ${order.orderId.slice(0, 8)}`, 'i') }) });
    if (order.status === 'roasted') await markPackedOnPage(page, card);
    await card.getByRole('button', { name: 'Mark shipped' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Carrier').fill('Kestrel Post');
    // An invented tracking number.
    await dialog.getByLabel('Tracking number').fill('wr e2e 0042');
    await dialog.getByRole('button', { name: 'Mark shipped' }).click();
    await page.getByText(/order is marked shipped \(Kestrel Post WRE2E0042\)/).waitFor();
    // Shipped orders leave the list of those still to ship; the Shipped filter shows them.
    await card.waitFor({ state: 'detached' });
    await page.getByRole('radio', { name: /^Shipped \(\d+\)$/ }).check();
    await card.getByText('Shipped', { exact: true }).waitFor();

    const packList = await getJson<PackListResponse>(page, `/api/roastery/days/${date}/pack-list`);
    expect(packList.orders.find((candidate) => candidate.orderId === order.orderId)).toMatchObject({
      status: 'shipped',
      carrier: 'Kestrel Post',
      trackingNumber: 'WRE2E0042',
    });
    expect(problems).toEqual([]);
  });

  it('the pack list bulk-ship: counts by state, then every packed order marked shipped with one carrier, each with its own tracking number', async () => {
    const { page, problems } = session;
    const { date, order } = await packDayWithOrder(page);
    await openInApp(page, `${baseUrl}/roastery/days/${date}?tab=pack`);
    const card = page.getByRole('listitem').filter({ has: page.getByRole('heading', { name: new RegExp(`order ${order.orderId.slice(0, 8)}`, 'i') }) });
    if (order.status === 'roasted') await markPackedOnPage(page, card);
    const before = await getJson<PackListResponse>(page, `/api/roastery/days/${date}/pack-list`);
    const packed = before.orders.filter((candidate) => candidate.status === 'packed');
    const shippedBefore = before.orders.filter((candidate) => candidate.status === 'shipped').length;
    await page.getByRole('radio', { name: `Packed (${packed.length})` }).waitFor();

    await page.getByRole('button', { name: `Mark all packed orders shipped (${packed.length})` }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Carrier').fill('Invented Parcel Co');
    const trackingFields = dialog.getByLabel(/^Tracking number for /);
    expect(await trackingFields.count()).toBe(packed.length);
    for (let index = 0; index < packed.length; index += 1) {
      // Invented tracking numbers, one per parcel.
      await trackingFields.nth(index).fill(`ipc bulk ${index + 1}`);
    }
    await dialog.getByRole('button', { name: /^Mark (it|all \d+) shipped$/ }).click();
    await page.getByText(/marked shipped with Invented Parcel Co/).waitFor();
    await page.getByRole('radio', { name: `Shipped (${shippedBefore + packed.length})` }).waitFor();

    const after = await getJson<PackListResponse>(page, `/api/roastery/days/${date}/pack-list`);
    for (const each of packed) {
      expect(after.orders.find((candidate) => candidate.orderId === each.orderId)).toMatchObject({ status: 'shipped', carrier: 'Invented Parcel Co' });
    }
    expect(problems).toEqual([]);
  });

  it('the owner opens Today, the Ledger with its charts, and Green Stock’s planning', async () => {
    const owned = await signedIn(owner);
    const { page, problems } = owned;
    try {
      const today = await getJson<TodayResponse>(page, '/api/roastery/today');
      expect(today.nextRoastDay).not.toBeNull();
      const roastCard = page.getByRole('region', { name: today.nextRoastDay!.isToday ? 'Roasting today' : /^Next roast day: / });
      // The Roast List link opens the next roast day, not today when today is no roast day.
      expect(await roastCard.getByRole('link', { name: 'Open the Roast List' }).getAttribute('href')).toBe(`/roastery/days/${today.nextRoastDay!.date}`);
      await page.getByRole('region', { name: 'Pack and ship today' }).getByRole('link', { name: 'Open the Pack List' }).waitFor();
      await page.getByRole('region', { name: 'Green coffee to reorder' }).waitFor();

      await page.getByRole('navigation', { name: 'Roastery' }).getByRole('link', { name: 'Ledger' }).click();
      await page.getByRole('heading', { level: 1, name: 'Ledger' }).waitFor();
      // Twelve weeks by default: a header row and one row a week.
      const sales = page.getByRole('table', { name: 'Sales by week' });
      await sales.waitFor();
      expect(await sales.getByRole('row').count()).toBe(13);
      await page.getByRole('table', { name: 'Green planning by lot' }).waitFor();
      const figureCount = await page.getByRole('main').getByRole('figure').count();
      expect(figureCount).toBeGreaterThanOrEqual(4);
      await chartsDrawn(page.getByRole('main'), figureCount);
      await page.getByRole('link', { name: 'Sales CSV' }).waitFor();

      await page.getByRole('navigation', { name: 'Roastery' }).getByRole('link', { name: 'Green Stock' }).click();
      await page.getByRole('heading', { level: 1, name: 'Green Stock' }).waitFor();
      const planning = page.getByRole('region', { name: 'Green planning, next 8 weeks' });
      const planningRows = planning.getByRole('table', { name: 'Green planning by lot' }).getByRole('row');
      await planningRows.nth(1).waitFor();
      await chartsDrawn(planning, 1);
      await planning.getByRole('link', { name: 'Planning CSV' }).waitFor();
      expect(problems).toEqual([]);
    } finally {
      await owned.context.close();
    }
  }, 60_000);

  describe('accessibility (axe-core, WCAG 2.2 AA tags)', () => {
    // Each page loads, then axe walks its whole DOM: slow on a busy machine.
    const auditTimeout = 120_000;
    const tags = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

    async function violationsOn(page: Page, path: string, ready: () => Promise<void>) {
      await openInApp(page, `${baseUrl}${path}`);
      await ready();
      // A picture of each audited page for review, named after its address.
      await page.screenshot({ path: `${screenshotDir}/${path.replace(/[^a-z0-9]+/gi, '-').replace(/^-|-$/g, '')}.png`, fullPage: true });
      const results = await new AxeBuilder({ page }).withTags(tags).analyze();
      return results.violations.map((violation) => `${path}: ${violation.id} (${violation.nodes.map((node) => node.target.join(' ')).join(', ')})`);
    }

    it(
      'finds no violations on the staff’s Roastery pages',
      async () => {
        const audit = await signedIn(roaster, { bypassCSP: true });
        const { page } = audit;
        const heading = (level: number, name: string | RegExp) => () => page.getByRole('heading', { level, name }).waitFor();
        const violations = [
          ...(await violationsOn(page, '/roastery', heading(1, 'Today'))),
          ...(await violationsOn(page, '/roastery/calendar', () => page.getByRole('table', { name: 'Roast days in the month, Monday first' }).waitFor())),
          ...(await violationsOn(page, `/roastery/days/${roastDate}`, heading(2, 'By lot and roast level'))),
          ...(await violationsOn(page, `/roastery/days/${roastDate}?tab=pack`, () => page.getByRole('link', { name: 'Labels (PDF)' }).waitFor())),
        ];
        if (recordedBatchId) violations.push(...(await violationsOn(page, `/roastery/batches/${recordedBatchId}`, heading(2, 'Orders from this batch'))));
        const traced = await tracedOrder(page);
        violations.push(
          ...(await violationsOn(page, `/roastery/batches/${traced.batchId}`, () =>
            page.getByRole('link', { name: traced.orderId.slice(0, 8).toUpperCase() }).waitFor(),
          )),
          ...(await violationsOn(page, `/roastery/orders/${traced.orderId}/trace`, () =>
            page
              .getByRole('link', { name: /^Open batch/ })
              .first()
              .waitFor(),
          )),
        );
        expect(recordedBatchId).toBeTruthy();
        expect(violations).toEqual([]);
        expect(audit.problems).toEqual([]);
        await audit.context.close();
      },
      auditTimeout,
    );

    it(
      'finds no violations on the owner’s shop settings, Today, the Ledger and Green Stock’s planning',
      async () => {
        const audit = await signedIn(owner, { bypassCSP: true });
        const { page } = audit;
        const violations = [
          ...(await violationsOn(page, '/roastery/settings', () => page.getByLabel('Time zone').waitFor())),
          ...(await violationsOn(page, '/roastery', () => page.getByRole('region', { name: 'Pack and ship today' }).waitFor())),
          ...(await violationsOn(page, '/roastery/ledger', async () => {
            await page.getByRole('table', { name: 'Green planning by lot' }).waitFor();
            await chartsDrawn(page.getByRole('main'), await page.getByRole('main').getByRole('figure').count());
          })),
          ...(await violationsOn(page, '/roastery/green-stock', () => chartsDrawn(page.getByRole('region', { name: /^Green planning, next / }), 1))),
        ];
        expect(violations).toEqual([]);
        expect(audit.problems).toEqual([]);
        await audit.context.close();
      },
      auditTimeout,
    );
  });
});
