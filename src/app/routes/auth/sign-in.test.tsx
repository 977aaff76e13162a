// @vitest-environment happy-dom
import { cleanup, createEvent, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { apiErrorResponse, jsonResponse, makeUser, renderApp, sentRequests, stubFetch, enterValue } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const customer = makeUser();

function fillSignIn(email: string, password: string) {
  enterValue(screen.getByLabelText('E-mail'), email);
  enterValue(screen.getByLabelText('Password'), password);
  fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
}

/** The field's error, as assistive technology reaches it: through `aria-describedby`. */
function describedErrors(field: HTMLElement): string[] {
  const ids = field.getAttribute('aria-describedby')?.split(' ') ?? [];
  return ids.flatMap((id) => {
    const node = document.getElementById(id);
    return node && id.endsWith('-error') ? [node.textContent ?? ''] : [];
  });
}

describe('sign-in page', () => {
  it('says what each empty field needs, ties the message to the field and focuses the first', async () => {
    const fetchMock = stubFetch(() => jsonResponse({}));
    renderApp('/sign-in');
    await screen.findByRole('heading', { level: 1, name: 'Sign in' });

    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    const email = screen.getByLabelText('E-mail');
    await waitFor(() => expect(email.getAttribute('aria-invalid')).toBe('true'));
    expect(describedErrors(email)).toEqual(['Enter your e-mail address.']);
    expect(describedErrors(screen.getByLabelText('Password'))).toEqual(['Enter your password.']);
    expect(document.activeElement).toBe(email);
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('offers autofill and a show/hide toggle on the password, which is pasted or typed like any text', async () => {
    stubFetch(() => jsonResponse({}));
    renderApp('/sign-in');
    await screen.findByRole('heading', { level: 1, name: 'Sign in' });

    const email = screen.getByLabelText('E-mail');
    const password = screen.getByLabelText('Password');
    expect(email.getAttribute('autocomplete')).toBe('email');
    expect(password.getAttribute('autocomplete')).toBe('current-password');
    expect(password.getAttribute('type')).toBe('password');
    const paste = createEvent.paste(password);
    fireEvent(password, paste);
    expect(paste.defaultPrevented).toBe(false);

    const toggle = screen.getByRole('button', { name: 'Show password' });
    expect(toggle.getAttribute('aria-pressed')).toBe('false');
    fireEvent.click(toggle);
    expect(password.getAttribute('type')).toBe('text');
    expect(toggle.getAttribute('aria-pressed')).toBe('true');
  });

  it('shows the server’s refusal above the form and stays put', async () => {
    stubFetch(() => apiErrorResponse(401, 'invalid_credentials', 'That e-mail and password do not match an account.'));
    const { router } = renderApp('/sign-in');
    await screen.findByRole('heading', { level: 1, name: 'Sign in' });

    fillSignIn('ines.marlow@example.test', 'not the right one');

    expect((await screen.findByRole('alert')).textContent).toContain('That e-mail and password do not match an account.');
    expect(router.state.location.pathname).toBe('/sign-in');
  });

  it('signs in with the API, marked as the web client, and returns to the page that asked for it', async () => {
    const fetchMock = stubFetch((url) => (url.pathname === '/api/auth/sign-in' ? jsonResponse({ user: customer }) : jsonResponse({ items: [] })));
    const { router } = renderApp('/sign-in?redirectTo=%2Faccount%2Faddresses');
    await screen.findByRole('heading', { level: 1, name: 'Sign in' });

    fillSignIn('  Ines.Marlow@Example.test ', 'kettle lantern orchard');

    await waitFor(() => expect(router.state.location.pathname).toBe('/account/addresses'));
    const [request] = sentRequests(fetchMock, 'POST', '/api/auth/sign-in');
    expect(request?.body).toEqual({ email: 'ines.marlow@example.test', password: 'kettle lantern orchard' });
    expect(request?.headers.get('X-Restday-Client')).toBe('web');

    // The site header is the first banner; a page's own <header> inside <main> is not one in a browser.
    const [header] = screen.getAllByRole('banner') as [HTMLElement];
    expect(within(header).getByRole('button', { name: /Account menu/ }).textContent).toContain('Ines Marlow');
    expect(within(header).queryByRole('link', { name: 'Sign in' })).toBeNull();
  });

  it('never follows a return address off the site', async () => {
    stubFetch(() => jsonResponse({ user: customer }));
    const { router } = renderApp('/sign-in?redirectTo=%2F%2Felsewhere.test%2Fsteal');
    await screen.findByRole('heading', { level: 1, name: 'Sign in' });

    fillSignIn('ines.marlow@example.test', 'kettle lantern orchard');

    await waitFor(() => expect(router.state.location.pathname).toBe('/account'));
  });

  it('takes staff to the Roastery when they were not on their way elsewhere', async () => {
    stubFetch((url) =>
      url.pathname === '/api/auth/sign-in' ? jsonResponse({ user: makeUser({ role: 'staff', name: 'Oren Vale' }) }) : jsonResponse({ items: [] }),
    );
    const { router } = renderApp('/sign-in');
    await screen.findByRole('heading', { level: 1, name: 'Sign in' });

    fillSignIn('oren.vale@example.test', 'kettle lantern orchard');

    await waitFor(() => expect(router.state.location.pathname).toBe('/roastery'));
  });

  it('sends someone already signed in straight on', async () => {
    const { router } = renderApp('/sign-in?redirectTo=%2Faccount%2Fprofile', { session: customer });
    await waitFor(() => expect(router.state.location.pathname).toBe('/account/profile'));
  });

  it('links to create an account and to the forgotten-password page, keeping the return address', async () => {
    renderApp('/sign-in?redirectTo=%2Faccount%2Fprofile');
    await screen.findByRole('heading', { level: 1, name: 'Sign in' });

    expect(screen.getByRole('link', { name: 'Create an account' }).getAttribute('href')).toBe('/create-account?redirectTo=%2Faccount%2Fprofile');
    expect(screen.getByRole('link', { name: 'Forgot your password?' }).getAttribute('href')).toBe('/forgot-password');
  });
});
