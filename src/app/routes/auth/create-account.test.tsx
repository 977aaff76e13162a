// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { apiErrorResponse, jsonResponse, makeUser, renderApp, sentRequests, stubFetch, enterValue } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function fillForm({ name, email, password }: { name: string; email: string; password: string }) {
  enterValue(screen.getByLabelText('Name'), name);
  enterValue(screen.getByLabelText('E-mail'), email);
  enterValue(screen.getByLabelText('Password'), password);
  fireEvent.click(screen.getByRole('button', { name: 'Create account' }));
}

function errorOf(field: HTMLElement): string | undefined {
  const id = field
    .getAttribute('aria-describedby')
    ?.split(' ')
    .find((part) => part.endsWith('-error'));
  return id ? (document.getElementById(id)?.textContent ?? undefined) : undefined;
}

describe('create-account page', () => {
  it('suggests 15 or more characters beside the password and asks the browser for a new one', async () => {
    renderApp('/create-account');
    await screen.findByRole('heading', { level: 1, name: 'Create your account' });

    const password = screen.getByLabelText('Password');
    expect(password.getAttribute('autocomplete')).toBe('new-password');
    expect(screen.getByLabelText('Name').getAttribute('autocomplete')).toBe('name');
    expect(screen.getByLabelText('E-mail').getAttribute('autocomplete')).toBe('email');
    const hintId = password.getAttribute('aria-describedby')?.split(' ')[0] ?? '';
    expect(document.getElementById(hintId)?.textContent).toMatch(/At least 8 characters\. 15 or more is better/);
  });

  it('refuses 7 characters and a malformed address before asking the server', async () => {
    const fetchMock = stubFetch(() => jsonResponse({}));
    renderApp('/create-account');
    await screen.findByRole('heading', { level: 1, name: 'Create your account' });

    fillForm({ name: 'Ines Marlow', email: 'ines.marlow', password: 'sevench' });

    await waitFor(() => expect(errorOf(screen.getByLabelText('Password'))).toMatch(/Use at least 8 characters/));
    expect(errorOf(screen.getByLabelText('E-mail'))).toBe('Enter an e-mail address like name@example.com.');
    expect(errorOf(screen.getByLabelText('Name'))).toBeUndefined();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('accepts 8 characters, though 15 are suggested', async () => {
    const fetchMock = stubFetch(() => jsonResponse({ user: makeUser() }, 201));
    renderApp('/create-account');
    await screen.findByRole('heading', { level: 1, name: 'Create your account' });

    fillForm({ name: 'Ines Marlow', email: 'ines.marlow@example.test', password: 'eightch!' });

    await waitFor(() => expect(sentRequests(fetchMock, 'POST', '/api/auth/sign-up')).toHaveLength(1));
  });

  it('puts the server’s reasons on the fields they are about', async () => {
    stubFetch(() =>
      apiErrorResponse(400, 'invalid_input', 'Some details need another look.', {
        password: 'This password is on a list of common passwords. Choose another.',
      }),
    );
    renderApp('/create-account');
    await screen.findByRole('heading', { level: 1, name: 'Create your account' });

    fillForm({ name: 'Ines Marlow', email: 'ines.marlow@example.test', password: 'password1234' });

    const password = screen.getByLabelText('Password');
    await waitFor(() => expect(errorOf(password)).toBe('This password is on a list of common passwords. Choose another.'));
    expect(password.getAttribute('aria-invalid')).toBe('true');
    expect(document.activeElement).toBe(password);
    // Every reason found its field, so there is nothing more to say above the form.
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('creates the account, signs it in and opens the account page', async () => {
    const fetchMock = stubFetch((url) => (url.pathname === '/api/auth/sign-up' ? jsonResponse({ user: makeUser() }, 201) : jsonResponse({ items: [] })));
    const { router } = renderApp('/create-account');
    await screen.findByRole('heading', { level: 1, name: 'Create your account' });

    fillForm({ name: ' Ines Marlow ', email: 'ines.marlow@example.test', password: 'kettle lantern orchard' });

    expect(await screen.findByRole('heading', { level: 1, name: 'Hello, Ines Marlow' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/account');
    expect(sentRequests(fetchMock, 'POST', '/api/auth/sign-up')[0]?.body).toEqual({
      name: 'Ines Marlow',
      email: 'ines.marlow@example.test',
      password: 'kettle lantern orchard',
    });
    const [header] = screen.getAllByRole('banner') as [HTMLElement];
    expect(within(header).getByRole('button', { name: /Account menu/ })).toBeTruthy();
  });
});
