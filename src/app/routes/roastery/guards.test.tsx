// @vitest-environment happy-dom
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { axeViolations } from '@/testing/axe';
import { jsonResponse, makeUser, renderApp, requestedUrls, stubFetch } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const emptyTeam = { members: [], invitations: [] };

describe('Roastery guards (the client hides what the server forbids)', () => {
  it('sends a visitor to sign in and back to the Roastery page afterwards', async () => {
    stubFetch(() => jsonResponse({ items: [] }));
    const { router } = renderApp('/roastery/green-stock');

    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in' })).toBeTruthy();
    expect(router.state.location.search).toBe('?redirectTo=%2Froastery%2Fgreen-stock');
  });

  it('tells a customer the Roastery is for the team, without its navigation', async () => {
    stubFetch(() => jsonResponse({ items: [] }));
    renderApp('/roastery', { session: makeUser() });

    expect(await screen.findByRole('heading', { level: 1, name: 'The Roastery is for the shop’s team' })).toBeTruthy();
    expect(screen.queryByRole('navigation', { name: 'Roastery' })).toBeNull();
    expect(screen.getByRole('link', { name: 'Your account' }).getAttribute('href')).toBe('/account');
  });

  it('shows staff the Roastery without the owner’s Team page, which stays closed to them', async () => {
    const fetchMock = stubFetch(() => jsonResponse(emptyTeam));
    renderApp('/roastery/team', { session: makeUser({ role: 'staff' }) });

    expect(await screen.findByRole('heading', { level: 1, name: 'Team is for the owner' })).toBeTruthy();
    const nav = screen.getByRole('navigation', { name: 'Roastery' });
    expect(within(nav).queryByRole('link', { name: 'Team' })).toBeNull();
    // The staff member's browser never even asks for the team.
    expect(requestedUrls(fetchMock)).not.toContain('/api/owner/team');
  });

  it('gives the owner the Team page in the Roastery navigation', async () => {
    stubFetch(() => jsonResponse(emptyTeam));
    renderApp('/roastery/team', { session: makeUser({ role: 'owner' }) });

    expect(await screen.findByRole('heading', { level: 1, name: 'Team' })).toBeTruthy();
    const nav = screen.getByRole('navigation', { name: 'Roastery' });
    expect(within(nav).getByRole('link', { name: 'Team' }).getAttribute('aria-current')).toBe('page');
    await waitFor(() => expect(document.title).toBe('Team · Roastery · Restday'));
  });

  it('shows a packer only the Day Sheet and Orders, and starts their Roastery on the day’s Pack List without the Roast List', async () => {
    const fetchMock = stubFetch((url) => {
      if (url.pathname === '/api/roastery/settings') return jsonResponse({ timeZone: 'America/Chicago' });
      if (url.pathname.endsWith('/pack-list')) return jsonResponse({ date: url.pathname.split('/')[4], orders: [] });
      return jsonResponse({ items: [] });
    });
    const { router } = renderApp('/roastery', { session: makeUser({ role: 'packer' }) });

    expect(await screen.findByRole('heading', { level: 2, name: 'Pack List' })).toBeTruthy();
    expect(router.state.location.pathname).toMatch(/^\/roastery\/days\/\d{4}-\d{2}-\d{2}$/);
    expect(router.state.location.search).toBe('?tab=pack');
    const nav = screen.getByRole('navigation', { name: 'Roastery' });
    expect(
      within(nav)
        .getAllByRole('link')
        .map((link) => link.textContent),
    ).toEqual(['Day Sheet', 'Orders']);
    expect(screen.queryByRole('tab', { name: /Roast List/ })).toBeNull();
    // Their browser never asks for what the server would refuse them.
    expect(requestedUrls(fetchMock).filter((path) => /roast-list|batches|\/api\/roastery\/today/.test(path))).toEqual([]);
    expect(await axeViolations()).toEqual([]);
  });

  it('tells a packer that Green Stock is for the roasting staff, and never asks for it', async () => {
    const fetchMock = stubFetch(() => jsonResponse({ items: [] }));
    renderApp('/roastery/green-stock', { session: makeUser({ role: 'packer' }) });

    expect(await screen.findByRole('heading', { level: 1, name: 'This page is for the roasting staff' })).toBeTruthy();
    expect(requestedUrls(fetchMock)).not.toContain('/api/roastery/green-stock');
  });
});
