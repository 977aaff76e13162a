// @vitest-environment happy-dom
import { cleanup, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Subscription } from '@shared/schemas/subscriptions';
import { apiErrorResponse, jsonResponse, makeUser, renderApp, requestedUrls, stubFetch } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const id = '5a7c9e1b-3d5f-4a6b-8c9d-0e1f2a3b4c5d';

// An invented Roaster's Rotation subscription.
function makeSubscription(overrides: Partial<Subscription> = {}): Subscription {
  return {
    id,
    status: 'incomplete',
    lotCode: null,
    coffee: "Roaster's Rotation",
    roastLevel: 'medium',
    bagSize: '12oz',
    bagsPerDelivery: 1,
    grind: 'whole-bean',
    brewMethod: 'espresso',
    cadenceWeeks: 2,
    pausedUntil: null,
    cancelAtPeriodEnd: false,
    endsOn: null,
    priceCents: 2315,
    currency: 'usd',
    shippingAddress: { name: 'Ines Marlow', line1: '14 Quarry Lane', line2: null, city: 'Ashfield', region: 'OR', postalCode: '97000', country: 'US' },
    nextDelivery: null,
    createdAt: '2026-12-01T16:00:00Z',
    ...overrides,
  };
}

const delivery = {
  roastDate: '2026-12-09',
  shipDate: '2026-12-10',
  readyFrom: '2026-12-16',
  bestBefore: '2027-01-06',
  expectedArrival: '2026-12-15',
  readyOnArrival: false,
  status: 'scheduled',
  locked: false,
  cutoffAt: '2026-12-08T19:00:00Z',
  lotCode: null,
  coffee: null,
  roastLevel: 'medium',
  bagSize: '12oz',
  bagsPerDelivery: 1,
  grind: 'whole-bean',
  brewMethod: 'espresso',
  orderId: null,
  paid: false,
};

describe('subscription page after paying', () => {
  it('waits for the payment to be confirmed, never trusting the return, then shows the schedule', async () => {
    let asked = 0;
    const fetchMock = stubFetch((url) => {
      if (url.pathname.endsWith('/deliveries')) return jsonResponse({ items: [delivery] });
      asked += 1;
      // The webhook lands between the first and second look.
      return jsonResponse(makeSubscription(asked === 1 ? {} : { status: 'active' }));
    });
    renderApp(`/subscriptions/${id}?checkout=complete`, { session: makeUser() });

    expect(await screen.findByText('Waiting for the payment to be confirmed…', undefined, { timeout: 15_000 })).toBeTruthy();
    expect(screen.queryByRole('table')).toBeNull();

    expect(await screen.findByText('Your subscription has started. Thank you!', undefined, { timeout: 6000 })).toBeTruthy();
    const schedule = await screen.findByRole('table', { name: "Upcoming deliveries of Roaster's Rotation" });
    const row = within(schedule).getByRole('row', { name: /Wed, Dec 9, 2026/ });
    expect(row.textContent).toContain('Wed, Dec 16, 2026');
    expect(row.textContent).toContain('Lot chosen nearer the roast day');
    expect(requestedUrls(fetchMock).filter((url) => url === `/api/subscriptions/${id}`)).toHaveLength(2);
    expect(screen.getByRole('link', { name: 'Skip, pause or change in Deliveries' }).getAttribute('href')).toBe('/account/deliveries');
  });

  it('says when the subscription is not the customer’s or does not exist', async () => {
    stubFetch(() => apiErrorResponse(404, 'not_found', 'Subscription not found.'));
    renderApp(`/subscriptions/${id}`, { session: makeUser() });

    expect(await screen.findByRole('heading', { level: 1, name: 'Subscription not found' }, { timeout: 15_000 })).toBeTruthy();
  });
});
