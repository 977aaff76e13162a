// @vitest-environment happy-dom
import { cleanup, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, makeLot, renderApp, stubFetch } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('home page', () => {
  it('features three lots, those in stock first, and links to the roasting basics', async () => {
    stubFetch(() =>
      jsonResponse({
        items: [
          makeLot({ code: 'RD-A', name: 'Sold Out First', stockGrams: 0 }),
          makeLot({ code: 'RD-B', name: 'Second In Stock' }),
          makeLot({ code: 'RD-C', name: 'Third In Stock' }),
          makeLot({ code: 'RD-D', name: 'Fourth In Stock' }),
        ],
      }),
    );
    renderApp('/');

    const featured = await screen.findByRole('region', { name: 'On the green shelf' });
    const cards = await within(featured).findAllByTestId('lot-card');
    expect(cards.map((card) => within(card).getByRole('heading').textContent)).toEqual(['Second In Stock', 'Third In Stock', 'Fourth In Stock']);
    const basics = screen.getByRole('region', { name: 'New to roasting at home?' });
    expect(within(basics).getByRole('link', { name: 'Read the roasting basics' }).getAttribute('href')).toBe('/roasting-basics');
  });
});
