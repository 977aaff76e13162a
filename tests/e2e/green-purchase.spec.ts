import { readFile } from 'node:fs/promises';
import AxeBuilder from '@axe-core/playwright';
import type { Browser, BrowserContext, ConsoleMessage, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { OrderDetail, OrderListResponse } from '../../shared/schemas/orders';
import { launchChromium } from '../setup/chromium';
import { openInApp } from '../setup/open-in-app';

const baseUrl = inject('baseUrl');
const mailCatcherUrl = inject('mailCatcherUrl');
const stripeFakeUrl = inject('stripeFakeUrl');

// An invented home roaster, new on every run.
const buyer = {
  name: 'Oriel Faircloth',
  email: `oriel.faircloth.${Date.now()}@example.test`,
  password: 'amber kiln over willow 7',
};
// A seeded demo lot (server/db/seed/demo-lots.ts): natural process, $18.00/kg.
const lot = { code: 'WR-24-BRA-01', name: 'Fazenda Três Pinhas' };
const staff = { email: 'roaster@wrenfield.test', password: 'restday-demo' };
// The seed's demo customer (server/db/seed/demo-people.ts), who bought this lot and keeps a Roast Journal.
const homeRoaster = { email: 'homeroaster@example.test', password: 'restday-demo' };
const journalLot = { code: 'WR-24-GTM-01', name: 'Piedra Azulada' };
const owner = { email: 'owner@wrenfield.test', password: 'restday-demo' };
const wcagTags = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

let browser: Browser;
let context: BrowserContext;
let page: Page;
const problems: string[] = [];
let orderUrl = '';

/** The payment fake's page has no icon, and Chromium asks for one; that 404 is not the shop's. */
function isPaymentPageIcon(message: ConsoleMessage): boolean {
  return message.location().url === `${stripeFakeUrl}/favicon.ico`;
}

/** A visitor's checkout starts signed out: the session check's 401 is the one failed load the shop is expected to have. */
function watchConsole(target: Page, into: string[]) {
  target.on('console', (message) => {
    if (isPaymentPageIcon(message)) return;
    if (message.type() === 'error' || message.type() === 'warning') into.push(`${message.type()}: ${message.text()} (${message.location().url})`);
  });
  target.on('pageerror', (error) => into.push(`page error: ${error.message}`));
}

beforeAll(async () => {
  browser = await launchChromium();
  // The purchase runs under the shop's real Content-Security-Policy.
  context = await browser.newContext();
  page = await context.newPage();
  page.setDefaultTimeout(10_000);
  watchConsole(page, problems);
});
afterAll(async () => {
  await context?.close();
  await browser?.close();
});

const header = () => page.getByRole('banner');

type CaughtEmail = { subject: string; text?: string; to: { address: string }[] };

async function emailsTo(address: string): Promise<CaughtEmail[]> {
  const response = await fetch(`${mailCatcherUrl}/api/email?to.address=${encodeURIComponent(address)}`);
  return (await response.json()) as CaughtEmail[];
}

/** axe-core with the WCAG 2.0–2.2 A and AA rules; each violation as "rule: help (where)". */
async function accessibilityViolations(target: Page): Promise<string[]> {
  const results = await new AxeBuilder({ page: target }).withTags(wcagTags).analyze();
  // An audit that checked nothing (a blank page, a script that did not run) must not pass as clean.
  if (results.passes.length < 10) throw new Error(`axe-core checked only ${results.passes.length} rules on ${target.url()}`);
  return results.violations.map((violation) => `${violation.id}: ${violation.help} (${violation.nodes.map((node) => node.target.join(' ')).join(', ')})`);
}

describe('a home roaster buys green coffee in Chromium', () => {
  it('filters Green Lots by process and price per lb, opens a lot, reads its roast guide and puts two sizes in the cart', async () => {
    await openInApp(page, `${baseUrl}/lots`);
    await page.getByTestId('lot-card').first().waitFor();

    await page.getByLabel('Process').selectOption('natural');
    await page.waitForURL(/process=natural/);
    await page.getByLabel('Prices').selectOption('lb');
    await page.waitForURL(/priceUnit=lb/);
    await page.getByLabel('Highest ($ per lb)').fill('10');
    await page.getByRole('button', { name: 'Apply price' }).click();
    // $10/lb = 2204.62 cents/kg (1 lb = 453.59237 g, NIST SP 811 App. B), rounded down for a ceiling.
    await page.waitForURL(/maxPricePerKgCents=2204/);
    await page
      .getByRole('status')
      .filter({ hasText: /^1 lot$/ })
      .waitFor();
    const cards = page.getByTestId('lot-card');
    expect(await cards.count()).toBe(1);

    await cards.getByRole('link', { name: lot.name }).click();
    await page.getByRole('heading', { level: 1, name: lot.name }).waitFor();

    const guide = page.getByRole('region', { name: 'Home Roast Guide' });
    await guide.getByText('Expected roasted yield').waitFor();
    // A 1 lb bag fills 454 g and a popper takes 75–80 g a batch (common practice): 6 batches.
    expect(await guide.getByText('Batches for a 1 lb bag').locator('xpath=..').getByRole('definition').first().textContent()).toBe('6');
    expect(await guide.getByText('Suggested for this lot').count()).toBe(1);
    expect(await guide.getByRole('table', { name: 'Time after first crack' }).getByRole('row').count()).toBeGreaterThan(5);

    const buy = page.getByRole('region', { name: 'Buy green' });
    await buy.getByText('1 lb', { exact: true }).click();
    await buy.getByRole('button', { name: 'Add to cart' }).click();
    await buy.getByText('Added 1 × 1 lb to your cart.').waitFor();
    await buy.getByText('8 oz', { exact: true }).click();
    await buy.getByRole('button', { name: 'Add to cart' }).click();
    await buy.getByText('Added 1 × 8 oz to your cart.').waitFor();
    await header().getByRole('link', { name: 'Cart, 2 bags' }).waitFor();
    expect(problems).toEqual([]);
  });

  it('creates an account on the way to checkout, then pays with the test card 4242 4242 4242 4242', async () => {
    await header().getByRole('link', { name: 'Cart, 2 bags' }).click();
    await page.getByRole('heading', { level: 1, name: 'Your cart' }).waitFor();
    await page.getByRole('link', { name: 'Check out' }).click();

    await page.waitForURL(/\/sign-in\?redirectTo=%2Fcheckout/);
    await page.getByRole('link', { name: 'Create an account' }).click();
    await page.getByLabel('Name').fill(buyer.name);
    await page.getByLabel('E-mail').fill(buyer.email);
    await page.getByLabel('Password', { exact: true }).fill(buyer.password);
    await page.getByRole('button', { name: 'Create account' }).click();

    await page.waitForURL(`${baseUrl}/checkout`);
    const address = page.getByRole('form', { name: 'Shipping address' });
    await address.getByLabel('Recipient’s name').fill(buyer.name);
    await address.getByLabel('Street address').fill('7 Lantern Row');
    await address.getByLabel('City or town').fill('Millbrook');
    await address.getByLabel('State or region').fill('OR');
    await address.getByLabel('ZIP or postal code').fill('97001');
    // A first checkout offers to keep the address, ticked: the address book is empty.
    expect(await address.getByLabel('Save this address for next time').isChecked()).toBe(true);
    await address.getByRole('button', { name: 'Continue to payment' }).click();

    // The payment fake's own page (not the shop): Stripe's success test card (Stripe docs, Testing).
    await page.getByRole('heading', { name: 'Test payment' }).waitFor();
    await page.getByLabel('Card number').fill('4242 4242 4242 4242');
    await page.getByLabel('Expiry date (MM/YY)').fill('12/40');
    await page.getByLabel('Security code (CVC)').fill('123');
    await page.getByRole('button', { name: /^Pay / }).click();

    await page.waitForURL(/\/orders\/[0-9a-f-]{36}\?checkout=complete$/);
    orderUrl = page.url().replace(/\?.*$/, '');
    expect(problems).toEqual([]);
  });

  it('sees the order paid once the webhook confirms it, with both bags, and the order-confirmed e-mail arrives', async () => {
    await page.getByText('Payment confirmed. Thank you!').waitFor({ timeout: 15_000 });
    await page.getByText(lot.name).first().waitFor();
    expect(await page.getByText('Paid').count()).toBeGreaterThan(0);
    await header().getByRole('link', { name: 'Cart, empty' }).waitFor();

    const deadline = Date.now() + 20_000;
    let confirmation: CaughtEmail | undefined;
    while (!confirmation && Date.now() < deadline) {
      confirmation = (await emailsTo(buyer.email)).find((email) => email.subject === 'Your green coffee order is confirmed');
      if (!confirmation) await new Promise((resolve) => setTimeout(resolve, 250));
    }
    expect(confirmation, 'the order-confirmed e-mail within 20 s').toBeDefined();
    expect(confirmation!.text).toContain(lot.name);
    expect(problems).toEqual([]);
  });

  it('the owner refunds from the order page: part of the order, asked once, and the order shows it once the payment provider confirms', async () => {
    // axe-core needs its script past the shop's CSP; this context is the owner's own.
    const ownerContext = await browser.newContext({ bypassCSP: true });
    const ownerPage = await ownerContext.newPage();
    ownerPage.setDefaultTimeout(10_000);
    const ownerProblems: string[] = [];
    watchConsole(ownerPage, ownerProblems);
    try {
      const staffOrderPath = `/roastery${new URL(orderUrl).pathname}`;
      await openInApp(ownerPage, `${baseUrl}/sign-in?redirectTo=${encodeURIComponent(staffOrderPath)}`);
      await ownerPage.getByLabel('E-mail').fill(owner.email);
      await ownerPage.getByLabel('Password', { exact: true }).fill(owner.password);
      await ownerPage.getByRole('button', { name: 'Sign in', exact: true }).click();
      await ownerPage.waitForURL(`${baseUrl}${staffOrderPath}`);
      const refund = ownerPage.getByRole('form', { name: 'Refund' });
      await refund.waitFor();
      expect(await accessibilityViolations(ownerPage)).toEqual([]);

      await refund.getByText('Part of it').click();
      await refund.getByLabel(/^Amount to refund/).fill('2.00');
      await refund.getByRole('button', { name: 'Review the refund' }).click();
      const question = ownerPage.getByRole('dialog', { name: 'Refund $2.00?' });
      await question.waitFor();
      expect(await accessibilityViolations(ownerPage)).toEqual([]);
      await question.getByRole('button', { name: 'Refund $2.00' }).click();
      await refund.getByText('Refund of $2.00 sent.', { exact: false }).waitFor();

      // The order's figures move when the charge.refunded webhook lands.
      const deadline = Date.now() + 20_000;
      while (Date.now() < deadline && (await ownerPage.getByText('$2.00 refunded.', { exact: false }).count()) === 0) {
        await new Promise((resolve) => setTimeout(resolve, 500));
        await ownerPage.reload();
        await ownerPage.getByRole('heading', { level: 2, name: 'Act on this order' }).waitFor();
      }
      expect(await ownerPage.getByText('$2.00 refunded.', { exact: false }).count()).toBeGreaterThan(0);
      expect(ownerProblems).toEqual([]);
    } finally {
      await ownerContext.close();
    }
  }, 60_000);

  it('checkout saves and reuses an address: Addresses lists it, and the next checkout starts from it', async () => {
    await openInApp(page, `${baseUrl}/account/addresses`);
    await page.getByRole('heading', { level: 1, name: 'Addresses' }).waitFor();
    await page.getByText('7 Lantern Row').waitFor();
    expect(await page.getByText('No addresses yet').count()).toBe(0);

    await openInApp(page, `${baseUrl}/lots/${lot.code}`);
    const buy = page.getByRole('region', { name: 'Buy green' });
    await buy.getByText('8 oz', { exact: true }).click();
    await buy.getByRole('button', { name: 'Add to cart' }).click();
    await buy.getByText('Added 1 × 8 oz to your cart.').waitFor();
    await openInApp(page, `${baseUrl}/checkout`);
    const address = page.getByRole('form', { name: 'Shipping address' });
    await address.getByRole('button', { name: 'Continue to payment' }).waitFor();
    expect(await address.getByLabel('Recipient’s name').inputValue()).toBe(buyer.name);
    expect(await address.getByLabel('Street address').inputValue()).toBe('7 Lantern Row');
    expect(await address.getByLabel('ZIP or postal code').inputValue()).toBe('97001');
    // Already in the book: nothing to save again unless the customer asks.
    expect(await address.getByLabel('Save this address for next time').isChecked()).toBe(false);
    expect(problems).toEqual([]);
  });

  it('an abandoned checkout is paid from Pay now: the same order, from Orders, to the payment page and back paid', async () => {
    // Where the previous step left off: at checkout with an 8 oz bag; the buyer leaves the payment page unpaid.
    await page.getByRole('form', { name: 'Shipping address' }).getByRole('button', { name: 'Continue to payment' }).click();
    await page.getByRole('heading', { name: 'Test payment' }).waitFor();
    await openInApp(page, `${baseUrl}/account/orders`);
    await page.getByRole('link', { name: 'Pay now or discard' }).click();
    await page.waitForURL(/\/orders\/[0-9a-f-]{36}$/);
    const abandonedUrl = page.url();
    const unpaid = page.getByRole('region', { name: 'Unpaid order' });
    await unpaid.getByText('This order is waiting for payment.').waitFor();
    await unpaid.getByRole('button', { name: 'Pay now' }).click();

    await page.getByRole('heading', { name: 'Test payment' }).waitFor();
    await page.getByLabel('Card number').fill('4242 4242 4242 4242');
    await page.getByLabel('Expiry date (MM/YY)').fill('12/40');
    await page.getByLabel('Security code (CVC)').fill('123');
    await page.getByRole('button', { name: /^Pay / }).click();
    await page.waitForURL(`${abandonedUrl}?checkout=complete`);
    await page.getByText('Payment confirmed. Thank you!').waitFor({ timeout: 15_000 });
    // Paid: there is no other unpaid order left behind.
    await openInApp(page, `${baseUrl}/account/orders`);
    await page.getByRole('list', { name: 'Your orders' }).waitFor();
    expect(await page.getByRole('link', { name: 'Pay now or discard' }).count()).toBe(0);
    expect(problems).toEqual([]);
  });

  describe('accessibility (axe-core, WCAG 2.0–2.2 A and AA)', () => {
    let auditContext: BrowserContext;
    let auditPage: Page;
    const auditProblems: string[] = [];
    // axe-core takes seconds a page on a busy machine.
    const auditTimeout = 45_000;

    beforeAll(async () => {
      // axe-core injects its script, which the shop's CSP would refuse; signed in as the buyer.
      auditContext = await browser.newContext({ bypassCSP: true });
      await auditContext.addCookies(await context.cookies());
      auditPage = await auditContext.newPage();
      auditPage.setDefaultTimeout(10_000);
      watchConsole(auditPage, auditProblems);
    });
    afterAll(async () => {
      await auditContext?.close();
    });

    it(
      'finds no violations on the filtered catalog',
      async () => {
        await openInApp(auditPage, `${baseUrl}/lots?process=natural&priceUnit=lb`);
        await auditPage.getByTestId('lot-card').first().waitFor();
        expect(await accessibilityViolations(auditPage)).toEqual([]);
        expect(auditProblems).toEqual([]);
      },
      auditTimeout,
    );

    it(
      'finds no violations on a lot page with its roast guide',
      async () => {
        await openInApp(auditPage, `${baseUrl}/lots/${lot.code}`);
        await auditPage.getByRole('region', { name: 'Home Roast Guide' }).getByText('Expected roasted yield').waitFor();
        expect(await accessibilityViolations(auditPage)).toEqual([]);
        await auditPage.getByRole('button', { name: 'Add to cart' }).click();
        await auditPage.getByText('Added 1 × 1 lb to your cart.').waitFor();
        expect(auditProblems).toEqual([]);
      },
      auditTimeout,
    );

    it(
      'finds no violations on the cart',
      async () => {
        await openInApp(auditPage, `${baseUrl}/cart`);
        await auditPage.getByRole('link', { name: 'Check out' }).waitFor();
        expect(await accessibilityViolations(auditPage)).toEqual([]);
        expect(auditProblems).toEqual([]);
      },
      auditTimeout,
    );

    it(
      'finds no violations on checkout',
      async () => {
        await openInApp(auditPage, `${baseUrl}/checkout`);
        await auditPage.getByRole('button', { name: 'Continue to payment' }).waitFor();
        expect(await accessibilityViolations(auditPage)).toEqual([]);
        expect(auditProblems).toEqual([]);
      },
      auditTimeout,
    );

    it(
      'finds no violations on an unpaid order with Pay now and Discard, nor in the Discard question; discarding leaves the history',
      async () => {
        // The audit's cart holds the 1 lb bag added on the lot page; checkout starts from the saved address.
        await openInApp(auditPage, `${baseUrl}/checkout`);
        await auditPage.getByRole('button', { name: 'Continue to payment' }).click();
        await auditPage.getByRole('heading', { name: 'Test payment' }).waitFor();
        await openInApp(auditPage, `${baseUrl}/account/orders`);
        await auditPage.getByRole('link', { name: 'Pay now or discard' }).click();
        const unpaid = auditPage.getByRole('region', { name: 'Unpaid order' });
        await unpaid.getByRole('button', { name: 'Pay now' }).waitFor();
        expect(await accessibilityViolations(auditPage)).toEqual([]);

        await unpaid.getByRole('button', { name: 'Discard' }).click();
        const question = auditPage.getByRole('dialog', { name: 'Discard this order?' });
        await question.waitFor();
        expect(await accessibilityViolations(auditPage)).toEqual([]);
        await question.getByRole('button', { name: 'Discard the order' }).click();
        await auditPage.waitForURL(`${baseUrl}/account/orders`);
        await auditPage.getByRole('list', { name: 'Your orders' }).waitFor();
        // The list may first show what it held before the discard; it then reads the orders again.
        await auditPage.getByRole('link', { name: 'Pay now or discard' }).waitFor({ state: 'detached' });
        expect(auditProblems).toEqual([]);
      },
      auditTimeout,
    );

    it(
      'finds no violations on the paid order',
      async () => {
        await openInApp(auditPage, orderUrl);
        await auditPage.getByRole('heading', { level: 1, name: 'Your order' }).waitFor();
        expect(await accessibilityViolations(auditPage)).toEqual([]);
        expect(auditProblems).toEqual([]);
      },
      auditTimeout,
    );

    it(
      'finds no violations on Green Stock, signed in as staff',
      async () => {
        const staffContext = await browser.newContext({ bypassCSP: true });
        const staffPage = await staffContext.newPage();
        staffPage.setDefaultTimeout(10_000);
        const staffProblems: string[] = [];
        watchConsole(staffPage, staffProblems);
        try {
          await openInApp(staffPage, `${baseUrl}/sign-in?redirectTo=${encodeURIComponent('/roastery/green-stock')}`);
          await staffPage.getByLabel('E-mail').fill(staff.email);
          await staffPage.getByLabel('Password', { exact: true }).fill(staff.password);
          await staffPage.getByRole('button', { name: 'Sign in', exact: true }).click();
          await staffPage.waitForURL(`${baseUrl}/roastery/green-stock`);
          await staffPage.getByRole('heading', { level: 1, name: 'Green Stock' }).waitFor();
          await staffPage.getByText(lot.code).first().waitFor();

          expect(await accessibilityViolations(staffPage)).toEqual([]);
          expect(staffProblems).toEqual([]);
        } finally {
          await staffContext.close();
        }
      },
      auditTimeout,
    );
  });
});

describe('the demo customer keeps a Roast Journal in Chromium', () => {
  let journalContext: BrowserContext;
  let journalPage: Page;
  const journalProblems: string[] = [];

  beforeAll(async () => {
    // The shop's real Content-Security-Policy: the charts must draw under it.
    journalContext = await browser.newContext({ acceptDownloads: true });
    journalPage = await journalContext.newPage();
    journalPage.setDefaultTimeout(10_000);
    await openInApp(journalPage, `${baseUrl}/sign-in?redirectTo=${encodeURIComponent('/account/orders')}`);
    await journalPage.getByLabel('E-mail').fill(homeRoaster.email);
    await journalPage.getByLabel('Password', { exact: true }).fill(homeRoaster.password);
    await journalPage.getByRole('button', { name: 'Sign in', exact: true }).click();
    await journalPage.waitForURL(`${baseUrl}/account/orders`);
    // The sign-in page's check of who is signed in answers 401 before signing in; only what follows counts.
    watchConsole(journalPage, journalProblems);
  });
  afterAll(async () => {
    await journalContext?.close();
  });

  /** The demo customer's paid green order that holds the journal's lot. */
  async function orderWithJournalLot(): Promise<string> {
    const list = (await (await journalPage.request.get(`${baseUrl}/api/orders`)).json()) as OrderListResponse;
    for (const summary of list.items.filter((each) => each.kind === 'green')) {
      const order = (await (await journalPage.request.get(`${baseUrl}/api/orders/${summary.id}`)).json()) as OrderDetail;
      if (order.status !== 'pending_payment' && order.items.some((item) => item.lotCode === journalLot.code)) return order.id;
    }
    throw new Error(`The demo customer has no paid order of ${journalLot.code}.`);
  }

  it('logs a roast from an order: the form starts with the lot, and the roast shows its figures, its phases (chart and table) and the lot’s roasts side by side', async () => {
    const page = journalPage;
    await openInApp(page, `${baseUrl}/orders/${await orderWithJournalLot()}`);
    await page
      .getByRole('list', { name: 'Bags in this order' })
      .getByRole('listitem')
      .filter({ hasText: journalLot.name })
      .getByRole('link', { name: 'Log a roast of this lot' })
      .click();
    await page.waitForURL(`${baseUrl}/account/journal?lot=${journalLot.code}&log=1`);
    const form = page.getByRole('form', { name: 'Log a roast' });
    expect(await form.getByLabel('Lot').inputValue()).toBe(journalLot.code);

    // The hand-worked popper roast: 80 g → 68 g, yellow 2:30, first crack 3:00, end 3:25.
    await form.getByLabel('Green weight (g)').fill('80');
    await form.getByLabel('Roasted weight (g)').fill('68');
    await form.getByLabel('Yellow (optional)').fill('2:30');
    await form.getByLabel('First crack (optional)').fill('3:00');
    await form.getByLabel('End').fill('3:25');
    await form.getByRole('button', { name: 'Save roast' }).click();
    await form.waitFor({ state: 'detached' });

    const shown = page.getByRole('region', { name: new RegExp(`^${journalLot.name}, `) });
    const figure = (term: string) => shown.getByText(term, { exact: true }).locator('xpath=following-sibling::dd[1]');
    // (80 − 68) ÷ 80 = 15.0 % (arithmetic), shown to one decimal where it has one; medium loses 14–16 % (level bands, from memory).
    expect(await figure('Weight loss').textContent()).toBe('15% (80 g → 68 g)');
    // 205 s − 180 s = 25 s after first crack; 25 ÷ 205 = 12.2 % (S. Rao, "Development Time Ratio", 2016).
    expect(await figure('Development time').textContent()).toBe('25 s');
    expect(await figure('Development time ratio').textContent()).toBe('12.2%');
    expect(await figure('Level the loss points to').textContent()).toBe('Medium');

    const phases = shown.getByRole('figure', { name: 'Phases of this roast' });
    // The chart is drawn (an SVG from the charting package), and the same phases are a table for screen readers.
    await phases.locator('svg.recharts-surface').waitFor();
    const rows = phases.getByRole('table').getByRole('row');
    expect(await rows.allTextContents()).toEqual(['PhaseFromToLength', 'Drying0:002:30150 s', 'Browning2:303:00 (first crack)30 s', 'Development3:003:2525 s']);
    const lotRoasts = shown.getByRole('figure', { name: 'Your roasts of this lot' });
    await lotRoasts.locator('svg.recharts-surface').waitFor();
    // The seeded roasts of this lot and the new one, side by side.
    expect(await lotRoasts.getByRole('table').getByRole('row').count()).toBeGreaterThan(2);
    expect(
      await lotRoasts
        .getByRole('row', { name: /\(this roast\)/ })
        .getByRole('cell')
        .allTextContents(),
    ).toEqual(['25 s', '15%']);
    expect(journalProblems).toEqual([]);
  });

  it('exports the journal as CSV with the new roast’s figures in it', async () => {
    const page = journalPage;
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download CSV' }).click()]);
    expect(download.suggestedFilename()).toBe('roast-journal.csv');
    const lines = (await readFile((await download.path())!, 'utf8')).trim().split('\n');
    expect(lines[0]).toBe(
      'roasted_on,lot_code,lot_name,device,green_grams,roasted_grams,yellow_seconds,first_crack_seconds,end_seconds,loss_pct,' +
        'development_seconds,development_time_ratio_pct,level_reached,estimated_level,notes',
    );
    // Newest first: the roast just logged, then the seeded ones.
    expect(lines[1]).toMatch(new RegExp(`^\\d{4}-\\d{2}-\\d{2},${journalLot.code},${journalLot.name},popper,80,68,150,180,205,15,25,12.2,,medium,$`));
    expect(lines.length).toBeGreaterThan(2);
    expect(journalProblems).toEqual([]);
  });

  it('finds no violations on the Roast Journal, with a roast shown and with the form open', async () => {
    const auditContext = await browser.newContext({ bypassCSP: true });
    await auditContext.addCookies(await journalContext.cookies());
    const auditPage = await auditContext.newPage();
    auditPage.setDefaultTimeout(10_000);
    const auditProblems: string[] = [];
    watchConsole(auditPage, auditProblems);
    try {
      await openInApp(auditPage, `${baseUrl}/account/journal`);
      await auditPage.getByRole('figure', { name: 'Phases of this roast' }).locator('svg.recharts-surface').waitFor();
      expect(await accessibilityViolations(auditPage)).toEqual([]);
      await openInApp(auditPage, `${baseUrl}/account/journal?lot=${journalLot.code}&log=1`);
      await auditPage.getByRole('form', { name: 'Log a roast' }).waitFor();
      expect(await accessibilityViolations(auditPage)).toEqual([]);
      expect(auditProblems).toEqual([]);
    } finally {
      await auditContext.close();
    }
  }, 45_000);
});
