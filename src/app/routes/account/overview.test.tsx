// @vitest-environment happy-dom
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { makeUser, renderApp } from '@/testing/test-utils';

afterEach(cleanup);

describe('account area', () => {
  it('sends a visitor to sign in, with the way back', async () => {
    const { router } = renderApp('/account/profile?from=menu');

    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(router.state.location.search).toBe('?redirectTo=%2Faccount%2Fprofile%3Ffrom%3Dmenu');
  });

  it('greets the signed-in customer and leads to their profile, orders and addresses', async () => {
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
    const journalCard = screen.getByRole('heading', { level: 2, name: 'Roast Journal' });
    expect(within(journalCard).getByRole('link').getAttribute('href')).toBe('/account/journal');
    await waitFor(() => expect(document.title).toBe('Your account · Restday'));
  });

  it('is open to staff and the owner too, for their own profile', async () => {
    renderApp('/account', { session: makeUser({ role: 'owner', name: 'Wren Calloway' }) });
    expect(await screen.findByRole('heading', { level: 1, name: 'Hello, Wren Calloway' })).toBeTruthy();
  });
});
