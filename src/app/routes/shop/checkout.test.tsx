// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { CartLine } from '@/features/cart/stores/cart-store';
import { leaveFor } from '@/lib/leave-for';
import { defaultShopSettings } from '@shared/schemas/settings';
import { apiErrorResponse, jsonResponse, makeUser, renderApp, sentRequests, stubFetch, enterValue } from '@/testing/test-utils';

vi.mock('@/lib/leave-for', () => ({ leaveFor: vi.fn() }));

// An invented lot and address.
const ridge: CartLine = {
  lotCode: 'RD-T01',
  lotName: 'Test Ridge Washed',
  size: '1lb',
  quantity: 2,
  pricePerKgCents: 2450,
  priceBreaks: [{ minGrams: 2268, pricePerKgCents: 2200 }],
};

function fill(label: string, value: string) {
  enterValue(screen.getByLabelText(label), value);
}

function fillAddress() {
  fill('Recipient’s name', 'Ines Marlow');
  fill('Street address', '14 Quarry Lane');
  fill('City or town', 'Ashfield');
  fill('State or region', 'OR');
  fill('ZIP or postal code', '97000');
}

/** Answers like the server: the saved addresses, and `onCheckout` for the order itself. */
function checkoutServer(onCheckout: () => Response, addresses: unknown[] = []) {
  return stubFetch((url) => {
    if (url.pathname === '/api/account/addresses') return jsonResponse({ items: addresses });
    if (url.pathname === '/api/shipping') return jsonResponse({ currency: 'usd', ...defaultShopSettings.shipping });
    return onCheckout();
  });
}

const submit = () => fireEvent.click(screen.getByRole('button', { name: 'Continue to payment' }));

beforeEach(() => {
  window.localStorage.setItem('restday.cart', JSON.stringify({ version: 1, lines: [ridge] }));
});

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  vi.mocked(leaveFor).mockClear();
  window.localStorage.clear();
});

describe('checkout page', () => {
  it('sends a visitor to sign in and back to checkout, the cart kept', async () => {
    stubFetch(() => new Response(null, { status: 404 }));
    const { router } = renderApp('/checkout');

    // The first render of a file waits for its lazy modules to compile.
    await waitFor(() => expect(`${router.state.location.pathname}${router.state.location.search}`).toBe('/sign-in?redirectTo=%2Fcheckout'), {
      timeout: 15_000,
    });
    expect(window.localStorage.getItem('restday.cart')).toContain('RD-T01');
  });

  it('checks the address before sending anything', async () => {
    const fetchMock = checkoutServer(() => new Response(null, { status: 404 }));
    renderApp('/checkout', { session: makeUser() });

    await screen.findByRole('listitem', { name: 'Test Ridge Washed, 1 lb' });
    submit();

    expect(await screen.findByText('Enter the street address.')).toBeTruthy();
    expect(screen.getByLabelText('City or town').getAttribute('aria-invalid')).toBe('true');
    expect(sentRequests(fetchMock, 'POST', '/api/checkout/green')).toHaveLength(0);
  });

  it('places the order with the cart and the address, then goes to the payment page', async () => {
    const fetchMock = checkoutServer(() =>
      jsonResponse({ orderId: '3c9a7e2b-1d4f-4a8b-9c6e-5f7a8b9c0d1e', checkoutUrl: 'http://127.0.0.1:12111/pay/cs_test_1' }, 201),
    );
    renderApp('/checkout', { session: makeUser() });

    await screen.findByRole('listitem', { name: 'Test Ridge Washed, 1 lb' });
    fillAddress();
    submit();

    await waitFor(() => expect(leaveFor).toHaveBeenCalledWith('http://127.0.0.1:12111/pay/cs_test_1'));
    const [request] = sentRequests(fetchMock, 'POST', '/api/checkout/green');
    expect(request?.body).toEqual({
      items: [{ lotCode: 'RD-T01', size: '1lb', quantity: 2 }],
      shippingAddress: { name: 'Ines Marlow', line1: '14 Quarry Lane', line2: null, city: 'Ashfield', region: 'OR', postalCode: '97000', country: 'US' },
      // The address book is empty, so the address is kept for next time unless the customer unticks it.
      saveAddress: true,
    });
    expect(request?.headers.get('X-Restday-Client')).toBe('web');
  });

  it('sends the same Idempotency-Key when the same cart and address are submitted again after a 503, and a new one after an edit', async () => {
    const answers = [
      () => apiErrorResponse(503, 'payments_unavailable', 'Payments cannot be taken right now.'),
      () => apiErrorResponse(503, 'payments_unavailable', 'Payments cannot be taken right now.'),
      () => jsonResponse({ orderId: '00000000-0000-4000-8000-000000000001', checkoutUrl: 'http://127.0.0.1:12111/pay/cs_test_1' }, 201),
    ];
    const fetchMock = checkoutServer(() => answers.shift()!());
    renderApp('/checkout', { session: makeUser() });

    await screen.findByRole('listitem', { name: 'Test Ridge Washed, 1 lb' });
    fillAddress();
    submit();
    await screen.findByText('Payments cannot be taken right now.');
    submit();
    await waitFor(() => expect(sentRequests(fetchMock, 'POST', '/api/checkout/green')).toHaveLength(2));
    fill('City or town', 'Ashford');
    submit();
    await waitFor(() => expect(leaveFor).toHaveBeenCalled());

    const keys = sentRequests(fetchMock, 'POST', '/api/checkout/green').map((request) => request.headers.get('Idempotency-Key'));
    expect(keys[0]).toMatch(/^[A-Za-z0-9_-]{8,100}$/);
    expect(keys[1]).toBe(keys[0]);
    expect(keys[2]).not.toBe(keys[0]);
  });

  it('shows the server’s reasons on the address fields', async () => {
    checkoutServer(() =>
      apiErrorResponse(400, 'validation_failed', 'Check the highlighted fields.', { 'shippingAddress.postalCode': 'Use a postal code we ship to.' }),
    );
    renderApp('/checkout', { session: makeUser() });

    await screen.findByRole('listitem', { name: 'Test Ridge Washed, 1 lb' });
    fillAddress();
    submit();

    expect(await screen.findByText('Use a postal code we ship to.')).toBeTruthy();
    expect(screen.getByLabelText('ZIP or postal code').getAttribute('aria-invalid')).toBe('true');
    expect(leaveFor).not.toHaveBeenCalled();
  });

  it('shows a stock conflict against the cart line it concerns', async () => {
    checkoutServer(() =>
      apiErrorResponse(409, 'insufficient_stock', 'There is not enough of lot RD-T01 left for this order.', {
        'items.0.quantity': 'Only 1 bag of this size is left.',
      }),
    );
    renderApp('/checkout', { session: makeUser() });

    const line = await screen.findByRole('listitem', { name: 'Test Ridge Washed, 1 lb' });
    fillAddress();
    submit();

    expect(await within(line).findByText('Only 1 bag of this size is left.')).toBeTruthy();
    expect(screen.getAllByRole('alert').some((alert) => alert.textContent?.includes('not enough of lot RD-T01'))).toBe(true);
    expect(leaveFor).not.toHaveBeenCalled();
  });

  it('starts from the customer’s saved default address', async () => {
    checkoutServer(
      () => new Response(null, { status: 404 }),
      [
        {
          id: '6f1d2a4b-8c3e-4f5a-9b7d-1e2c3d4f5a6b',
          name: 'Ines Marlow',
          line1: '14 Quarry Lane',
          line2: 'Unit 2',
          city: 'Ashfield',
          region: 'OR',
          postalCode: '97000',
          country: 'US',
          isDefault: true,
        },
      ],
    );
    renderApp('/checkout', { session: makeUser() });

    expect(await screen.findByDisplayValue('14 Quarry Lane')).toBeTruthy();
    expect(screen.getByLabelText('Apartment, suite or unit (optional)')).toHaveProperty('value', 'Unit 2');
  });
});
