// @vitest-environment happy-dom
import { cleanup, render, screen } from '@testing-library/react';
import { createMemoryRouter, data, RouterProvider } from 'react-router-dom';
import { afterEach, describe, expect, it } from 'vitest';
import { ApiError } from '@/lib/api-client';
import { RouteErrorBoundary } from './route-error-boundary';

afterEach(cleanup);

function renderFailingRoute(failure: unknown, standalone = false) {
  const router = createMemoryRouter([
    {
      path: '/',
      errorElement: <RouteErrorBoundary standalone={standalone} />,
      loader: () => {
        throw failure;
      },
      Component: () => <p>never shown</p>,
      hydrateFallbackElement: <p>loading</p>,
    },
  ]);
  render(<RouterProvider router={router} />);
}

describe('RouteErrorBoundary', () => {
  it('shows the not-found page for a 404 route response', async () => {
    renderFailingRoute(data('missing', { status: 404 }));
    expect(await screen.findByRole('heading', { level: 1, name: 'Page not found' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Go to the home page' })).toBeTruthy();
  });

  it('shows the not-found page for an API 404', async () => {
    renderFailingRoute(new ApiError(404, 'lot_not_found', 'No lot with that code.'));
    expect(await screen.findByRole('heading', { level: 1, name: 'Page not found' })).toBeTruthy();
  });

  it('offers a reload and a way home for any other failure', async () => {
    renderFailingRoute(new Error('the page broke'));
    expect(await screen.findByRole('heading', { level: 1, name: 'Something went wrong' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Reload the page' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Go to the home page' }).getAttribute('href')).toBe('/');
    expect(screen.queryByText('never shown')).toBeNull();
  });

  it('brings its own main landmark and product name when no layout is around it', async () => {
    renderFailingRoute(new Error('the layout broke'), true);
    const main = await screen.findByRole('main');
    expect(main.textContent).toContain('Something went wrong');
    expect(screen.getByRole('link', { name: 'Restday' }).getAttribute('href')).toBe('/');
  });
});
