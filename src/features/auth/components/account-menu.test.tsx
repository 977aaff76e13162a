// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, makeUser, renderApp, sentRequests, stubFetch } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

/** The site header: the first banner (a page's own <header> inside <main> is not one in a browser). */
async function siteHeader(): Promise<HTMLElement> {
  return (await screen.findAllByRole('banner'))[0] as HTMLElement;
}

describe('the header’s signed-in state', () => {
  it('offers a visitor "Sign in", coming back to the page they were on', async () => {
    stubFetch(() => jsonResponse({ items: [] }));
    renderApp('/lots?process=natural');

    const signIn = await within(await siteHeader()).findByRole('link', { name: 'Sign in' });
    expect(signIn.getAttribute('href')).toBe('/sign-in?redirectTo=%2Flots%3Fprocess%3Dnatural');
    expect(within(await siteHeader()).queryByRole('link', { name: 'Roastery' })).toBeNull();
  });

  it('opens the account menu from the keyboard and closes it with Escape, back on its button', async () => {
    stubFetch(() => jsonResponse({ items: [] }));
    renderApp('/', { session: makeUser() });

    const button = await within(await siteHeader()).findByRole('button', { name: 'Account menu: Ines Marlow' });
    expect(button.getAttribute('aria-expanded')).toBe('false');
    const panel = document.getElementById(button.getAttribute('aria-controls') ?? '') as HTMLElement;
    expect(panel.hidden).toBe(true);

    fireEvent.click(button);
    expect(button.getAttribute('aria-expanded')).toBe('true');
    expect(panel.hidden).toBe(false);
    expect(
      within(panel)
        .getAllByRole('link')
        .map((link) => link.getAttribute('href')),
    ).toEqual(['/account', '/account/profile', '/account/addresses']);
    expect(within(panel).getByText('ines.marlow@example.test')).toBeTruthy();

    const firstLink = within(panel).getAllByRole('link')[0] as HTMLElement;
    firstLink.focus();
    fireEvent.keyDown(firstLink, { key: 'Escape' });
    expect(button.getAttribute('aria-expanded')).toBe('false');
    expect(document.activeElement).toBe(button);
  });

  it('shows the Roastery link to staff only', async () => {
    stubFetch(() => jsonResponse({ items: [] }));
    renderApp('/', { session: makeUser({ role: 'staff' }) });
    expect((await within(await siteHeader()).findByRole('link', { name: 'Roastery' })).getAttribute('href')).toBe('/roastery');
    cleanup();

    renderApp('/', { session: makeUser({ role: 'customer' }) });
    await within(await siteHeader()).findByRole('button', { name: /Account menu/ });
    expect(within(await siteHeader()).queryByRole('link', { name: 'Roastery' })).toBeNull();
  });

  it('signs out, leaves the account area for the shop and shows "Sign in" again', async () => {
    const fetchMock = stubFetch((url) => (url.pathname === '/api/auth/sign-out' ? new Response(null, { status: 204 }) : jsonResponse({ items: [] })));
    const { router } = renderApp('/account', { session: makeUser() });

    fireEvent.click(await within(await siteHeader()).findByRole('button', { name: /Account menu/ }));
    fireEvent.click(within(await siteHeader()).getByRole('button', { name: 'Sign out' }));

    expect(await within(await siteHeader()).findByRole('link', { name: 'Sign in' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/');
    const [request] = sentRequests(fetchMock, 'POST', '/api/auth/sign-out');
    expect(request?.headers.get('X-Restday-Client')).toBe('web');
    // The overview's subscriptions were read once, while signed in: leaving asks for nothing more.
    expect(sentRequests(fetchMock, 'GET', '/api/subscriptions')).toHaveLength(1);
  });

  it('a Roastery visit still shows who is signed in, with the same menu', async () => {
    stubFetch(() => jsonResponse({ items: [] }));
    renderApp('/roastery', { session: makeUser({ role: 'owner', name: 'Wren Calloway' }) });

    expect(await within(await siteHeader()).findByRole('button', { name: 'Account menu: Wren Calloway' })).toBeTruthy();
  });
});
