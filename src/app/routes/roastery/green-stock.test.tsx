// @vitest-environment happy-dom
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, makeLot, makeUser, renderApp, stubFetch } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const staff = makeUser({ role: 'staff' });

const lots = [
  makeLot({ code: 'RD-A', name: 'Plenty Left', stockGrams: 40_000 }),
  makeLot({ code: 'RD-B', name: 'All Gone', stockGrams: 0 }),
  makeLot({ code: 'RD-C', name: 'Running Low', stockGrams: 900 }),
];

describe('Roastery', () => {
  it('opens on an overview with the green stock count and the commercial-roasting cautions', async () => {
    stubFetch(() => jsonResponse({ items: lots }));
    renderApp('/roastery', { session: staff });

    const nav = await screen.findByRole('navigation', { name: 'Roastery' });
    expect(within(nav).getAllByRole('link').map((link) => link.textContent)).toEqual(['Overview', 'Green Stock', 'Orders']);

    const figure = async (label: string) => (await screen.findByText(label)).nextElementSibling?.textContent;
    expect(await figure('Lots listed')).toBe('3');
    expect(await figure('Out of stock')).toBe('1');
    expect(await figure('Green coffee on hand')).toBe('40.9 kg');

    const cautions = screen.getByRole('region', { name: 'Before a roast day' });
    expect(within(cautions).getByText('Carbon monoxide and smoke.')).toBeTruthy();
    expect(within(cautions).getByText(/local codes and licensed/)).toBeTruthy();
    await waitFor(() => expect(document.title).toBe('Roastery · Restday'));
  });

  it('lists Green Stock lowest first, with out-of-stock lots flagged', async () => {
    stubFetch(() => jsonResponse({ items: lots }));
    renderApp('/roastery/green-stock', { session: staff });

    const table = await screen.findByRole('table');
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows.map((row) => within(row).getByRole('link').textContent)).toEqual(['All Gone', 'Running Low', 'Plenty Left']);
    expect(within(rows[0] as HTMLElement).getByText('Out of stock')).toBeTruthy();
    expect(within(rows[1] as HTMLElement).getByText('900 g')).toBeTruthy();
  });
});
