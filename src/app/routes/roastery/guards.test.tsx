// @vitest-environment happy-dom
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
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
});
