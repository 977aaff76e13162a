// @vitest-environment happy-dom
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, makeSubscription, makeUser, renderApp, stubFetch } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('account area', () => {
  it('sends a visitor to sign in, with the way back', async () => {
    const { router } = renderApp('/account/profile?from=menu');

    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(router.state.location.search).toBe('?redirectTo=%2Faccount%2Fprofile%3Ffrom%3Dmenu');
  });

  it('greets the signed-in customer and leads to their profile, orders and addresses', async () => {
    stubFetch(() => jsonResponse({ items: [] }));
    renderApp('/account', { session: makeUser() });

    expect(await screen.findByRole('heading', { level: 1, name: 'Hello, Ines Marlow' })).toBeTruthy();
    expect(within(screen.getByRole('main')).getByText('ines.marlow@example.test')).toBeTruthy();
    const nav = screen.getByRole('navigation', { name: 'Account' });
    expect(
      within(nav)
        .getAllByRole('link')
        .map((link) => link.textContent),
    ).toEqual(['Overview', 'Profile', 'Orders', 'Deliveries', 'Roast Journal', 'Addresses']);
    expect(within(nav).getByRole('link', { name: 'Overview' }).getAttribute('aria-current')).toBe('page');
    // The area's menu and the overview's card both lead there.
    const journalLinks = within(screen.getByRole('main')).getAllByRole('link', { name: 'Roast Journal' });
    expect(journalLinks.map((link) => link.getAttribute('href'))).toEqual(['/account/journal', '/account/journal']);
    await waitFor(() => expect(document.title).toBe('Your account · Restday'));
  });

  it('is open to staff and the owner too, for their own profile', async () => {
    stubFetch(() => jsonResponse({ items: [] }));
    renderApp('/account', { session: makeUser({ role: 'owner', name: 'Wren Calloway' }) });
    expect(await screen.findByRole('heading', { level: 1, name: 'Hello, Wren Calloway' })).toBeTruthy();
  });
  it('shows the next delivery’s roast, ship and ready-from days when the customer subscribes', async () => {
    const subscription = makeSubscription();
    stubFetch((url) =>
      url.pathname === '/api/subscriptions' ? jsonResponse({ items: [subscription] }) : jsonResponse({ error: { code: 'not_found', message: 'No fake' } }, 404),
    );
    renderApp('/account', { session: makeUser() });

    const next = await screen.findByRole('region', { name: 'Next delivery' }, { timeout: 10_000 });
    expect(next.textContent).toMatch(/Roasted.*Wed, Dec 9, 2026.*Ships.*Thu, Dec 10, 2026.*Ready from.*Mon, Dec 14, 2026/);
    expect(within(next).getByRole('link', { name: 'See your deliveries' }).getAttribute('href')).toBe('/account/deliveries');
  });
});
