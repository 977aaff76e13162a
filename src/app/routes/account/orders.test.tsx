// @vitest-environment happy-dom
import { cleanup, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { OrderSummary } from '@shared/schemas/orders';
import { jsonResponse, makeUser, renderApp, requestedUrls, stubFetch } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// Invented orders.
const customer = { id: makeUser().id, name: 'Ines Marlow', email: 'ines.marlow@example.test' };
const shipped: OrderSummary = {
  id: '3c9a7e2b-1d4f-4a8b-9c6e-5f7a8b9c0d1e',
  kind: 'green',
  status: 'shipped',
  placedAt: '2026-11-20T15:00:00Z',
  customer,
  bagCount: 3,
  totalCents: 4211,
  roastDate: null,
  shipDate: '2026-11-21',
};
const waiting: OrderSummary = {
  ...shipped,
  id: '5e1c9a4d-3f6b-4c0d-9e8a-7b9c0d1e2f3a',
  status: 'pending_payment',
  bagCount: 1,
  totalCents: 1556,
  shipDate: null,
};

describe('account orders page', () => {
  it('lists the customer’s orders with status and total, each linking to its page', async () => {
    const fetchMock = stubFetch(() => jsonResponse({ items: [waiting, shipped], total: 2, page: 1, pageSize: 50 }));
    renderApp('/account/orders', { session: makeUser() });

    const list = await screen.findByRole('list', { name: 'Your orders' }, { timeout: 15_000 });
    const rows = within(list).getAllByRole('listitem');
    expect(rows).toHaveLength(2);
    expect(rows[0]?.textContent).toContain('Awaiting payment');
    // The reference staff use (the id's first eight characters), and a way on for the unpaid one.
    expect(rows[0]?.textContent).toContain('Order 5E1C9A4D of');
    expect(
      within(rows[0] as HTMLElement)
        .getByRole('link', { name: 'Pay now or discard' })
        .getAttribute('href'),
    ).toBe(`/orders/${waiting.id}`);
    expect(rows[1]?.textContent).toContain('Shipped');
    expect(rows[1]?.textContent).toContain('3 bags');
    expect(rows[1]?.textContent).toContain('ships Nov 21, 2026');
    expect(rows[1]?.textContent).toContain('$42.11');
    expect(
      within(rows[1] as HTMLElement)
        .getAllByRole('link')[0]!
        .getAttribute('href'),
    ).toBe(`/orders/${shipped.id}`);
    expect(requestedUrls(fetchMock)).toEqual(['/api/orders?page=1&sort=newest']);
  });

  it('says when there are no orders yet', async () => {
    stubFetch(() => jsonResponse({ items: [], total: 0, page: 1, pageSize: 50 }));
    renderApp('/account/orders', { session: makeUser() });

    expect(await screen.findByRole('heading', { name: 'No orders yet' }, { timeout: 15_000 })).toBeTruthy();
  });
});
