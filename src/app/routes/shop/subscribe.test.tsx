// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { SubscriptionPreview } from '@shared/schemas/subscription-preview';
import { jsonResponse, makeLot, makeLotDetail, makeUser, renderApp, requestedUrls, stubFetch, enterValue } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// Invented lots, prices and dates.
const ridge = makeLot();
const basin = makeLot({ code: 'RD-T02', name: 'Test Basin Natural', process: 'natural', suggestedLevel: 'medium' });
const ridgeDetail = makeLotDetail({ allowedLevels: ['light', 'medium'], suggestedLevel: 'light' });

function makePreview(priceCents: number): SubscriptionPreview {
  return {
    priceCents,
    regularPriceCents: priceCents + 180,
    discountPct: 10,
    shippingCents: 695,
    bagPriceCents: { '12oz': 1620, '1lb': 2070, '2lb': 3960 },
    currency: 'usd',
    shipPolicy: 'ready_on_arrival',
    deliveries: [
      {
        roastDate: '2026-12-09',
        shipDate: '2026-12-14',
        readyFrom: '2026-12-14',
        bestBefore: '2027-01-06',
        expectedArrival: '2026-12-17',
        cutoffAt: '2026-12-08T19:00:00Z',
      },
      {
        roastDate: '2026-12-23',
        shipDate: '2026-12-28',
        readyFrom: '2026-12-28',
        bestBefore: '2027-01-20',
        expectedArrival: '2026-12-31',
        cutoffAt: '2026-12-22T19:00:00Z',
      },
      {
        roastDate: '2027-01-06',
        shipDate: '2027-01-11',
        readyFrom: '2027-01-11',
        bestBefore: '2027-02-03',
        expectedArrival: '2027-01-14',
        cutoffAt: '2027-01-05T19:00:00Z',
      },
    ],
  };
}

/** Answers like the server; the preview's price follows the bag size asked for. */
function builderServer() {
  return stubFetch((url) => {
    if (url.pathname === '/api/lots') return jsonResponse({ items: [ridge, basin] });
    if (url.pathname === '/api/lots/RD-T01') return jsonResponse(ridgeDetail);
    if (url.pathname === '/api/subscriptions/preview') return jsonResponse(makePreview(url.searchParams.get('bagSize') === '1lb' ? 2765 : 2315));
    return jsonResponse({ error: { code: 'not_found', message: 'No such thing.' } }, 404);
  });
}

function previewRequests(fetchMock: ReturnType<typeof stubFetch>) {
  return requestedUrls(fetchMock)
    .filter((url) => url.startsWith('/api/subscriptions/preview'))
    .map((url) => new URL(url, 'http://restday.test').searchParams);
}

describe('Roasted to Order builder', () => {
  it('from a lot’s link, offers only the lot’s levels, takes its suggestion, and shows the price and first three deliveries', async () => {
    const fetchMock = builderServer();
    const { router } = renderApp('/subscribe?lot=RD-T01', { session: makeUser() });

    const coffee = await screen.findByRole('group', { name: /^Coffee/ }, { timeout: 15_000 });
    expect(within(coffee).getByRole('radio', { name: /Test Ridge Washed/ })).toHaveProperty('checked', true);
    const levels = screen.getByRole('group', { name: /^Roast level/ });
    await waitFor(() =>
      expect(
        within(levels)
          .getAllByRole('radio')
          .map((radio) => radio.getAttribute('value')),
      ).toEqual(['light', 'medium']),
    );
    expect(within(levels).getByRole('radio', { name: 'Light' })).toHaveProperty('checked', true);

    const sizes = screen.getByRole('group', { name: 'Bag size' });
    expect(within(sizes).getByText(/Net Wt 12 oz \(340 g\)/)).toBeTruthy();
    expect(within(sizes).getByText(/Net Wt 32 oz \(2 lb\) 907 g/)).toBeTruthy(); // ounces first from 1 lb (15 U.S.C. 1453(a)(3)(A))
    expect(screen.getByRole('group', { name: /^Brew method/ }).textContent).toContain('It sets the rest');

    expect(await screen.findByText('$23.15')).toBeTruthy();
    expect(screen.getByText(/10% subscription discount/)).toBeTruthy();
    const first = screen.getByRole('list', { name: 'First three deliveries' });
    expect(within(first).getAllByRole('listitem')).toHaveLength(3);
    expect(within(first).getAllByRole('listitem')[0]?.textContent).toMatch(
      /Roasted.*Wed, Dec 9, 2026.*Ships.*Mon, Dec 14, 2026.*Arrives about.*Thu, Dec 17, 2026.*Ready from.*Mon, Dec 14, 2026.*Best before.*Wed, Jan 6, 2027/,
    );
    expect(screen.getByText(/Ready to brew on arrival: we hold each bag after roasting/)).toBeTruthy();
    await waitFor(() => expect(previewRequests(fetchMock).at(-1)?.get('roastLevel')).toBe('light'));
    expect(previewRequests(fetchMock).at(-1)?.get('lotCode')).toBe('RD-T01');
    await waitFor(() => expect(router.state.location.search).toContain('level=light'));
  });

  it('prices a new bag size at once and keeps every choice in the address', async () => {
    const fetchMock = builderServer();
    const { router } = renderApp('/subscribe', { session: makeUser() });

    await screen.findByText('$23.15', undefined, { timeout: 15_000 });
    fireEvent.click(screen.getByRole('radio', { name: /^1 lb/ }));
    fireEvent.click(within(screen.getByRole('group', { name: /^Brew method/ })).getByRole('radio', { name: /^Espresso/ }));
    fireEvent.click(screen.getByRole('radio', { name: 'Every 3 weeks' }));

    expect(await screen.findByText('$27.65')).toBeTruthy();
    await waitFor(() => expect(previewRequests(fetchMock).at(-1)?.get('cadenceWeeks')).toBe('3'));
    const asked = previewRequests(fetchMock).at(-1);
    expect(asked?.get('bagSize')).toBe('1lb');
    expect(asked?.get('brewMethod')).toBe('espresso');
    expect(asked?.get('lotCode')).toBeNull();
    await waitFor(() => {
      const search = new URLSearchParams(router.state.location.search);
      expect(Object.fromEntries(search)).toEqual({
        lot: 'rotation',
        level: 'medium',
        size: '1lb',
        bags: '1',
        grind: 'whole-bean',
        brew: 'espresso',
        every: '3',
      });
    });
  });

  it('refuses an impossible bag count beside the field, sending nobody onwards', async () => {
    builderServer();
    const { router } = renderApp('/subscribe', { session: makeUser() });

    const bags = await screen.findByLabelText('Bags per delivery', undefined, { timeout: 15_000 });
    enterValue(bags, '12');
    fireEvent.click(screen.getByRole('button', { name: 'Continue to the shipping address' }));

    const error = await screen.findByText('Each delivery brings at most 10 bags.');
    expect(bags.getAttribute('aria-invalid')).toBe('true');
    expect(bags.getAttribute('aria-describedby')).toContain(error.id);
    expect(router.state.location.pathname).toBe('/subscribe');
  });

  it('sends a visitor to sign in and back to the shipping step with the choices in the address', async () => {
    builderServer();
    const { router } = renderApp('/subscribe?lot=RD-T01&level=medium&size=2lb&bags=2&grind=pour-over&brew=filter&every=4');

    await screen.findByText('$23.15', undefined, { timeout: 15_000 });
    expect(screen.getByRole('link', { name: 'Create an account' }).getAttribute('href')).toBe(
      `/create-account?redirectTo=${encodeURIComponent('/subscribe/shipping?lot=RD-T01&level=medium&size=2lb&bags=2&grind=pour-over&brew=filter&every=4')}`,
    );
    fireEvent.click(screen.getByRole('button', { name: 'Sign in to continue' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(new URLSearchParams(router.state.location.search).get('redirectTo')).toBe(
      '/subscribe/shipping?lot=RD-T01&level=medium&size=2lb&bags=2&grind=pour-over&brew=filter&every=4',
    );
  });
  it('shows each bag size’s price, and asks before going on with a grind that does not suit the brew method', async () => {
    builderServer();
    const { router } = renderApp('/subscribe?grind=espresso&brew=filter', { session: makeUser() });

    const sizes = await screen.findByRole('group', { name: 'Bag size' }, { timeout: 15_000 });
    // The preview's per-bag prices after the 10 % discount: $16.20, $20.70, $39.60.
    await waitFor(() => expect(within(sizes).getByText(/\$16\.20 a bag/)).toBeTruthy());
    expect(within(sizes).getByText(/\$39\.60 a bag/)).toBeTruthy();
    expect(screen.getByTestId('builder-action-bar').textContent).toContain('$23.15 each delivery');

    fireEvent.click(screen.getByRole('button', { name: 'Continue to the shipping address' }));
    expect(await screen.findByText(/too fine for filter brewing/)).toBeTruthy();
    expect(router.state.location.pathname).toBe('/subscribe');

    fireEvent.click(screen.getByRole('button', { name: 'Keep this grind and continue' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/subscribe/shipping'));
    expect(new URLSearchParams(router.state.location.search).get('grind')).toBe('espresso');
  });
});
