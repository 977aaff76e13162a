// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { leaveFor } from '@/lib/leave-for';
import { apiErrorResponse, jsonResponse, makeLotDetail, makeUser, renderApp, sentRequests, stubFetch, enterValue } from '@/testing/test-utils';

vi.mock('@/lib/leave-for', () => ({ leaveFor: vi.fn() }));

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  vi.mocked(leaveFor).mockClear();
});

const choices = 'lot=RD-T01&level=medium&size=1lb&bags=2&grind=pour-over&brew=filter&every=2';

// An invented lot, price and address.
function shippingServer(onCheckout: () => Response) {
  return stubFetch((url) => {
    if (url.pathname === '/api/account/addresses') return jsonResponse({ items: [] });
    if (url.pathname === '/api/lots/RD-T01') return jsonResponse(makeLotDetail());
    if (url.pathname === '/api/subscriptions/preview') {
      return jsonResponse({
        priceCents: 4835,
        regularPriceCents: 5295,
        discountPct: 10,
        shippingCents: 695,
        bagPriceCents: { '12oz': 1620, '1lb': 2070, '2lb': 3960 },
        currency: 'usd',
        deliveries: [],
        shipPolicy: 'ready_on_arrival',
      });
    }
    return onCheckout();
  });
}

function fill(label: string, value: string) {
  enterValue(screen.getByLabelText(label), value);
}

describe('Roasted to Order shipping step', () => {
  it('reads the choices back, then creates the subscription with them and the address and goes to pay', async () => {
    const fetchMock = shippingServer(() =>
      jsonResponse({ subscriptionId: '5a7c9e1b-3d5f-4a6b-8c9d-0e1f2a3b4c5d', checkoutUrl: 'http://127.0.0.1:12111/pay/cs_test_sub' }, 201),
    );
    renderApp(`/subscribe/shipping?${choices}`, { session: makeUser() });

    expect(await screen.findByText('Test Ridge Washed', undefined, { timeout: 15_000 })).toBeTruthy();
    expect(screen.getByText('2 × Net Wt 16 oz (1 lb) 454 g')).toBeTruthy();
    expect(screen.getByText('Pour-over')).toBeTruthy();
    expect(await screen.findByText('$48.35')).toBeTruthy();
    fill('Recipient’s name', 'Ines Marlow');
    fill('Street address', '14 Quarry Lane');
    fill('City or town', 'Ashfield');
    fill('State or region', 'OR');
    fill('ZIP or postal code', '97000');
    fireEvent.click(screen.getByRole('button', { name: 'Continue to payment' }));

    await waitFor(() => expect(leaveFor).toHaveBeenCalledWith('http://127.0.0.1:12111/pay/cs_test_sub'));
    expect(sentRequests(fetchMock, 'POST', '/api/checkout/subscription')[0]?.body).toEqual({
      lotCode: 'RD-T01',
      roastLevel: 'medium',
      bagSize: '1lb',
      bagsPerDelivery: 2,
      grind: 'pour-over',
      brewMethod: 'filter',
      cadenceWeeks: 2,
      shippingAddress: { name: 'Ines Marlow', line1: '14 Quarry Lane', line2: null, city: 'Ashfield', region: 'OR', postalCode: '97000', country: 'US' },
      // The address book is empty, so the address is kept for next time unless the customer unticks it.
      saveAddress: true,
    });
  });

  it('says what the server refused and stays on the page', async () => {
    shippingServer(() => apiErrorResponse(422, 'level_not_allowed', 'Lot RD-T01 is not roasted to dark.'));
    renderApp(`/subscribe/shipping?${choices}`, { session: makeUser() });

    await screen.findByLabelText('Street address', undefined, { timeout: 15_000 });
    fill('Recipient’s name', 'Ines Marlow');
    fill('Street address', '14 Quarry Lane');
    fill('City or town', 'Ashfield');
    fill('State or region', 'OR');
    fill('ZIP or postal code', '97000');
    fireEvent.click(screen.getByRole('button', { name: 'Continue to payment' }));

    expect((await screen.findByRole('alert')).textContent).toContain('Lot RD-T01 is not roasted to dark.');
    expect(leaveFor).not.toHaveBeenCalled();
  });

  it('sends a visitor to sign in, keeping the choices for the way back', async () => {
    stubFetch(() => new Response(null, { status: 404 }));
    const { router } = renderApp(`/subscribe/shipping?${choices}`);

    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(new URLSearchParams(router.state.location.search).get('redirectTo')).toBe(`/subscribe/shipping?${choices}`);
  });

  it('sends incomplete choices back to the builder', async () => {
    shippingServer(() => new Response(null, { status: 404 }));
    renderApp('/subscribe/shipping?lot=RD-T01&level=medium', { session: makeUser() });

    expect(await screen.findByRole('heading', { name: 'Your choices are incomplete' }, { timeout: 15_000 })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Back to Roasted to Order' }).getAttribute('href')).toBe('/subscribe?lot=RD-T01&level=medium');
  });
});
