// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { GreenStockItem, GreenStockResponse } from '@shared/schemas/green-stock';
import { apiErrorResponse, jsonResponse, makeLot, makeUser, renderApp, requestedUrls, stubFetch } from '@/testing/test-utils';

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

// Invented lots as Green Stock reports them.
function stockItem(overrides: Partial<GreenStockItem> = {}): GreenStockItem {
  return {
    code: 'RD-T01',
    name: 'Test Ridge Washed',
    isListed: true,
    stockGrams: 18_144,
    reorderPointGrams: 0,
    supplierLeadTimeDays: 14,
    reorderBy: null,
    reorderAlert: false,
    usedGramsInWindow: 0,
    averageDailyUseGrams: 0,
    daysOfCover: null,
    ...overrides,
  };
}

const greenStock = (items: GreenStockItem[]): GreenStockResponse => ({ windowDays: 28, items });

describe('Roastery', () => {
  it('opens on an overview with the green stock count and the commercial-roasting cautions', async () => {
    stubFetch(() => jsonResponse({ items: lots }));
    renderApp('/roastery', { session: staff });

    const nav = await screen.findByRole('navigation', { name: 'Roastery' });
    expect(
      within(nav)
        .getAllByRole('link')
        .map((link) => link.textContent),
    ).toEqual(['Today', 'Day Sheet', 'Roast Calendar', 'Orders', 'Green Stock', 'Subscribers', 'Rotation']);

    const figure = async (label: string) => (await screen.findByText(label)).nextElementSibling?.textContent;
    expect(await figure('Lots listed')).toBe('3');
    expect(await figure('Out of stock')).toBe('1');
    expect(await figure('Green coffee on hand')).toBe('40.9 kg');

    const cautions = screen.getByRole('region', { name: 'Before a roast day' });
    expect(within(cautions).getByText('Carbon monoxide and smoke.')).toBeTruthy();
    expect(within(cautions).getByText(/local codes and licensed/)).toBeTruthy();
    await waitFor(() => expect(document.title).toBe('Today · Roastery · Restday'));
  });
});

describe('Green Stock', () => {
  it('lists every lot, listed or not, those to reorder first, with grams and pounds, reorder point and days of cover', async () => {
    const fetchMock = stubFetch(() =>
      jsonResponse(
        greenStock([
          stockItem({ code: 'RD-A', name: 'Plenty Left', stockGrams: 40_000, usedGramsInWindow: 14_000, averageDailyUseGrams: 500, daysOfCover: 80 }),
          stockItem({ code: 'RD-B', name: 'Hidden Lot', isListed: false, stockGrams: 0 }),
          stockItem({
            code: 'RD-C',
            name: 'Running Low',
            stockGrams: 4536,
            reorderPointGrams: 9072,
            reorderAlert: true,
            usedGramsInWindow: 28_000,
            averageDailyUseGrams: 1000,
            daysOfCover: 4,
          }),
        ]),
      ),
    );
    renderApp('/roastery/green-stock', { session: staff });

    const table = await screen.findByRole('table', { name: /Green stock by lot/ });
    const rows = within(table).getAllByRole('row').slice(1) as HTMLElement[];
    expect(rows.map((row) => within(row).getByRole('link').textContent)).toEqual(['Running Low', 'Plenty Left', 'Hidden Lot']);
    expect(requestedUrls(fetchMock)).toContain('/api/roastery/green-stock');

    const [low, plenty, hidden] = rows as [HTMLElement, HTMLElement, HTMLElement];
    expect(within(low).getByRole('link').getAttribute('href')).toBe('/roastery/green-stock/RD-C');
    expect(within(low).getByText('Time to reorder')).toBeTruthy();
    // 4536 g = 10 lb and 9072 g = 20 lb at 453.59237 g per lb (NIST SP 811, Appendix B).
    expect(within(low).getByText('10 lb')).toBeTruthy();
    expect(within(low).getByText('20 lb')).toBeTruthy();
    expect(within(low).getByText('4 days')).toBeTruthy();
    expect(within(plenty).getByText('80 days')).toBeTruthy();
    expect(within(plenty).getByText('at 500 g a day')).toBeTruthy();
    expect(within(plenty).getByText('Listed')).toBeTruthy();
    expect(within(plenty).queryByText('Time to reorder')).toBeNull();
    expect(within(hidden).getByText('Not listed')).toBeTruthy();
    expect(within(hidden).getByText('Out of stock')).toBeTruthy();
    expect(within(hidden).getByText('No use in 28 days')).toBeTruthy();

    const figure = (label: string) => screen.getByText(label, { selector: 'dt' }).nextElementSibling?.textContent;
    expect(figure('Time to reorder')).toBe('1');
    expect(figure('Green coffee on hand')).toBe('44.5 kg');
    expect(screen.getByRole('link', { name: 'New lot' }).getAttribute('href')).toBe('/roastery/green-stock/new');
  });

  it('invites the first lot when there are none', async () => {
    stubFetch(() => jsonResponse(greenStock([])));
    renderApp('/roastery/green-stock', { session: staff });

    expect(await screen.findByRole('heading', { name: 'No lots yet' })).toBeTruthy();
    expect(screen.getAllByRole('link', { name: 'New lot' })).toHaveLength(2);
  });

  it('shows why Green Stock could not load, and tries again', async () => {
    let failing = true;
    stubFetch(() => (failing ? apiErrorResponse(500, 'internal', 'Restday hit a problem on its side.') : jsonResponse(greenStock([stockItem()]))));
    renderApp('/roastery/green-stock', { session: staff });

    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('Restday hit a problem on its side.')).toBeTruthy();
    failing = false;
    fireEvent.click(within(alert).getByRole('button', { name: 'Try again' }));
    expect(await screen.findByRole('table')).toBeTruthy();
  });
});
