// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { SubscriberDetail, SubscriberSummary } from '@shared/schemas/subscribers';
import { jsonResponse, makeLot, makeUser, renderApp, requestedUrls, stubFetch, enterValue } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const staff = makeUser({ role: 'staff', name: 'Oren Vale', email: 'oren.vale@example.test' });
const subscriberId = '6b8d0f2c-4e6a-4b7c-9d0e-1f2a3b4c5d6e';

// Invented subscribers.
function makeRow(overrides: Partial<SubscriberSummary> = {}): SubscriberSummary {
  return {
    id: subscriberId,
    customerName: 'Ines Marlow',
    email: 'ines.marlow@example.test',
    status: 'active',
    coffee: 'Test Ridge Washed',
    lotCode: 'RD-T01',
    roastLevel: 'light',
    bagSize: '12oz',
    bagsPerDelivery: 2,
    grind: 'whole-bean',
    brewMethod: 'filter',
    cadenceWeeks: 2,
    priceCents: 3935,
    nextRoastDate: '2026-12-09',
    createdAt: '2026-11-02T16:00:00Z',
    ...overrides,
  };
}

function subscribersServer(total = 1) {
  return stubFetch((url) => {
    if (url.pathname === '/api/lots') return jsonResponse({ items: [makeLot()] });
    if (url.pathname === '/api/roastery/subscribers') {
      return jsonResponse({ items: [makeRow()], total, page: Number(url.searchParams.get('page')), pageSize: 25 });
    }
    const detail: SubscriberDetail = {
      ...makeRow(),
      customer: { id: '0b7d3c1e-5f2a-4c8e-9a61-3d2f4b8e7c10', name: 'Ines Marlow', email: 'ines.marlow@example.test' },
      currency: 'usd',
      pausedUntil: null,
      currentPeriodEnd: '2026-12-15T19:00:00Z',
      cancelledAt: null,
      shippingAddress: { name: 'Ines Marlow', line1: '14 Quarry Lane', line2: null, city: 'Ashfield', region: 'OR', postalCode: '97000', country: 'US' },
      deliveries: [
        {
          id: '7c9e1a3d-5f7b-4c8d-8e1f-2a3b4c5d6e7f',
          sequence: 1,
          roastDate: '2026-11-25',
          shipDate: '2026-11-26',
          readyFrom: '2026-11-30',
          bestBefore: '2026-12-23',
          status: 'shipped',
          lotCode: 'RD-T01',
          coffee: 'Test Ridge Washed',
          order: {
            id: '8d0f2b4e-6a8c-4d9e-9f2a-3b4c5d6e7f80',
            status: 'shipped',
            totalCents: 3935,
            placedAt: '2026-11-20T16:00:00Z',
            paidAt: '2026-11-20T16:01:00Z',
            roastDate: '2026-11-25',
            shipDate: '2026-11-26',
            carrier: 'Kestrel Post',
            trackingNumber: '9400TEST0002',
          },
        },
      ],
      orders: [],
    };
    return jsonResponse(detail);
  });
}

describe('Subscribers (Roastery)', () => {
  it('filters from the URL, sends the same filters to the table and the CSV, and pages', async () => {
    const fetchMock = subscribersServer(60);
    const { router } = renderApp('/roastery/subscribers?status=active&level=light&cadence=2&lot=rotation', { session: staff });

    const table = await screen.findByRole('table', { name: 'Subscribers, page 1 of 3' }, { timeout: 15_000 });
    expect(within(table).getByRole('link', { name: 'Ines Marlow' }).getAttribute('href')).toBe(`/roastery/subscribers/${subscriberId}`);
    expect(within(table).getByText('2 × 12 oz bags')).toBeTruthy();
    expect(requestedUrls(fetchMock)).toContain('/api/roastery/subscribers?status=active&level=light&cadence=2&lot=rotation&page=1&pageSize=25');
    expect(screen.getByRole('link', { name: 'Download these as CSV' }).getAttribute('href')).toBe(
      '/api/roastery/subscribers.csv?status=active&level=light&cadence=2&lot=rotation',
    );
    expect(screen.getByLabelText('Coffee')).toHaveProperty('value', 'rotation');

    enterValue(screen.getByLabelText('Roast level'), 'dark');
    await waitFor(() => expect(router.state.location.search).toBe('?status=active&level=dark&cadence=2&lot=rotation'));
    await waitFor(() => expect(screen.getByRole('link', { name: 'Download these as CSV' }).getAttribute('href')).toContain('level=dark'));

    fireEvent.click(await screen.findByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(router.state.location.search).toBe('?status=active&level=dark&cadence=2&lot=rotation&page=2'));
    await waitFor(() =>
      expect(requestedUrls(fetchMock)).toContain('/api/roastery/subscribers?status=active&level=dark&cadence=2&lot=rotation&page=2&pageSize=25'),
    );
  });

  it('opens a subscriber with their deliveries and the orders they became', async () => {
    subscribersServer();
    renderApp(`/roastery/subscribers/${subscriberId}`, { session: staff });

    expect(await screen.findByRole('heading', { level: 1, name: 'Ines Marlow' }, { timeout: 15_000 })).toBeTruthy();
    const deliveries = screen.getByRole('table', { name: 'Deliveries of this subscription' });
    const row = within(deliveries).getByRole('row', { name: /Wed, Nov 25, 2026/ });
    expect(row.textContent).toContain('Shipped');
    expect(row.textContent).toContain('Kestrel Post 9400TEST0002');
    expect(screen.getByText('14 Quarry Lane')).toBeTruthy();
  });
});
