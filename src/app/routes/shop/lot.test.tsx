// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { homeRoastGuide } from '@shared/domain/home-roast-guide';
import { defaultLossModel } from '@shared/domain/roast-loss';
import { roastLevels } from '@shared/domain/vocabulary';
import { apiErrorResponse, jsonResponse, makeLotDetail, renderApp, requestedUrls, stubFetch, enterValue } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  window.localStorage.clear();
});

/** Answers like the server: the lot, and its roast guide computed by the trade engine. */
function lotServer(lot = makeLotDetail()) {
  return stubFetch((url) => {
    if (url.pathname.endsWith('/roast-guide')) {
      const level = url.searchParams.get('level');
      return jsonResponse(
        homeRoastGuide(
          {
            device: 'popper',
            greenGrams: Number(url.searchParams.get('greenGrams')),
            level: roastLevels.find((each) => each === level) ?? lot.suggestedLevel,
            suggestedLevel: lot.suggestedLevel,
          },
          defaultLossModel,
        ),
      );
    }
    return jsonResponse(lot);
  });
}

describe('lot page', () => {
  it('reads /api/lots/:code and shows the green coffee descriptors', async () => {
    const fetchMock = lotServer();
    renderApp('/lots/RD-T01');

    expect(await screen.findByRole('heading', { level: 1, name: 'Test Ridge Washed' })).toBeTruthy();
    await screen.findByRole('table', { name: 'Time after first crack' });
    // The lot, its Home Roast Guide, and how home roasters roast it (shown only from enough roasts;
    // that section loads once the page runs in the browser).
    await waitFor(() =>
      expect(requestedUrls(fetchMock).sort()).toEqual([
        '/api/lots/RD-T01',
        '/api/lots/RD-T01/home-roasts',
        '/api/lots/RD-T01/roast-guide?device=popper&greenGrams=454&level=light',
      ]),
    );

    const descriptors = screen.getByRole('region', { name: 'Green coffee descriptors' });
    const value = (term: string) => within(descriptors).getByText(term).nextElementSibling?.textContent;
    expect(value('Producer')).toBe('Invented Hills Cooperative');
    expect(value('Altitude')).toBe('1,950 m');
    expect(value('Crop year')).toBe('2025');
    expect(value('Moisture')).toBe('10.8%');
    expect(value('Density')).toBe('712 g/L');
    expect(value('Screen size')).toBe('17/18');
    expect(value('Cupping score')).toBe('87.25');
    expect(value('Roast levels that suit it')).toBe('Light, Medium');

    expect(screen.getByText('2.3 kg or more: $22.00 / kg')).toBeTruthy();
    expect(screen.getByRole('region', { name: 'Roast safely' })).toBeTruthy();
    await waitFor(() => expect(document.title).toBe('Test Ridge Washed · Green Lots · Restday'));
  });

  it('shows the safety cautions once, below the Home Roast Guide', async () => {
    lotServer();
    renderApp('/lots/RD-T01');

    await screen.findByRole('table', { name: 'Time after first crack' });
    expect(screen.getAllByRole('region', { name: 'Roast safely' })).toHaveLength(1);
    expect(screen.queryByText('Before you roast')).toBeNull();
  });

  it('reads prices per lb and quantity breaks in pounds when Green Lots was filtered per lb', async () => {
    lotServer();
    renderApp('/lots/RD-T01?priceUnit=lb');

    await screen.findByRole('heading', { level: 1, name: 'Test Ridge Washed' });
    // 1 lb = 0.45359237 kg exactly (NIST SP 811, App. B): $22.00 / kg × 0.45359237 = $9.979 → $9.98 / lb,
    // and the 2,268 g break ÷ 453.59237 g = 5.0001 lb.
    expect(await screen.findByText('5 lb or more: $9.98 / lb')).toBeTruthy();
    expect(screen.getByText(/\/ lb$/, { selector: 'p' })).toBeTruthy();
    // The weight toggle switches the breaks back to metric.
    fireEvent.click(screen.getByRole('button', { name: 'Grams' }));
    expect(await screen.findByText('2.3 kg or more: $9.98 / lb')).toBeTruthy();
  });

  it('says when no lot has that code', async () => {
    stubFetch(() => apiErrorResponse(404, 'lot_not_found', 'No lot with that code.'));
    renderApp('/lots/RD-GONE');

    expect(await screen.findByRole('heading', { level: 1, name: 'Lot not found' })).toBeTruthy();
    expect(screen.getByText(/No green lot has the code RD-GONE/)).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Go to the home page' }).getAttribute('href')).toBe('/');
  });

  it('prices each bag size on its declared weight, with the quantity break, and switches weights to ounces', async () => {
    lotServer();
    renderApp('/lots/RD-T01');

    const sizes = await screen.findByRole('group', { name: 'Bag size' });
    const option = (label: string) =>
      within(sizes)
        .getByLabelText(new RegExp(`^${label}`))
        .closest('label')?.textContent;
    // $24.50/kg × exact declared weight (1 lb = 453.59237 g, NIST SP 811), rounded once; 5 lb fills
    // 2,268 g, which reaches the 2,268 g break at $22.00/kg.
    expect(option('8 oz')).toBe('8 ozfills 227 g$5.56');
    expect(option('1 lb')).toBe('1 lbfills 454 g$11.11');
    expect(option('2 lb')).toBe('2 lbfills 908 g$22.23');
    expect(option('5 lb')).toBe('5 lbfills 2.3 kg$49.90');

    fireEvent.click(screen.getByRole('button', { name: 'Ounces' }));
    expect(screen.getByRole('button', { name: 'Ounces' }).getAttribute('aria-pressed')).toBe('true');
    expect(option('1 lb')).toBe('1 lbfills 16 oz$11.11');
    expect(option('5 lb')).toBe('5 lbfills 80 oz$49.90');
    // The guide follows: 454 g green at light (11–14 % loss, the usual range for light roasts, from memory) → 390–404 g.
    expect(await screen.findByText('13.8 oz–14.3 oz')).toBeTruthy();

    fireEvent.click(screen.getByRole('button', { name: 'Grams' }));
    expect(await screen.findByText('390 g–404 g')).toBeTruthy();
  });

  it('shows the Home Roast Guide for the chosen size and level, the lot’s suggestion marked', async () => {
    const fetchMock = lotServer();
    renderApp('/lots/RD-T01');

    const levels = await screen.findByRole('table', { name: 'Time after first crack' });
    const lightRow = within(levels).getByRole('rowheader', { name: /Light/ });
    expect(lightRow.textContent).toContain('Suggested for this lot');
    // Popper times after first crack (common practice).
    expect(within(levels).getByRole('row', { name: /Medium-dark/ }).textContent).toContain('30–40 s');
    expect(screen.getByRole('region', { name: 'Roast safely' }).textContent).toContain('Never leave a roast unattended.');
    // 454 g at up to 80 g a batch (common practice) → 6 batches.
    expect(screen.getByText('Batches for a 1 lb bag').nextElementSibling?.textContent).toBe('6');

    fireEvent.click(screen.getByLabelText(/^5 lb/));
    enterValue(screen.getByLabelText('Roast level'), 'medium');
    await waitFor(() => expect(screen.getByText('Batches for a 5 lb bag').nextElementSibling?.textContent).toBe('29'));
    expect(requestedUrls(fetchMock)).toContain('/api/lots/RD-T01/roast-guide?device=popper&greenGrams=2268&level=medium');
    expect(screen.getAllByRole('listitem').some((item) => item.textContent?.includes('Development.'))).toBe(true);
  });

  it('adds the chosen size and quantity to the cart, kept in this browser and counted in the header', async () => {
    lotServer();
    renderApp('/lots/RD-T01');

    fireEvent.click(await screen.findByLabelText(/^2 lb/));
    enterValue(screen.getByLabelText('Bags'), '2');
    fireEvent.click(screen.getByRole('button', { name: 'Add to cart' }));

    expect(await screen.findByText(/Added 2 × 2 lb to your cart/)).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Cart, 2 bags' })).toBeTruthy();
    const stored = JSON.parse(window.localStorage.getItem('restday.cart') ?? '{}') as { lines: unknown[] };
    expect(stored.lines).toEqual([
      {
        lotCode: 'RD-T01',
        lotName: 'Test Ridge Washed',
        size: '2lb',
        quantity: 2,
        pricePerKgCents: 2450,
        priceBreaks: [{ minGrams: 2268, pricePerKgCents: 2200 }],
      },
    ]);
  });

  it('will not add more than the lot has in stock', async () => {
    lotServer(makeLotDetail({ stockGrams: 1000 }));
    renderApp('/lots/RD-T01');

    fireEvent.click(await screen.findByLabelText(/^2 lb/));
    enterValue(screen.getByLabelText('Bags'), '2');
    expect(screen.getByText(/Only 1 kg left: not enough for 2 × 2 lb/)).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Add to cart' }).hasAttribute('disabled')).toBe(true);
  });

  it('a sold-out lot offers the Roaster’s Rotation instead of a subscription to it', async () => {
    lotServer(makeLotDetail({ stockGrams: 0 }));
    renderApp('/lots/RD-T01');

    const rotation = await screen.findByRole('link', { name: 'Subscribe to the Roaster’s Rotation instead' }, { timeout: 15_000 });
    expect(rotation.getAttribute('href')).toBe('/subscribe');
    expect(screen.getByText(/This lot is sold out, so we cannot roast it for a subscription/)).toBeTruthy();
    expect(screen.queryByRole('link', { name: 'Subscribe to this lot, roasted to order' })).toBeNull();
  });

  it('a lot in stock offers a subscription to it', async () => {
    lotServer(makeLotDetail({ stockGrams: 20_000 }));
    renderApp('/lots/RD-T01');
    const subscribe = await screen.findByRole('link', { name: 'Subscribe to this lot, roasted to order' }, { timeout: 15_000 });
    expect(subscribe.getAttribute('href')).toBe('/subscribe?lot=RD-T01');
  });
});
