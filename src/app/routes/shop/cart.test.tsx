// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { CartLine } from '@/features/cart/stores/cart-store';
import { defaultShopSettings } from '@shared/schemas/settings';
import { jsonResponse, renderApp, stubFetch, enterValue } from '@/testing/test-utils';

// Invented lots, priced as their lot pages showed them.
const ridge: CartLine = {
  lotCode: 'RD-T01',
  lotName: 'Test Ridge Washed',
  size: '1lb',
  quantity: 2,
  pricePerKgCents: 2450,
  priceBreaks: [{ minGrams: 2268, pricePerKgCents: 2200 }],
};
const plateau: CartLine = { lotCode: 'RD-T02', lotName: 'Test Plateau Natural', size: '8oz', quantity: 1, pricePerKgCents: 1890, priceBreaks: [] };

function storedLines(): CartLine[] {
  const raw = window.localStorage.getItem('restday.cart');
  return raw === null ? [] : (JSON.parse(raw) as { lines: CartLine[] }).lines;
}

beforeEach(() => {
  window.localStorage.setItem('restday.cart', JSON.stringify({ version: 1, lines: [ridge, plateau] }));
  // GET /api/shipping as the server answers it with Restday's default bands.
  stubFetch((url) =>
    url.pathname === '/api/shipping' ? jsonResponse({ currency: 'usd', ...defaultShopSettings.shipping }) : new Response(null, { status: 404 }),
  );
});

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  window.localStorage.clear();
});

describe('cart page', () => {
  it('lists the bags kept in this browser with their prices and the header count', async () => {
    renderApp('/cart');

    const ridgeLine = await screen.findByRole('listitem', { name: 'Test Ridge Washed, 1 lb' });
    // $24.50/kg × 453.59237 g (NIST SP 811) = $11.11 a bag; 2 bags $22.22.
    expect(await within(ridgeLine).findByText(/\$11\.11 a bag/)).toBeTruthy();
    expect(ridgeLine.textContent).toContain('$22.22');
    // One parcel: 2 × (454 + 20) + (227 + 20) + 180 box = 1,375 g → the 2 kg band, $11.95 (Restday's default bands).
    expect((await screen.findByText('Shipping')).nextElementSibling?.textContent).toBe('$11.95');
    expect(screen.getByRole('link', { name: 'Cart, 3 bags' })).toBeTruthy();
    expect(screen.getByText(/You sign in or create an account at checkout/)).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Check out' }).getAttribute('href')).toBe('/checkout');
  });

  it('changes a quantity and removes a line, and the change is kept', async () => {
    renderApp('/cart');

    const ridgeLine = await screen.findByRole('listitem', { name: 'Test Ridge Washed, 1 lb' });
    enterValue(within(ridgeLine).getByLabelText('Bags'), '5');
    // 5 × 454 g = 2,270 g reaches the 2,268 g break: $22.00/kg × 453.59237 g = $9.98 a bag.
    expect(await within(ridgeLine).findByText(/\$9\.98 a bag/)).toBeTruthy();
    expect(storedLines()[0]?.quantity).toBe(5);

    fireEvent.click(screen.getByRole('button', { name: 'Remove Test Plateau Natural, 8 oz' }));
    expect(screen.queryByRole('listitem', { name: 'Test Plateau Natural, 8 oz' })).toBeNull();
    expect(storedLines().map((line) => line.lotCode)).toEqual(['RD-T01']);
    expect(screen.getByRole('link', { name: 'Cart, 5 bags' })).toBeTruthy();

    cleanup();
    renderApp('/cart');
    expect(within(await screen.findByRole('listitem', { name: 'Test Ridge Washed, 1 lb' })).getByLabelText('Bags')).toHaveProperty('value', '5');
  });

  it('says so when the cart is empty', async () => {
    window.localStorage.clear();
    renderApp('/cart');

    expect(await screen.findByRole('heading', { name: 'Your cart is empty' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Cart, empty' })).toBeTruthy();
  });
});
