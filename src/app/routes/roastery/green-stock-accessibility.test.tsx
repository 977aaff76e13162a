// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { OrderDetail, OrderSummary } from '@shared/schemas/orders';
import { axeViolations as violations } from '@/testing/axe';
import { jsonResponse, makeLotDetail, makeUser, renderApp, stubFetch } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const staff = makeUser({ role: 'staff' });

// Invented lots, customers and orders.
const lot = {
  ...makeLotDetail({ photos: ['/api/uploads/5a7c9e1b-3d5f-4a7b-9c1d-3e5f7a9b1c3d'], specSheetUrl: '/api/uploads/6b8d0f2c-4e6a-4b8c-8d2e-4f6a8b0c2d4e' }),
};
const stockItem = {
  code: lot.code,
  name: lot.name,
  isListed: true,
  stockGrams: 4536,
  reorderPointGrams: 9072,
  supplierLeadTimeDays: 14,
  reorderBy: '2026-11-30',
  reorderAlert: true,
  usedGramsInWindow: 28_000,
  averageDailyUseGrams: 1000,
  daysOfCover: 4,
};
const movement = {
  id: 'm1',
  deltaGrams: 9072,
  reason: 'arrival',
  note: 'Two sacks',
  orderId: null,
  batchId: null,
  actorName: 'Oren Vale',
  createdAt: '2026-11-20T10:00:00.000Z',
};
const summary: OrderSummary = {
  id: '6a1f3c5e-7b9d-4e2f-8a4c-6e8f0a2c4e6a',
  kind: 'green',
  status: 'paid',
  placedAt: '2026-11-28T15:30:00.000Z',
  customer: { id: '7b2a4d6f-8c0e-4f3a-9b5d-7f9a1b3d5f7b', name: 'Juno Reed', email: 'juno.reed@example.test' },
  bagCount: 2,
  totalCents: 5980,
  roastDate: '2026-12-01',
  shipDate: '2026-12-02',
};
const order: OrderDetail = {
  ...(({ bagCount: _bags, ...rest }) => rest)(summary),
  items: [
    {
      id: '8c3b5e7a-9d1f-4a4b-8c6e-8a0b2c4e6f8c',
      lotCode: lot.code,
      lotName: lot.name,
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
  refundedCents: 0,
  currency: 'usd',
  shippingAddress: { name: 'Juno Reed', line1: '12 Invented Lane', line2: null, city: 'Fairhaven', region: 'OR', postalCode: '97000', country: 'US' },
  readyFrom: null,
  bestBefore: null,
  expectedArrival: null,
  readyOnArrival: null,
  carrier: 'Invented Parcel',
  trackingNumber: 'IP-0042-7781',
  paidAt: '2026-11-28T15:32:00.000Z',
  shippedAt: '2026-12-02T17:00:00.000Z',
  cancelledAt: null,
};

const week = (start: string, needGrams: number, stockAfterGrams: number) => ({
  start,
  roastGreenGrams: needGrams,
  salesGreenGrams: 0,
  needGrams,
  stockAfterGrams,
});
const planning = {
  from: '2026-12-01',
  weeks: 2,
  salesWindowDays: 28,
  unpickedRotationGreenGrams: [0, 819],
  lots: [
    {
      lotCode: lot.code,
      name: lot.name,
      isListed: true,
      stockGrams: 4536,
      reorderPointGrams: 9072,
      leadTimeDays: 14,
      weeks: [week('2026-12-01', 3274, 1262), week('2026-12-08', 3274, -2012)],
      needGrams: 6548,
      runOutDate: '2026-12-08',
      runOutWeek: '2026-12-08',
      reorderBy: '2026-11-24',
      reorderNow: true,
      reorderAlert: true,
    },
  ],
};

const owner = makeUser({ role: 'owner' });
const today = {
  today: '2026-12-01',
  nextRoastDay: {
    date: '2026-12-02',
    isToday: false,
    bags: 12,
    roastedGrams: 4092,
    greenGrams: 4911,
    batches: 2,
    shortfalls: [{ lotCode: lot.code, greenGrams: 4911, stockGrams: 4536, shortfallGrams: 375 }],
    warnings: 2,
  },
  parcels: { toPack: 3, toShip: 1 },
  stuck: { held: 1, awaitingPayment: 2, awaitingPaymentHours: 24 },
  failedMessages: {
    count: 1,
    items: [{ id: 'e1', template: 'shipped', to: 'juno.reed@example.test', attempts: 8, createdAt: '2026-11-30T10:00:00.000Z', orderId: order.id }],
  },
  reorder: [
    { lotCode: lot.code, name: lot.name, stockGrams: 4536, reorderPointGrams: 9072, runOutDate: '2026-12-08', reorderBy: '2026-11-24', reorderNow: true },
  ],
};
const ledger = {
  currency: 'usd',
  timeZone: 'America/Denver',
  weeks: 2,
  from: '2026-11-23',
  to: '2026-12-06',
  sales: [
    { weekStart: '2026-11-23', greenCents: 4849, roastedCents: 0, subscriptionCents: 8270, totalCents: 13_119, refundsCents: 0, orders: 3 },
    { weekStart: '2026-11-30', greenCents: 14_547, roastedCents: 1800, subscriptionCents: 8270, totalCents: 24_617, refundsCents: 1899, orders: 6 },
  ],
  subscriptions: [
    { weekStart: '2026-11-23', active: 30, started: 2, paused: 1, cancelled: 0, monthlyRecurringCents: 390_000 },
    { weekStart: '2026-11-30', active: 31, started: 1, paused: 0, cancelled: 1, monthlyRecurringCents: 393_000 },
  ],
  green: [
    { weekStart: '2026-11-23', roastedGreenGrams: 20_000, soldGreenGrams: 2724 },
    { weekStart: '2026-11-30', roastedGreenGrams: 18_000, soldGreenGrams: 908 },
  ],
  loss: [
    {
      lotCode: lot.code,
      name: lot.name,
      roastLevel: 'medium',
      batches: 2,
      greenGramsIn: 20_000,
      roastedGramsOut: 17_000,
      lossPct: 15,
      expected: { minPct: 14, maxPct: 16, defaultPct: 15 },
      position: 'within',
    },
  ],
};

function roasteryServer() {
  return stubFetch((url) => {
    if (url.pathname === '/api/roastery/planning') return jsonResponse(planning);
    if (url.pathname === '/api/roastery/today') return jsonResponse(today);
    if (url.pathname === '/api/owner/ledger') return jsonResponse(ledger);
    if (url.pathname === '/api/roastery/green-stock')
      return jsonResponse({
        windowDays: 28,
        items: [stockItem, { ...stockItem, code: 'RD-B', name: 'Hidden', isListed: false, reorderAlert: false, daysOfCover: null }],
      });
    if (url.pathname.endsWith('/stock-movements')) return jsonResponse({ items: [movement] });
    if (url.pathname === `/api/roastery/green-stock/${lot.code}`)
      return jsonResponse({ ...lot, isListed: true, reorderPointGrams: 9072, supplierLeadTimeDays: 14 });
    if (url.pathname === '/api/orders') return jsonResponse({ items: [summary], total: 120, page: 2, pageSize: 50 });
    if (url.pathname === `/api/orders/${order.id}`) return jsonResponse(order);
    return jsonResponse({ items: [] });
  });
}

describe('Roastery pages meet the WCAG A and AA rules axe can check', () => {
  it('Green Stock', async () => {
    roasteryServer();
    renderApp('/roastery/green-stock', { session: staff });
    await screen.findByRole('table', { name: /Green planning/ }, { timeout: 15_000 });
    expect(await violations()).toEqual([]);
  });

  it('Today', async () => {
    roasteryServer();
    renderApp('/roastery', { session: staff });
    await screen.findByRole('heading', { name: 'Next roast day: Wednesday, December 2' }, { timeout: 15_000 });
    expect(await violations()).toEqual([]);
  });

  it('the Ledger, with green planning', async () => {
    roasteryServer();
    renderApp('/roastery/ledger', { session: owner });
    await screen.findByRole('table', { name: 'Sales by week' }, { timeout: 15_000 });
    // The charts' module compiles on first use, slowly on a busy machine.
    await screen.findByRole('table', { name: /Green planning/ }, { timeout: 15_000 });
    expect(await violations()).toEqual([]);
  }, 40_000);

  it('a lot’s page, with its forms, history, photos and spec sheet', async () => {
    roasteryServer();
    renderApp(`/roastery/green-stock/${lot.code}`, { session: staff });
    await screen.findByRole('form', { name: 'Lot descriptors' }, { timeout: 15_000 });
    await screen.findByRole('table', { name: /Stock history/ });
    expect(await violations()).toEqual([]);
  });

  it('the new-lot form showing its errors', async () => {
    roasteryServer();
    renderApp('/roastery/green-stock/new', { session: staff });
    const form = await screen.findByRole('form', { name: 'New lot' }, { timeout: 15_000 });
    fireEvent.click(within(form).getByRole('button', { name: 'Add a quantity break' }));
    fireEvent.click(within(form).getByRole('button', { name: 'Add the lot' }));
    await within(form).findByText('Name is required.');
    expect(await violations()).toEqual([]);
  });

  it('the orders table and an order', async () => {
    roasteryServer();
    const { router } = renderApp('/roastery/orders?page=2', { session: staff });
    await screen.findByRole('table', {}, { timeout: 15_000 });
    expect(await violations()).toEqual([]);

    await router.navigate(`/roastery/orders/${order.id}`);
    await screen.findByRole('region', { name: 'Carrier and tracking' });
    expect(await violations()).toEqual([]);
  });
});
