// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { apiErrorResponse, jsonResponse, renderApp, sentRequests, stubFetch, enterValue } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const token = 'rT0k3n-from-the-email-link_0123456789';

describe('forgotten password', () => {
  it('asks for a link and answers the same way whatever the address', async () => {
    const fetchMock = stubFetch(() => new Response(null, { status: 202 }));
    renderApp('/forgot-password');
    await screen.findByRole('heading', { level: 1, name: 'Forgot your password?' });

    enterValue(screen.getByLabelText('E-mail'), 'Ines.Marlow@example.test');
    fireEvent.click(screen.getByRole('button', { name: 'Send the reset link' }));

    const heading = await screen.findByRole('heading', { name: 'Check your e-mail' });
    expect(document.activeElement).toBe(heading);
    expect(screen.getByText('ines.marlow@example.test')).toBeTruthy();
    expect(sentRequests(fetchMock, 'POST', '/api/auth/password-reset')[0]?.body).toEqual({ email: 'ines.marlow@example.test' });
  });

  it('shows a throttled request’s message', async () => {
    stubFetch(() => apiErrorResponse(429, 'too_many_requests', 'Too many tries. Wait 15 minutes and try again.'));
    renderApp('/forgot-password');
    await screen.findByRole('heading', { level: 1, name: 'Forgot your password?' });

    enterValue(screen.getByLabelText('E-mail'), 'ines.marlow@example.test');
    fireEvent.click(screen.getByRole('button', { name: 'Send the reset link' }));

    expect((await screen.findByRole('alert')).textContent).toContain('Too many tries. Wait 15 minutes and try again.');
  });
});

describe('reset-password page', () => {
  it('says the link is incomplete when its token is missing', async () => {
    renderApp('/reset-password');
    expect(await screen.findByRole('heading', { level: 1, name: 'This link is not complete' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Ask for a new link' }).getAttribute('href')).toBe('/forgot-password');
  });

  it('sets the new password with the token from the link and sends the person to sign in', async () => {
    // The reset ends every session of the account, so the page asks again who is signed in.
    const fetchMock = stubFetch((url) => (url.pathname === '/api/auth/me' ? jsonResponse({ user: null }) : new Response(null, { status: 204 })));
    const { router } = renderApp(`/reset-password#token=${token}`);
    await screen.findByRole('heading', { level: 1, name: 'Choose a new password' });

    const password = screen.getByLabelText('New password');
    expect(password.getAttribute('autocomplete')).toBe('new-password');
    enterValue(password, 'quiet heron under copper rain');
    fireEvent.click(screen.getByRole('button', { name: 'Save the new password' }));

    expect(await screen.findByText('Your password is changed. Sign in with the new one.')).toBeTruthy();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(sentRequests(fetchMock, 'POST', '/api/auth/password-reset/confirm')[0]?.body).toEqual({
      token,
      password: 'quiet heron under copper rain',
    });
  });

  it('explains a used or expired link and offers a new one', async () => {
    stubFetch(() => apiErrorResponse(400, 'invalid_token', 'This link has expired or was already used.', { token: 'expired' }));
    renderApp(`/reset-password#token=${token}`);
    await screen.findByRole('heading', { level: 1, name: 'Choose a new password' });

    enterValue(screen.getByLabelText('New password'), 'quiet heron under copper rain');
    fireEvent.click(screen.getByRole('button', { name: 'Save the new password' }));

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('This link has expired or was already used.');
    await waitFor(() => expect(screen.getByRole('link', { name: 'Ask for a new link' })).toBeTruthy());
  });
});
