import { QueryClientProvider } from '@tanstack/react-query';
import { configure, fireEvent, render } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { vi } from 'vitest';
import type { CurrencyCode } from '@shared/domain/money';
import type { User } from '@shared/schemas/auth';
import type { LotDetail, LotSummary } from '@shared/schemas/lots';
import type { Subscription, SubscriptionDelivery } from '@shared/schemas/subscriptions';
import { createAppRoutes } from '@/app/router';
import { getCurrentUserQueryOptions } from '@/features/auth/api/get-current-user';
import { createQueryClient } from '@/lib/query-client';
import { getShopCurrencyQueryOptions } from '@/lib/shop-currency';

// Every page is a lazy module; the first render in a test file waits for Vite to transform it.
configure({ asyncUtilTimeout: 5000 });

type RenderAppOptions = {
  /**
   * Who is signed in: nobody (a visitor) unless given. Every page reads the session, so it starts
   * in the query cache rather than in each test's `fetch` stub; the Roastery needs staff or owner.
   */
  session?: User | null;
  /** The shop's currency, likewise in the cache from the start: US dollars unless given. */
  currency?: CurrencyCode;
};

/** Renders the real route table at `url` in a memory router, with a fresh query client. */
export function renderApp(url: string, { session = null, currency = 'usd' }: RenderAppOptions = {}) {
  const queryClient = createQueryClient();
  // Tests decide each response themselves; automatic retries would only slow them down.
  queryClient.setDefaultOptions({ queries: { ...queryClient.getDefaultOptions().queries, retry: false } });
  queryClient.setQueryData(getCurrentUserQueryOptions().queryKey, session);
  queryClient.setQueryData(getShopCurrencyQueryOptions().queryKey, currency);
  const router = createMemoryRouter(createAppRoutes(queryClient), { initialEntries: [url] });
  const view = render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return { ...view, router, queryClient };
}

/**
 * Types or picks `value` as a browser reports it: an `input` event, then `change`. The client's
 * Preact listens to `input` on text fields where React listened to either.
 */
export function enterValue(field: HTMLElement, value: string) {
  fireEvent.input(field, { target: { value } });
  fireEvent.change(field, { target: { value } });
}

type ApiHandler = (url: URL, init: RequestInit | undefined) => Response | Promise<Response>;

/** Replaces `fetch`, the network boundary, with a handler that answers like the server would. */
export function stubFetch(handler: ApiHandler) {
  const fetchMock = vi.fn((input: RequestInfo | URL, init?: RequestInit) => {
    const href = input instanceof Request ? input.url : String(input);
    return Promise.resolve(handler(new URL(href, 'http://restday.test'), init));
  });
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

export function jsonResponse(body: unknown, status = 200): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

export function apiErrorResponse(status: number, code: string, message: string, fields?: Record<string, string>): Response {
  return jsonResponse({ error: { code, message, ...(fields ? { fields } : {}) } }, status);
}

/** The URLs `fetch` was called with, as path plus query. */
export function requestedUrls(fetchMock: ReturnType<typeof stubFetch>): string[] {
  return fetchMock.mock.calls.map(([input]) => {
    const url = new URL(String(input), 'http://restday.test');
    return `${url.pathname}${url.search}`;
  });
}

/** The JSON bodies and headers of the `method` requests `fetch` sent to `path`. */
export function sentRequests(fetchMock: ReturnType<typeof stubFetch>, method: string, path: string) {
  return fetchMock.mock.calls
    .filter(([input, init]) => (init?.method ?? 'GET') === method && new URL(String(input), 'http://restday.test').pathname === path)
    .map(([, init]) => ({
      body: typeof init?.body === 'string' ? (JSON.parse(init.body) as unknown) : undefined,
      headers: new Headers(init?.headers),
    }));
}

// An invented person for tests.
export function makeUser(overrides: Partial<User> = {}): User {
  return {
    id: '0b7d3c1e-5f2a-4c8e-9a61-3d2f4b8e7c10',
    email: 'ines.marlow@example.test',
    name: 'Ines Marlow',
    role: 'customer',
    ...overrides,
  };
}

// Invented lots for tests; no real farm, producer or importer.
export function makeLot(overrides: Partial<LotSummary> = {}): LotSummary {
  return {
    code: 'RD-T01',
    name: 'Test Ridge Washed',
    origin: 'Ethiopia',
    region: 'Sidama',
    process: 'washed',
    variety: 'Heirloom',
    altitudeM: 1950,
    cropYear: 2025,
    suggestedLevel: 'light',
    tastingNotes: ['bergamot', 'apricot'],
    cuppingScore: 87.25,
    stockGrams: 18_400,
    pricePerKgCents: 2450,
    photoUrl: null,
    ...overrides,
  };
}

export function makeLotDetail(overrides: Partial<LotDetail> = {}): LotDetail {
  const { photoUrl: _photoUrl, ...summary } = makeLot();
  return {
    ...summary,
    producer: 'Invented Hills Cooperative',
    moisturePct: 10.8,
    densityGPerL: 712,
    screenSize: '17/18',
    description: 'A bright, clean lot invented for tests.',
    allowedLevels: ['light', 'medium'],
    priceBreaks: [{ minGrams: 2268, pricePerKgCents: 2200 }],
    photos: [],
    specSheetUrl: null,
    ...overrides,
  };
}

/** An invented delivery of an invented lot, open for changes. */
export function makeSubscriptionDelivery(overrides: Partial<SubscriptionDelivery> = {}): SubscriptionDelivery {
  return {
    roastDate: '2026-12-09',
    shipDate: '2026-12-10',
    readyFrom: '2026-12-14',
    bestBefore: '2027-01-06',
    expectedArrival: '2026-12-15',
    readyOnArrival: true,
    status: 'scheduled',
    locked: false,
    cutoffAt: '2026-12-08T19:00:00Z',
    lotCode: 'RD-T01',
    coffee: 'Test Ridge Washed',
    roastLevel: 'light',
    bagSize: '12oz',
    bagsPerDelivery: 2,
    grind: 'whole-bean',
    brewMethod: 'filter',
    orderId: null,
    paid: false,
    ...overrides,
  };
}

/** An invented active subscription whose next delivery is `makeSubscriptionDelivery()`. */
export function makeSubscription(overrides: Partial<Subscription> = {}): Subscription {
  return {
    id: '5a7c9e1b-3d5f-4a6b-8c9d-0e1f2a3b4c5d',
    status: 'active',
    lotCode: 'RD-T01',
    coffee: 'Test Ridge Washed',
    roastLevel: 'light',
    bagSize: '12oz',
    bagsPerDelivery: 2,
    grind: 'whole-bean',
    brewMethod: 'filter',
    cadenceWeeks: 1,
    pausedUntil: null,
    cancelAtPeriodEnd: false,
    endsOn: null,
    priceCents: 3935,
    currency: 'usd',
    shippingAddress: { name: 'Ines Marlow', line1: '14 Quarry Lane', line2: null, city: 'Ashfield', region: 'OR', postalCode: '97000', country: 'US' },
    nextDelivery: makeSubscriptionDelivery(),
    createdAt: '2026-11-20T16:00:00Z',
    ...overrides,
  };
}
