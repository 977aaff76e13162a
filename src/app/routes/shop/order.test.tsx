// @vitest-environment happy-dom
import { act, cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { OrderDetail } from '@shared/schemas/orders';
import { apiErrorResponse, jsonResponse, makeUser, renderApp, requestedUrls, stubFetch } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  window.localStorage.clear();
});

const orderId = '3c9a7e2b-1d4f-4a8b-9c6e-5f7a8b9c0d1e';

// An invented order of an invented lot.
function makeOrder(overrides: Partial<OrderDetail> = {}): OrderDetail {
  return {
    id: orderId,
    kind: 'green',
    status: 'pending_payment',
    placedAt: '2026-12-01T16:05:00Z',
    customer: { id: makeUser().id, name: 'Ines Marlow', email: 'ines.marlow@example.test' },
    items: [
      {
        id: '4d0b8f3c-2e5a-4b9c-8d7f-6a8b9c0d1e2f',
        lotCode: 'RD-T01',
        lotName: 'Test Ridge Washed',
        size: '1lb',
        quantity: 2,
        fillGrams: 454,
        roastLevel: null,
        grind: null,
        brewMethod: null,
        unitPriceCents: 1111,
        lineTotalCents: 2222,
      },
    ],
    subtotalCents: 2222,
    discountCents: 0,
    discountLabel: null,
    shippingCents: 895,
    totalCents: 3117,
    refundedCents: 0,
    currency: 'usd',
    shippingAddress: { name: 'Ines Marlow', line1: '14 Quarry Lane', line2: null, city: 'Ashfield', region: 'OR', postalCode: '97000', country: 'US' },
    roastDate: null,
    shipDate: null,
    readyFrom: null,
    bestBefore: null,
    expectedArrival: null,
    readyOnArrival: null,
    carrier: null,
    trackingNumber: null,
    paidAt: null,
    shippedAt: null,
    cancelledAt: null,
    ...overrides,
  };
}

describe('order page', () => {
  it('gives a roasted order its expected arrival and says whether it lands ready to brew', async () => {
    const roasted = {
      kind: 'roasted',
      status: 'paid',
      roastDate: '2026-02-09',
      shipDate: '2026-02-10',
      readyFrom: '2026-02-16',
      bestBefore: '2026-03-09',
    } as const;
    stubFetch(() => jsonResponse(makeOrder({ ...roasted, expectedArrival: '2026-02-13', readyOnArrival: false })));
    renderApp(`/orders/${orderId}`, { session: makeUser() });

    const dates = await screen.findByRole('region', { name: 'Dates and tracking' }, { timeout: 15_000 });
    expect(dates.textContent).toMatch(/Expected to arrive.*Feb.*13/);
    expect(dates.textContent).toContain('It can arrive before it is ready: brew it from its ready-from date.');
  });

  it('after the payment page, waits for the confirmed payment, then shows it paid and empties those bags from the cart', async () => {
    window.localStorage.setItem(
      'restday.cart',
      JSON.stringify({
        version: 1,
        lines: [{ lotCode: 'RD-T01', lotName: 'Test Ridge Washed', size: '1lb', quantity: 2, pricePerKgCents: 2450, priceBreaks: [] }],
      }),
    );
    let asked = 0;
    const fetchMock = stubFetch(() => {
      asked += 1;
      // The webhook lands between the first and second look.
      return jsonResponse(asked === 1 ? makeOrder() : makeOrder({ status: 'paid', paidAt: '2026-12-01T16:06:00Z' }));
    });
    renderApp(`/orders/${orderId}?checkout=complete`, { session: makeUser() });

    // The first render of a file waits for its lazy modules to compile.
    await screen.findByRole('heading', { level: 1, name: 'Your order' }, { timeout: 15_000 });
    expect(screen.getByText('Waiting for the payment to be confirmed…')).toBeTruthy();
    expect(screen.queryByText(/Payment confirmed/)).toBeNull();

    expect(await screen.findByText(/Payment confirmed/, undefined, { timeout: 6000 })).toBeTruthy();
    expect(screen.queryByText('Waiting for the payment to be confirmed…')).toBeNull();
    expect(screen.getAllByText('Paid').length).toBeGreaterThan(0);
    expect(requestedUrls(fetchMock)).toEqual([`/api/orders/${orderId}`, `/api/orders/${orderId}`]);
    // The cart empties in an effect once the paid order is on screen.
    await waitFor(() => expect(window.localStorage.getItem('restday.cart')).toBeNull());
    expect(screen.getByRole('link', { name: 'Cart, empty' })).toBeTruthy();
  });

  it('when no confirmation has come after 20 s, says so plainly, keeps asking, and asks at once on request', async () => {
    const fetchMock = stubFetch(() => jsonResponse(makeOrder()));
    vi.useFakeTimers({ shouldAdvanceTime: true });
    try {
      renderApp(`/orders/${orderId}?checkout=complete`, { session: makeUser() });
      await screen.findByText('Waiting for the payment to be confirmed…', undefined, { timeout: 15_000 });
      expect(screen.queryByText(/taking longer than usual/)).toBeNull();
      await act(() => vi.advanceTimersByTimeAsync(20_000));
    } finally {
      vi.useRealTimers();
    }
    expect(screen.getByText(/taking longer than usual/)).toBeTruthy();
    expect(screen.getByText('Waiting for the payment to be confirmed…')).toBeTruthy();
    // Every 2 s while waiting (PAYMENT_POLL_MS), so the page kept asking through those 20 s.
    const askedWhileWaiting = requestedUrls(fetchMock).length;
    expect(askedWhileWaiting).toBeGreaterThanOrEqual(5);

    fireEvent.click(screen.getByRole('button', { name: 'Check again now' }));
    await vi.waitFor(() => expect(requestedUrls(fetchMock).length).toBeGreaterThan(askedWhileWaiting));
    expect(screen.queryByText(/Payment confirmed/)).toBeNull();
  });

  it('shows an order’s bags, totals, dates and tracking without asking again', async () => {
    const fetchMock = stubFetch(() =>
      jsonResponse(
        makeOrder({ status: 'shipped', paidAt: '2026-12-01T16:06:00Z', shipDate: '2026-12-03', carrier: 'Kestrel Post', trackingNumber: '9400TEST0001' }),
      ),
    );
    renderApp(`/orders/${orderId}`, { session: makeUser() });

    const bags = await screen.findByRole('list', { name: 'Bags in this order' }, { timeout: 15_000 });
    expect(bags.textContent).toContain('Test Ridge Washed');
    expect(screen.getByText('Shipped')).toBeTruthy();
    expect(screen.getByText('$31.17')).toBeTruthy();
    expect(screen.getByText('Dec 3, 2026')).toBeTruthy();
    expect(screen.getByText('Kestrel Post 9400TEST0001')).toBeTruthy();
    expect(screen.queryByText('Waiting for the payment to be confirmed…')).toBeNull();
    expect(requestedUrls(fetchMock)).toEqual([`/api/orders/${orderId}`]);
  });

  it('says when the order is not the customer’s or does not exist', async () => {
    stubFetch(() => apiErrorResponse(404, 'order_not_found', 'No such order.'));
    renderApp(`/orders/${orderId}`, { session: makeUser() });

    expect(await screen.findByRole('heading', { level: 1, name: 'Order not found' }, { timeout: 15_000 })).toBeTruthy();
  });
});
