import type { Browser, BrowserContext, ConsoleMessage, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { launchChromium } from '../setup/chromium';
import { openInApp } from '../setup/open-in-app';

const baseUrl = inject('baseUrl');
const mailCatcherUrl = inject('mailCatcherUrl');

// An invented customer, new on every run.
const customer = {
  name: 'Tamsin Okerlund',
  email: `tamsin.okerlund.${Date.now()}@example.test`,
  password: 'kettle lantern orchard 42',
  newPassword: 'quiet heron under copper rain',
};

let browser: Browser;
let context: BrowserContext;
let page: Page;
const problems: string[] = [];

/**
 * A wrong password and a used reset link are refused with a 4xx, which Chromium logs as a failed
 * load; these flows expect them and check the refusal on screen instead.
 */
function isRefusedAuthRequest(message: ConsoleMessage): boolean {
  const url = message.location().url;
  return message.text().startsWith('Failed to load resource') && /\/api\/auth\/(sign-in|password-reset\/confirm)$/.test(url);
}

beforeAll(async () => {
  browser = await launchChromium();
  context = await browser.newContext();
  page = await context.newPage();
  // A step that cannot happen fails with its locator named, well inside the test's own time limit.
  page.setDefaultTimeout(10_000);
  page.on('console', (message) => {
    if (isRefusedAuthRequest(message)) return;
    if (message.type() === 'error' || message.type() === 'warning') problems.push(`${message.type()}: ${message.text()} (${message.location().url})`);
  });
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
});
afterAll(async () => {
  await context?.close();
  await browser?.close();
});

type CaughtEmail = { subject: string; text?: string; html?: string; time: string };

/** Waits for the password-reset e-mail to `address` in the mail catcher and returns its link. */
async function resetLinkFor(address: string): Promise<string> {
  const deadline = Date.now() + 45_000;
  while (Date.now() < deadline) {
    const response = await fetch(`${mailCatcherUrl}/api/email?to.address=${encodeURIComponent(address)}`);
    const emails = (await response.json()) as CaughtEmail[];
    for (const email of emails) {
      const body = `${email.text ?? ''} ${email.html ?? ''}`.replaceAll('&amp;', '&');
      const link = /https?:\/\/[^\s"'<>]+\/reset-password#token=[^\s"'<>]+/.exec(body)?.[0];
      if (link) return link;
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`No password-reset e-mail reached ${address} within 45 s.`);
}

const header = () => page.getByRole('banner');

async function signOut() {
  await header()
    .getByRole('button', { name: /Account menu/ })
    .click();
  await header().getByRole('button', { name: 'Sign out', exact: true }).click();
  await header().getByRole('link', { name: 'Sign in', exact: true }).waitFor();
}

/** Presses Tab until `target` has the focus, as someone without a mouse would. */
async function tabTo(target: Locator) {
  for (let presses = 0; presses < 40; presses++) {
    if (await target.evaluate((element) => element === document.activeElement)) return;
    await page.keyboard.press('Tab');
  }
  throw new Error('Tab never reached the element.');
}

async function signIn(password: string) {
  await page.getByLabel('E-mail').fill(customer.email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
}

describe('accounts in a real browser', () => {
  it('a visitor creates an account and lands in it, signed in', async () => {
    await openInApp(page, `${baseUrl}/`);
    await header().getByRole('link', { name: 'Sign in', exact: true }).click();
    await page.getByRole('link', { name: 'Create an account' }).click();
    await page.getByRole('heading', { level: 1, name: 'Create your account' }).waitFor();

    await page.getByLabel('Name').fill(customer.name);
    await page.getByLabel('E-mail').fill(customer.email);
    await page.getByLabel('Password', { exact: true }).fill(customer.password);
    await page.getByRole('button', { name: 'Create account' }).click();

    await page.getByRole('heading', { level: 1, name: `Hello, ${customer.name}` }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/account');
    expect(
      await header()
        .getByRole('button', { name: /Account menu/ })
        .textContent(),
    ).toContain(customer.name);
    // A customer is not offered the Roastery.
    expect(await page.getByRole('link', { name: 'Roastery' }).count()).toBe(0);
  });

  it('signs out from the account menu and the account area asks for a sign-in again', async () => {
    await signOut();
    await openInApp(page, `${baseUrl}/account/profile`);
    await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
    expect(new URL(page.url()).searchParams.get('redirectTo')).toBe('/account/profile');
  });

  it('signs in with the keyboard alone and returns to the page that asked for it', async () => {
    await tabTo(page.getByLabel('E-mail'));
    await page.keyboard.type(customer.email);
    await page.keyboard.press('Tab');
    await page.keyboard.type(customer.password);
    await page.keyboard.press('Enter');

    await page.getByRole('heading', { level: 1, name: 'Profile' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/account/profile');

    // The account menu opens, is walked and closes from the keyboard too.
    const menuButton = header().getByRole('button', { name: /Account menu/ });
    await tabTo(menuButton);
    await page.keyboard.press('Enter');
    expect(await menuButton.getAttribute('aria-expanded')).toBe('true');
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe('Your account');
    await page.keyboard.press('Escape');
    expect(await menuButton.getAttribute('aria-expanded')).toBe('false');
    expect(await menuButton.evaluate((element) => element === document.activeElement)).toBe(true);

    await page.keyboard.press('Enter');
    await tabTo(header().getByRole('button', { name: 'Sign out', exact: true }));
    await page.keyboard.press('Enter');
    await header().getByRole('link', { name: 'Sign in', exact: true }).waitFor();
  });

  it('resets a forgotten password through the e-mail and signs in with the new one', async () => {
    await header().getByRole('link', { name: 'Sign in', exact: true }).click();
    await page.getByRole('link', { name: 'Forgot your password?' }).click();
    // The next page loads its code first; until then the sign-in form, with its own E-mail field, stays up.
    await page.getByRole('heading', { level: 1, name: 'Forgot your password?' }).waitFor();
    await page.getByLabel('E-mail').fill(customer.email);
    await page.getByRole('button', { name: 'Send the reset link' }).click();
    await page.getByRole('heading', { name: 'Check your e-mail' }).waitFor();

    const link = await resetLinkFor(customer.email);
    // The token rides in the fragment, which the browser never sends to the server.
    expect(link.startsWith(`${baseUrl}/reset-password#token=`)).toBe(true);
    await openInApp(page, link);
    await page.getByLabel('New password', { exact: true }).fill(customer.newPassword);
    await page.getByRole('button', { name: 'Save the new password' }).click();

    await page.getByText('Your password is changed').waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');

    await signIn(customer.password);
    await page.getByRole('alert').waitFor();

    await signIn(customer.newPassword);
    await page.getByRole('heading', { level: 1, name: `Hello, ${customer.name}` }).waitFor();

    // The link was single-use.
    await openInApp(page, link);
    await page.getByLabel('New password', { exact: true }).fill('another fresh passphrase here');
    await page.getByRole('button', { name: 'Save the new password' }).click();
    await page.getByRole('alert').waitFor();
  }, 90_000);

  it('left no console errors or warnings on any page', () => {
    expect(problems).toEqual([]);
  });
});
