// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { apiErrorResponse, jsonResponse, makeUser, renderApp, sentRequests, stubFetch, enterValue } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const token = 'inv1te-t0ken-from-the-email_0123456789';
const preview = { email: 'juno.reed@example.test', role: 'staff', expiresAt: '2026-12-10T18:00:00.000Z' };

describe('joining the team from an invitation', () => {
  it('shows the invitation, creates the account and opens the Roastery', async () => {
    const fetchMock = stubFetch((url) => {
      if (url.pathname === '/api/auth/invitations/preview') return jsonResponse(preview);
      if (url.pathname === '/api/auth/invitations/accept') return jsonResponse({ user: makeUser({ role: 'staff', name: 'Juno Reed' }) }, 201);
      return jsonResponse({ items: [] });
    });
    const { router } = renderApp(`/join#token=${token}`);

    expect(await screen.findByRole('heading', { level: 1, name: 'Join the Roastery team' })).toBeTruthy();
    expect(screen.getByText('You are invited as a member of staff. Choose your name and a password to accept.')).toBeTruthy();
    expect((screen.getByLabelText('E-mail') as HTMLInputElement).value).toBe('juno.reed@example.test');
    expect(sentRequests(fetchMock, 'POST', '/api/auth/invitations/preview')[0]?.body).toEqual({ token });

    enterValue(screen.getByLabelText('Your name'), 'Juno Reed');
    enterValue(screen.getByLabelText('Password'), 'copper kettle at dawn');
    fireEvent.click(screen.getByRole('button', { name: 'Join the team' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/roastery'));
    expect(sentRequests(fetchMock, 'POST', '/api/auth/invitations/accept')[0]?.body).toEqual({
      token,
      name: 'Juno Reed',
      password: 'copper kettle at dawn',
    });
  });

  it('explains an expired or used invitation', async () => {
    stubFetch(() => apiErrorResponse(404, 'invitation_not_found', 'No such invitation.'));
    renderApp(`/join#token=${token}`);
    expect(await screen.findByRole('heading', { level: 1, name: 'This invitation cannot be used' })).toBeTruthy();
  });

  it('says the link is incomplete without a token', async () => {
    renderApp('/join');
    expect(await screen.findByRole('heading', { level: 1, name: 'This link is not complete' })).toBeTruthy();
  });
});
