// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, makeLot, renderApp, stubFetch } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('404 page', () => {
  it('answers an unknown address inside the shop frame, with a way home', async () => {
    stubFetch(() => jsonResponse({ items: [makeLot()] }));
    const { router } = renderApp('/no-such-page');

    expect(await screen.findByRole('heading', { level: 1, name: 'Page not found' })).toBeTruthy();
    expect(screen.getByRole('navigation', { name: 'Shop' })).toBeTruthy();
    await waitFor(() => expect(document.title).toBe('Page not found · Restday'));

    fireEvent.click(screen.getByRole('link', { name: 'Go to the home page' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/'));
    expect(await screen.findByRole('heading', { level: 1, name: /Roast it yourself/ })).toBeTruthy();
  });

  it('answers an unknown Roastery address too', async () => {
    renderApp('/roastery/no-such-screen');

    expect(await screen.findByRole('heading', { level: 1, name: 'Page not found' })).toBeTruthy();
  });
});
