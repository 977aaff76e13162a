import AxeBuilder from '@axe-core/playwright';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { launchChromium } from '../setup/chromium';
import { openInApp } from '../setup/open-in-app';

const baseUrl = inject('baseUrl');
const mailCatcherUrl = inject('mailCatcherUrl');

// An invented subscriber, new on every run.
const customer = {
  name: 'Perrin Achterberg',
  email: `perrin.achterberg.${Date.now()}@example.test`,
  password: 'saddle meadow lantern 73',
};

let browser: Browser;
let context: BrowserContext;
let page: Page;
const problems: string[] = [];

beforeAll(async () => {
  browser = await launchChromium();
  // axe-core runs as an injected script, which the product's strict CSP would refuse.
  context = await browser.newContext({ bypassCSP: true });
  page = await context.newPage();
  page.setDefaultTimeout(15_000);
  page.on('console', (message) => {
    // The payment fake's page is not the product's (its missing favicon is its own affair).
    if (!page.url().startsWith(baseUrl)) return;
    if (message.type() === 'error' || message.type() === 'warning') problems.push(`${message.type()}: ${message.text()} (${message.location().url})`);
  });
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
});
afterAll(async () => {
  await context?.close();
  await browser?.close();
});

/** WCAG 2.2 AA and below, as axe-core checks them; each violation named with where it is. */
async function accessibilityViolations(): Promise<string[]> {
  const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  return results.violations.flatMap((violation) => violation.nodes.map((node) => `${violation.id}: ${node.target.join(' ')}`));
}

/** The invented subscriber's address on the shipping step, then on to the payment page. */
async function fillShippingAddressAndPay() {
  await page.getByLabel('Recipient’s name').fill(customer.name);
  await page.getByLabel('Street address').fill('27 Tannery Row');
  await page.getByLabel('City or town').fill('Millbrook Falls');
  await page.getByLabel('State or region').fill('CO');
  await page.getByLabel('ZIP or postal code').fill('80000');
  await page.getByRole('button', { name: 'Continue to payment' }).click();
}

type CaughtEmail = { subject: string; time: string };

/** Waits until the mail catcher holds a message to `address` whose subject matches each of `subjects`. */
async function emailSubjectsFor(address: string, subjects: RegExp[]): Promise<string[]> {
  const deadline = Date.now() + 45_000;
  let seen: string[] = [];
  while (Date.now() < deadline) {
    const response = await fetch(`${mailCatcherUrl}/api/email?to.address=${encodeURIComponent(address)}`);
    seen = ((await response.json()) as CaughtEmail[]).map((email) => email.subject);
    if (subjects.every((subject) => seen.some((each) => subject.test(each)))) return seen;
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`E-mails to ${address} within 45 s: ${seen.join(' | ') || 'none'}; wanted ${subjects.join(', ')}.`);
}

const schedule = () => page.getByRole('table', { name: /^Upcoming deliveries of / });

describe('Roasted to Order in a real browser', () => {
  it('a visitor builds a subscription from a lot, with its price and first deliveries, and no accessibility violations', async () => {
    await openInApp(page, `${baseUrl}/lots`);
    await page.getByTestId('lot-card').first().getByRole('link').first().click();
    await page.getByRole('link', { name: 'Subscribe to this lot, roasted to order' }).click();

    await page.getByRole('heading', { level: 1, name: 'Roasted to Order' }).waitFor();
    await page.getByRole('list', { name: 'First three deliveries' }).waitFor();
    expect(await page.getByRole('list', { name: 'First three deliveries' }).getByRole('listitem').count()).toBe(3);
    const coffee = page.getByRole('group', { name: /^Coffee/ });
    expect(await coffee.getByRole('radio', { checked: true }).getAttribute('value')).not.toBe('rotation');

    await page.getByRole('group', { name: 'Bag size' }).getByRole('radio', { name: /^1 lb/ }).check();
    await page
      .getByRole('group', { name: /^Brew method/ })
      .getByRole('radio', { name: /^Espresso/ })
      .check();
    await page.getByRole('group', { name: 'How often' }).getByRole('radio', { name: 'Every 2 weeks' }).check();
    await page.waitForURL((url) => url.searchParams.get('size') === '1lb' && url.searchParams.get('brew') === 'espresso');
    await page.getByText(/subscription discount on the coffee/).waitFor();

    expect(await accessibilityViolations()).toEqual([]);
    expect(problems).toEqual([]);
  }, 60_000);

  it('signs up on the way to checkout and comes back to the shipping step with every choice kept', async () => {
    await page.getByRole('button', { name: 'Sign in to continue' }).click();
    await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
    await page.getByRole('link', { name: 'Create an account' }).click();
    await page.getByRole('heading', { level: 1, name: 'Create your account' }).waitFor();
    await page.getByLabel('Name').fill(customer.name);
    await page.getByLabel('E-mail').fill(customer.email);
    await page.getByLabel('Password', { exact: true }).fill(customer.password);
    await page.getByRole('button', { name: 'Create account' }).click();

    await page.getByRole('heading', { level: 1, name: 'Where your coffee ships' }).waitFor();
    const search = new URL(page.url()).searchParams;
    expect(new URL(page.url()).pathname).toBe('/subscribe/shipping');
    expect([search.get('size'), search.get('brew'), search.get('every')]).toEqual(['1lb', 'espresso', '2']);
    expect(problems).toEqual([]);
  });

  it('pays with 4242 on the payment page and sees the schedule once the payment is confirmed', async () => {
    await fillShippingAddressAndPay();

    await page.getByRole('heading', { name: 'Test payment' }).waitFor();
    await page.getByLabel('Card number').fill('4242 4242 4242 4242');
    await page.getByLabel('Expiry date (MM/YY)').fill('12/34');
    await page.getByLabel('Security code (CVC)').fill('123');
    await page.getByRole('button', { name: /^Pay / }).click();

    await page.waitForURL((url) => /^\/subscriptions\/[0-9a-f-]+$/.test(url.pathname) && url.searchParams.get('checkout') === 'complete');
    await page.getByText('Your subscription has started. Thank you!').waitFor({ timeout: 30_000 });
    await schedule().waitFor();
    expect(await schedule().getByRole('row').count()).toBeGreaterThan(2);
    expect(problems).toEqual([]);
  }, 60_000);

  it('Deliveries marks the paid delivery; skipping it says where the payment moves, undo brings it back, skip again; then a level change', async () => {
    await page.getByRole('link', { name: 'Skip, pause or change in Deliveries' }).click();
    await page.getByRole('heading', { level: 1, name: 'Deliveries' }).waitFor();
    await schedule().waitFor();
    const paidBadges = schedule().getByText('Paid', { exact: true });
    await paidBadges.first().waitFor();
    // The first payment paid for exactly one delivery.
    expect(await paidBadges.count()).toBe(1);
    expect(await accessibilityViolations()).toEqual([]);

    // The next delivery that can be skipped is the paid one.
    const skipButton = page.getByRole('button', { name: /^Skip the delivery roasting / });
    const skippedDay = ((await skipButton.textContent()) ?? '').replace('Skip the delivery roasting ', '');
    const skippedRow = () => schedule().getByRole('row', { name: new RegExp(skippedDay) });
    expect(await skippedRow().getByText('Paid', { exact: true }).count()).toBe(1);
    await skipButton.click();
    const moved = page
      .getByRole('status')
      .filter({ hasText: /It is already paid, so your payment moves to the delivery of [A-Z][a-z]+day, [A-Z][a-z]+ \d{1,2}, \d{4}\./ });
    await moved.waitFor();
    expect(await moved.textContent()).not.toMatch(/\d{4}-\d{2}-\d{2}/);
    await skippedRow().filter({ hasText: 'Skipped' }).waitFor();
    expect(await skippedRow().getByText('Paid', { exact: true }).count()).toBe(0);
    expect(await paidBadges.count()).toBe(1);

    await page.getByRole('button', { name: `Undo skip of the delivery of ${skippedDay}` }).click();
    await page
      .getByRole('status')
      .filter({ hasText: /is back on\. Your payment moves back to it from the delivery of / })
      .waitFor();
    await skippedRow().getByText('Paid', { exact: true }).waitFor();
    expect(await accessibilityViolations()).toEqual([]);

    await page.getByRole('button', { name: `Skip the delivery of ${skippedDay}` }).click();
    await skippedRow().filter({ hasText: 'Skipped' }).waitFor();

    await page.getByRole('button', { name: 'Change level, size, grind or cadence' }).click();
    const form = page.getByRole('form', { name: 'Change what each delivery brings' });
    const newLevel = form
      .getByRole('group', { name: /^Roast level/ })
      .getByRole('radio', { checked: false })
      .first();
    const levelName = (await newLevel.evaluate((radio) => radio.closest('label')?.textContent ?? '')).trim();
    await newLevel.check();
    await form.getByRole('button', { name: 'Save the changes' }).click();
    await page.getByRole('status').filter({ hasText: 'Your subscription is changed.' }).waitFor();
    await schedule()
      .getByRole('row')
      .filter({ hasText: `, ${levelName}, ` })
      .first()
      .waitFor();
    expect(await accessibilityViolations()).toEqual([]);

    const subjects = await emailSubjectsFor(customer.email, [
      /^Your Roasted to Order subscription has started$/,
      /^Delivery skipped|^Your delivery is skipped$/,
      /^Your Roasted to Order subscription is updated$/,
    ]);
    expect(subjects.length).toBeGreaterThanOrEqual(3);
    expect(problems).toEqual([]);
  }, 90_000);

  it('the roastery finds the new subscriber with their deliveries, and picks the Roaster’s Rotation lot for a roast day', async () => {
    const staffContext = await browser.newContext({ bypassCSP: true });
    const staffPage = await staffContext.newPage();
    staffPage.setDefaultTimeout(15_000);
    const staffProblems: string[] = [];
    staffPage.on('console', (message) => {
      if (message.type() === 'error' || message.type() === 'warning') staffProblems.push(`${message.type()}: ${message.text()} (${message.location().url})`);
    });
    try {
      // A member of the invented demo team.
      await openInApp(staffPage, `${baseUrl}/sign-in?redirectTo=${encodeURIComponent('/roastery/subscribers')}`);
      await staffPage.getByLabel('E-mail').fill('roaster@wrenfield.test');
      await staffPage.getByLabel('Password', { exact: true }).fill('restday-demo');
      await staffPage.getByRole('button', { name: 'Sign in', exact: true }).click();
      await staffPage.getByRole('heading', { level: 1, name: 'Subscribers' }).waitFor();

      await staffPage.getByLabel('Name or e-mail').fill(customer.email);
      await staffPage.waitForURL((url) => url.searchParams.get('q') === customer.email);
      await staffPage
        .getByRole('table', { name: /^Subscribers, page 1 of 1/ })
        .getByRole('link', { name: customer.name })
        .waitFor();
      expect(await staffPage.getByRole('link', { name: 'Download these as CSV' }).getAttribute('href')).toBe(
        `/api/roastery/subscribers.csv?q=${encodeURIComponent(customer.email).replaceAll('%20', '+')}`,
      );
      expect(
        await new AxeBuilder({ page: staffPage })
          .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'])
          .analyze()
          .then((r) => r.violations.map((v) => v.id)),
      ).toEqual([]);

      await staffPage.getByRole('link', { name: customer.name }).click();
      await staffPage.getByRole('heading', { level: 1, name: customer.name }).waitFor();
      const deliveries = staffPage.getByRole('table', { name: 'Deliveries of this subscription' });
      await deliveries.waitFor();
      expect(await deliveries.getByRole('row').filter({ hasText: 'Skipped' }).count()).toBe(1);

      await staffPage.getByRole('navigation', { name: 'Roastery' }).getByRole('link', { name: 'Rotation' }).click();
      const day = staffPage.getByRole('list', { name: 'Roast days' }).getByRole('listitem').first();
      await day.waitFor();
      const lot = day.getByLabel('Lot');
      const firstLot = await lot.locator('option').nth(1).getAttribute('value');
      await lot.selectOption(firstLot ?? '');
      await day.getByRole('button', { name: 'Save the pick' }).click();
      await day.getByText(/is the Roaster’s Rotation on /).waitFor();
      expect(
        await new AxeBuilder({ page: staffPage })
          .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'])
          .analyze()
          .then((r) => r.violations.map((v) => v.id)),
      ).toEqual([]);
      expect(staffProblems).toEqual([]);
    } finally {
      await staffContext.close();
    }
  }, 90_000);
  it('leaving the payment page unpaid comes back to the builder with the same choices, not the defaults', async () => {
    await openInApp(page, `${baseUrl}/subscribe`);
    await page.getByRole('list', { name: 'First three deliveries' }).waitFor();
    await page.getByRole('group', { name: 'Bag size' }).getByRole('radio', { name: /^2 lb/ }).check();
    await page
      .getByRole('group', { name: /^Brew method/ })
      .getByRole('radio', { name: /^Espresso/ })
      .check();
    await page
      .getByRole('group', { name: /^Grind/ })
      .getByRole('radio', { name: 'Espresso' })
      .check();
    await page.getByRole('group', { name: 'How often' }).getByRole('radio', { name: 'Every 4 weeks' }).check();
    await page.waitForURL((url) => url.searchParams.get('size') === '2lb' && url.searchParams.get('every') === '4');
    await page.getByRole('button', { name: 'Continue to the shipping address' }).click();

    await page.getByRole('heading', { level: 1, name: 'Where your coffee ships' }).waitFor();
    await fillShippingAddressAndPay();
    await page.getByRole('heading', { name: 'Test payment' }).waitFor();
    await page.getByRole('link', { name: 'Cancel and go back to the shop' }).click();

    await page.getByText(/Your choices are below/).waitFor();
    expect(new URL(page.url()).pathname).toBe('/subscribe');
    await page.getByRole('list', { name: 'First three deliveries' }).waitFor();
    const checked = (group: string | RegExp) => page.getByRole('group', { name: group }).getByRole('radio', { checked: true });
    expect(await checked('Bag size').getAttribute('value')).toBe('2lb');
    expect(await checked(/^Brew method/).getAttribute('value')).toBe('espresso');
    expect(await checked(/^Grind/).getAttribute('value')).toBe('espresso');
    expect(await checked('How often').getAttribute('value')).toBe('4');
    expect(problems).toEqual([]);
  }, 60_000);
});
