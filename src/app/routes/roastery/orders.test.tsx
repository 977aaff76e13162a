// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { OrderDetail, OrderListResponse, OrderSummary } from '@shared/schemas/orders';
import { apiErrorResponse, jsonResponse, makeUser, renderApp, requestedUrls, stubFetch, enterValue } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const staff = makeUser({ role: 'staff', name: 'Oren Vale', email: 'oren.vale@example.test' });

// Invented customers and orders.
function makeSummary(overrides: Partial<OrderSummary> = {}): OrderSummary {
  return {
    id: '6a1f3c5e-7b9d-4e2f-8a4c-6e8f0a2c4e6a',
    kind: 'green',
    status: 'paid',
    placedAt: '2026-11-28T15:30:00.000Z',
    customer: { id: '7b2a4d6f-8c0e-4f3a-9b5d-7f9a1b3d5f7b', name: 'Juno Reed', email: 'juno.reed@example.test' },
    bagCount: 2,
    totalCents: 5980,
    roastDate: null,
    shipDate: '2026-12-02',
    ...overrides,
  };
}

const listOf = (items: OrderSummary[], overrides: Partial<OrderListResponse> = {}): OrderListResponse => ({
  items,
  total: items.length,
  page: 1,
  pageSize: 50,
  ...overrides,
});

function detail(overrides: Partial<OrderDetail> = {}): OrderDetail {
  const { bagCount: _bags, ...summary } = makeSummary();
  return {
    ...summary,
    items: [
      {
        id: '8c3b5e7a-9d1f-4a4b-8c6e-8a0b2c4e6f8c',
        lotCode: 'RD-T01',
        lotName: 'Test Ridge Washed',
        size: '1lb',
        quantity: 2,
        fillGrams: 454,
        roastLevel: null,
        grind: null,
        brewMethod: null,
        unitPriceCents: 1990,
        lineTotalCents: 3980,
      },
    ],
    subtotalCents: 3980,
    discountCents: 0,
    discountLabel: null,
    shippingCents: 2000,
    totalCents: 5980,
    refundedCents: 0,
    currency: 'usd',
    shippingAddress: { name: 'Juno Reed', line1: '12 Invented Lane', line2: null, city: 'Fairhaven', region: 'OR', postalCode: '97000', country: 'US' },
    readyFrom: null,
    bestBefore: null,
    expectedArrival: null,
    readyOnArrival: null,
    carrier: null,
    trackingNumber: null,
    paidAt: '2026-11-28T15:32:00.000Z',
    shippedAt: null,
    cancelledAt: null,
    ...overrides,
  };
}

const apiListRequests = (fetchMock: ReturnType<typeof stubFetch>) => requestedUrls(fetchMock).filter((url) => url.startsWith('/api/orders'));

describe('Roastery orders table', () => {
  it('lists every customer’s orders in a captioned table and opens the Orders item in the navigation', async () => {
    const held = makeSummary({
      id: '9d4c6f8b-0e2a-4b5c-9d7f-9b1c3d5f7a9d',
      status: 'held',
      customer: { id: '0e5d7a9c-1f3b-4c6d-8e8a-0c2d4e6a8b0e', name: 'Ada Quill', email: 'ada.quill@example.test' },
      roastDate: '2026-12-03',
    });
    const fetchMock = stubFetch(() => jsonResponse(listOf([makeSummary(), held])));
    renderApp('/roastery/orders', { session: staff });

    const table = await screen.findByRole('table', { name: 'Orders, newest first' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(2);
    expect(
      within(rows[0] as HTMLElement)
        .getByRole('link', { name: 'Order 6A1F3C5E' })
        .getAttribute('href'),
    ).toBe('/roastery/orders/6a1f3c5e-7b9d-4e2f-8a4c-6e8f0a2c4e6a');
    expect(within(rows[0] as HTMLElement).getByText('$59.80')).toBeTruthy();
    expect(within(rows[1] as HTMLElement).getByText('On hold')).toBeTruthy();
    expect(within(rows[1] as HTMLElement).getByText('Dec 3, 2026')).toBeTruthy();
    expect(within(table).getByRole('columnheader', { name: 'Placed' }).getAttribute('aria-sort')).toBe('descending');
    expect(apiListRequests(fetchMock)).toEqual(['/api/orders']);

    const nav = screen.getByRole('navigation', { name: 'Roastery' });
    expect(within(nav).getByRole('link', { name: 'Orders' }).getAttribute('aria-current')).toBe('page');
    await waitFor(() => expect(document.title).toBe('Orders · Roastery · Restday'));
  });

  it('writes each filter and the sort into the URL, asks the API for them, and starts again at page one', async () => {
    const fetchMock = stubFetch(() => jsonResponse(listOf([makeSummary()], { total: 120, page: 2 })));
    const { router } = renderApp('/roastery/orders?page=2', { session: staff });

    const filters = await screen.findByRole('form', { name: 'Filter orders' });
    // Each step waits until the page shows what the URL now says, as a person would.
    const choose = async (label: string, value: string, search: string) => {
      const control = within(filters).getByLabelText(label) as HTMLInputElement | HTMLSelectElement;
      enterValue(control, value);
      await waitFor(() => expect(router.state.location.search).toBe(search));
      await waitFor(() => expect(control.value).toBe(value));
      await waitFor(() => expect(apiListRequests(fetchMock)).toContain(`/api/orders${search}`));
    };
    await choose('Status', 'paid', '?status=paid');
    await choose('Placed from', '2026-11-01', '?status=paid&from=2026-11-01');
    await choose('Placed until', '2026-11-30', '?status=paid&from=2026-11-01&to=2026-11-30');
    await choose('Roast date', '2026-12-03', '?status=paid&from=2026-11-01&to=2026-11-30&roastDate=2026-12-03');
    await choose('Sort', 'roast-date-soonest', '?status=paid&from=2026-11-01&to=2026-11-30&roastDate=2026-12-03&sort=roast-date-soonest');
    expect(apiListRequests(fetchMock)[0]).toBe('/api/orders?page=2');
    expect(await screen.findByRole('table', { name: 'Orders, roast date, soonest first' })).toBeTruthy();
  });

  it('points Download CSV at the export with the same filters and sort, never the page', async () => {
    stubFetch(() => jsonResponse(listOf([makeSummary()], { total: 120, page: 3 })));
    renderApp('/roastery/orders?status=shipped&kind=green&from=2026-10-01&sort=total-high&page=3', { session: staff });

    const csv = await screen.findByRole('link', { name: 'Download CSV' });
    expect(csv.getAttribute('href')).toBe('/api/orders.csv?status=shipped&kind=green&from=2026-10-01&sort=total-high');
    expect(csv.hasAttribute('download')).toBe(true);
  });

  it('pages with links that keep the filters', async () => {
    stubFetch(() => jsonResponse(listOf([makeSummary()], { total: 120, page: 2 })));
    renderApp('/roastery/orders?status=paid&page=2', { session: staff });

    const pages = await screen.findByRole('navigation', { name: 'Pages of orders' });
    expect(within(pages).getByText('Page 2 of 3')).toBeTruthy();
    expect(within(pages).getByRole('link', { name: 'Previous page' }).getAttribute('href')).toBe('/roastery/orders?status=paid');
    expect(within(pages).getByRole('link', { name: 'Next page' }).getAttribute('href')).toBe('/roastery/orders?status=paid&page=3');
  });

  it('flags a backwards date range on its field and does not ask the API', async () => {
    const fetchMock = stubFetch(() => jsonResponse(listOf([])));
    renderApp('/roastery/orders?from=2026-12-09&to=2026-12-01', { session: staff });

    const until = await screen.findByLabelText('Placed until');
    expect(until.getAttribute('aria-invalid')).toBe('true');
    const errorId = until.getAttribute('aria-describedby') ?? '';
    expect(document.getElementById(errorId)?.textContent).toBe('The first day must not be after the last.');
    expect(screen.getByRole('heading', { name: 'Check the dates' })).toBeTruthy();
    expect(screen.queryByRole('link', { name: 'Download CSV' })).toBeNull();
    expect((screen.getByRole('button', { name: 'Download CSV' }) as HTMLButtonElement).disabled).toBe(true);
    expect(apiListRequests(fetchMock)).toEqual([]);
  });

  it('says when no order matches, with a way back to every order', async () => {
    stubFetch(() => jsonResponse(listOf([])));
    renderApp('/roastery/orders?status=refunded', { session: staff });

    expect(await screen.findByRole('heading', { name: 'No orders match these filters' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Show every order' }).getAttribute('href')).toBe('/roastery/orders');
  });

  it('shows the server’s reason when the orders cannot load, and tries again', async () => {
    let databaseDown = true;
    stubFetch(() =>
      databaseDown
        ? apiErrorResponse(503, 'database_unavailable', 'The database is restarting. Try again in a moment.')
        : jsonResponse(listOf([makeSummary()])),
    );
    renderApp('/roastery/orders', { session: staff });

    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('The database is restarting. Try again in a moment.')).toBeTruthy();
    databaseDown = false;
    fireEvent.click(within(alert).getByRole('button', { name: 'Try again' }));
    expect(await screen.findByRole('table')).toBeTruthy();
  });
});

describe('Roastery order detail', () => {
  it('shows customer, ship-to, bags, totals, payment, dates, carrier and tracking, and the shipping section', async () => {
    const order = detail({
      status: 'shipped',
      roastDate: '2026-12-01',
      shipDate: '2026-12-02',
      readyFrom: '2026-12-05',
      bestBefore: '2027-01-12',
      carrier: 'Invented Parcel',
      trackingNumber: 'IP-0042-7781',
      shippedAt: '2026-12-02T17:00:00.000Z',
      refundedCents: 1990,
    });
    const fetchMock = stubFetch(() => jsonResponse(order));
    renderApp(`/roastery/orders/${order.id}`, { session: staff });

    expect(await screen.findByRole('heading', { level: 1, name: 'Order 6A1F3C5E' })).toBeTruthy();
    expect(requestedUrls(fetchMock)).toContain(`/api/orders/${order.id}`);
    const customer = screen.getByRole('region', { name: 'Customer' });
    expect(within(customer).getByRole('link', { name: 'juno.reed@example.test' }).getAttribute('href')).toBe('mailto:juno.reed@example.test');
    expect(within(screen.getByRole('region', { name: 'Ships to' })).getByText(/12 Invented Lane/)).toBeTruthy();

    const bags = screen.getByRole('table', { name: 'Bags' });
    const line = within(bags).getByRole('row', { name: /Test Ridge Washed/ });
    expect(within(line).getByText('$39.80')).toBeTruthy();
    expect(within(line).getByRole('link', { name: 'RD-T01' }).getAttribute('href')).toBe('/roastery/green-stock/RD-T01');
    expect(within(bags).getByRole('row', { name: /Total \(USD\)/ }).textContent).toContain('$59.80');
    expect(within(bags).getByRole('row', { name: /Refunded/ }).textContent).toContain('$19.90');

    expect(within(screen.getByRole('region', { name: 'Payment' })).getByText('Paid $59.80, $19.90 refunded.')).toBeTruthy();
    const dates = screen.getByRole('region', { name: 'Dates' });
    expect(within(dates).getByText('Ready-from date').nextElementSibling?.textContent).toBe('Dec 5, 2026');
    expect(within(dates).getByText('Best-before date').nextElementSibling?.textContent).toBe('Jan 12, 2027');
    const tracking = screen.getByRole('region', { name: 'Carrier and tracking' });
    expect(within(tracking).getByText('Carrier').nextElementSibling?.textContent).toBe('Invented Parcel');
    expect(within(tracking).getByText('Tracking number').nextElementSibling?.textContent).toBe('IP-0042-7781');
    const shipping = screen.getByRole('region', { name: 'Shipping and tracing' });
    expect(within(shipping).getByRole('link', { name: 'Trace this order' }).getAttribute('href')).toMatch(/^\/roastery\/orders\/[^/]+\/trace$/);
    expect(
      within(shipping)
        .getByRole('link', { name: /^Open the Pack List for / })
        .getAttribute('href'),
    ).toMatch(/^\/roastery\/days\/\d{4}-\d{2}-\d{2}\?tab=pack$/);
    // An instant, shown in the reader's own time zone.
    expect(within(tracking).getByText('Shipped').nextElementSibling?.textContent).toMatch(/^Dec [23], 2026, \d/);
  });

  it('leaves out carrier and tracking before shipping, and says an unpaid order is not paid', async () => {
    const order = detail({ status: 'pending_payment', paidAt: null, shipDate: null });
    stubFetch(() => jsonResponse(order));
    renderApp(`/roastery/orders/${order.id}`, { session: staff });

    const payment = await screen.findByRole('region', { name: 'Payment' });
    expect(within(payment).getByText(/Not paid yet/)).toBeTruthy();
    expect(screen.queryByRole('region', { name: 'Carrier and tracking' })).toBeNull();
    expect(within(screen.getByRole('region', { name: 'Dates' })).getByText('Ship date').nextElementSibling?.textContent).toBe('Not set');
  });

  it('says so when the order does not exist', async () => {
    stubFetch(() => apiErrorResponse(404, 'not_found', 'Order not found.'));
    renderApp('/roastery/orders/00000000-0000-4000-8000-000000000000', { session: staff });

    expect(await screen.findByRole('heading', { level: 1, name: 'Order not found' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'All orders' }).getAttribute('href')).toBe('/roastery/orders');
  });
});
