// @vitest-environment happy-dom
import { cleanup, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { renderApp } from '@/testing/test-utils';

afterEach(cleanup);

describe('account area', () => {
  it('asks the visitor to sign in to see their orders', async () => {
    renderApp('/account');

    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in to see your orders' })).toBeTruthy();
    expect(screen.getByText('Your account')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Account' }).getAttribute('aria-current')).toBe('page');
    await waitFor(() => expect(document.title).toBe('Your account · Restday'));
  });
});
