// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { apiErrorResponse, jsonResponse, makeUser, renderApp, sentRequests, stubFetch, enterValue } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const customer = makeUser();

async function section(name: string): Promise<HTMLElement> {
  return screen.findByRole('region', { name });
}

function errorOf(field: HTMLElement): string | undefined {
  const id = field
    .getAttribute('aria-describedby')
    ?.split(' ')
    .find((part) => part.endsWith('-error'));
  return id ? (document.getElementById(id)?.textContent ?? undefined) : undefined;
}

describe('profile page', () => {
  it('saves a new name and shows it in the header', async () => {
    const fetchMock = stubFetch(() => jsonResponse({ user: { ...customer, name: 'Ines Marlow-Reyes' } }));
    renderApp('/account/profile', { session: customer });

    const name = within(await section('Name')).getByLabelText('Name');
    expect((name as HTMLInputElement).value).toBe('Ines Marlow');
    enterValue(name, 'Ines Marlow-Reyes');
    fireEvent.click(within(await section('Name')).getByRole('button', { name: 'Save name' }));

    expect(await within(await section('Name')).findByRole('status')).toBeTruthy();
    expect(sentRequests(fetchMock, 'PATCH', '/api/account/profile')[0]?.body).toEqual({ name: 'Ines Marlow-Reyes' });
    const [header] = screen.getAllByRole('banner') as [HTMLElement];
    expect(within(header).getByRole('button', { name: /Account menu/ }).textContent).toContain('Ines Marlow-Reyes');
  });

  it('asks for the current password to change the e-mail and shows the server’s answer on that field', async () => {
    const fetchMock = stubFetch(() =>
      apiErrorResponse(400, 'invalid_input', 'Check the marked fields.', { currentPassword: 'That is not your current password.' }),
    );
    renderApp('/account/profile', { session: customer });
    const emailSection = await section('E-mail address');

    enterValue(within(emailSection).getByLabelText('E-mail'), 'ines.new@example.test');
    fireEvent.click(within(emailSection).getByRole('button', { name: 'Change e-mail' }));
    const currentPassword = within(emailSection).getByLabelText('Current password');
    await waitFor(() => expect(errorOf(currentPassword)).toBe('Enter your password.'));
    expect(currentPassword.getAttribute('autocomplete')).toBe('current-password');
    expect(fetchMock).not.toHaveBeenCalled();

    enterValue(currentPassword, 'wrong guess here');
    fireEvent.click(within(emailSection).getByRole('button', { name: 'Change e-mail' }));

    await waitFor(() => expect(errorOf(currentPassword)).toBe('That is not your current password.'));
    expect(sentRequests(fetchMock, 'PUT', '/api/account/email')[0]?.body).toEqual({
      email: 'ines.new@example.test',
      currentPassword: 'wrong guess here',
    });
  });

  it('changes the password and clears both fields', async () => {
    const fetchMock = stubFetch(() => new Response(null, { status: 204 }));
    renderApp('/account/profile', { session: customer });
    const passwordSection = await section('Password');

    const current = within(passwordSection).getByLabelText('Current password');
    const next = within(passwordSection).getByLabelText('New password');
    expect(next.getAttribute('autocomplete')).toBe('new-password');
    enterValue(current, 'kettle lantern orchard');
    enterValue(next, 'quiet heron under copper rain');
    fireEvent.click(within(passwordSection).getByRole('button', { name: 'Change password' }));

    expect((await within(passwordSection).findByRole('status')).textContent).toContain('Your password is changed.');
    expect((current as HTMLInputElement).value).toBe('');
    expect((next as HTMLInputElement).value).toBe('');
    expect(sentRequests(fetchMock, 'PUT', '/api/account/password')[0]?.body).toEqual({
      currentPassword: 'kettle lantern orchard',
      newPassword: 'quiet heron under copper rain',
    });
  });
});
