// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { apiErrorResponse, jsonResponse, makeLot, renderApp, requestedUrls, stubFetch, enterValue } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const ethiopia = makeLot();
const brazil = makeLot({
  code: 'RD-T02',
  name: 'Test Plateau Natural',
  origin: 'Brazil',
  region: 'Sul de Minas',
  process: 'natural',
  variety: 'Yellow Catuai',
  altitudeM: 1150,
  suggestedLevel: 'medium-dark',
  tastingNotes: ['cocoa', 'hazelnut'],
  stockGrams: 0,
  pricePerKgCents: 1890,
});

describe('Green Lots page', () => {
  it('shows a card for each lot from /api/lots with its descriptors, price and stock state', async () => {
    stubFetch(() => jsonResponse({ items: [ethiopia, brazil] }));
    renderApp('/lots');

    const cards = await screen.findAllByTestId('lot-card');
    expect(cards).toHaveLength(2);

    const [first, second] = cards as [HTMLElement, HTMLElement];
    expect(within(first).getByRole('link', { name: 'Test Ridge Washed' }).getAttribute('href')).toBe('/lots/RD-T01');
    expect(within(first).getByText('Ethiopia · Sidama')).toBeTruthy();
    expect(within(first).getByText('Washed')).toBeTruthy();
    expect(within(first).getByText('Heirloom')).toBeTruthy();
    expect(within(first).getByText('1,950 m')).toBeTruthy();
    expect(within(first).getByText('Light')).toBeTruthy();
    expect(within(first).getByText('bergamot')).toBeTruthy();
    expect(within(first).getByText('$24.50 / kg')).toBeTruthy();
    expect(within(first).getByText('In stock · 18.4 kg')).toBeTruthy();

    expect(within(second).getByText('Out of stock')).toBeTruthy();
    expect(within(second).getByText('Medium-dark')).toBeTruthy();
    expect(within(second).queryByText(/In stock/)).toBeNull();

    expect(screen.getByRole('status').textContent).toBe('2 lots');
    await waitFor(() => expect(document.title).toBe('Green Lots · Restday'));
  });

  it("prices lots in the shop's own currency", async () => {
    stubFetch(() => jsonResponse({ items: [makeLot({ pricePerKgCents: 1500 })] }));
    renderApp('/lots', { currency: 'jpy' });

    const [card] = await screen.findAllByTestId('lot-card');
    expect(within(card as HTMLElement).getByText('¥1,500 / kg')).toBeTruthy();
  });

  it('shows a loading skeleton until the lots arrive', async () => {
    let answer: (response: Response) => void = () => undefined;
    stubFetch(() => new Promise<Response>((resolve) => (answer = resolve)));
    renderApp('/lots');

    expect(await screen.findByText('Loading green lots…')).toBeTruthy();
    expect(screen.queryAllByTestId('lot-card')).toHaveLength(0);

    answer(jsonResponse({ items: [ethiopia] }));
    expect(await screen.findAllByTestId('lot-card')).toHaveLength(1);
    expect(screen.queryByText('Loading green lots…')).toBeNull();
  });

  it('sends the filters in the URL to the API and offers to reset them when nothing matches', async () => {
    const fetchMock = stubFetch((url) => jsonResponse({ items: url.searchParams.has('process') ? [] : [ethiopia, brazil] }));
    const { router } = renderApp('/lots?process=honey&inStock=true');

    expect(await screen.findByRole('heading', { name: 'No lots match these filters' })).toBeTruthy();
    expect(requestedUrls(fetchMock)).toContain('/api/lots?process=honey&inStock=true');

    fireEvent.click(screen.getByRole('link', { name: 'Reset filters' }));

    expect(await screen.findAllByTestId('lot-card')).toHaveLength(2);
    expect(router.state.location.search).toBe('');
  });

  it('says so when no lots are listed at all, without a reset link', async () => {
    stubFetch(() => jsonResponse({ items: [] }));
    renderApp('/lots');

    expect(await screen.findByRole('heading', { name: 'No green lots are listed right now' })).toBeTruthy();
    expect(screen.queryByRole('link', { name: 'Reset filters' })).toBeNull();
  });

  it('shows the error from the API and loads the lots when the visitor tries again', async () => {
    let failing = true;
    stubFetch(() => (failing ? apiErrorResponse(503, 'database_unavailable', 'The catalog is resting for a moment.') : jsonResponse({ items: [ethiopia] })));
    renderApp('/lots');

    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('Green Lots could not load')).toBeTruthy();
    expect(within(alert).getByText('The catalog is resting for a moment.')).toBeTruthy();

    failing = false;
    fireEvent.click(within(alert).getByRole('button', { name: 'Try again' }));

    expect(await screen.findAllByTestId('lot-card')).toHaveLength(1);
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('keeps each filter in the URL and asks the API for it', async () => {
    const fetchMock = stubFetch(() => jsonResponse({ items: [ethiopia, brazil] }));
    const { router } = renderApp('/lots');
    await screen.findAllByTestId('lot-card');

    enterValue(screen.getByLabelText('Process'), 'natural');
    await waitFor(() => expect(router.state.location.search).toBe('?process=natural'));

    enterValue(screen.getByLabelText('Suggested roast'), 'medium-dark');
    await waitFor(() => expect(router.state.location.search).toBe('?process=natural&level=medium-dark'));

    enterValue(screen.getByLabelText('Origin'), 'Brazil');
    await waitFor(() => expect(router.state.location.search).toBe('?origin=Brazil&process=natural&level=medium-dark'));
    fireEvent.click(screen.getByLabelText('In stock only'));
    await waitFor(() => expect(router.state.location.search).toBe('?origin=Brazil&process=natural&level=medium-dark&inStock=true'));

    enterValue(screen.getByRole('searchbox', { name: 'Search' }), '  cocoa ');
    fireEvent.submit(screen.getByRole('search'));
    await waitFor(() => expect(router.state.location.search).toBe('?q=cocoa&origin=Brazil&process=natural&level=medium-dark&inStock=true'));

    await waitFor(() => expect(requestedUrls(fetchMock)).toContain('/api/lots?q=cocoa&origin=Brazil&process=natural&level=medium-dark&inStock=true'));

    fireEvent.click(screen.getByLabelText('In stock only'));
    await waitFor(() => expect(router.state.location.search).toBe('?q=cocoa&origin=Brazil&process=natural&level=medium-dark'));
  });

  it('keeps a price range typed per lb in the URL as cents per kg, converted exactly, and shows it back per lb', async () => {
    const fetchMock = stubFetch(() => jsonResponse({ items: [ethiopia] }));
    const { router } = renderApp('/lots');
    await screen.findAllByTestId('lot-card');

    enterValue(screen.getByLabelText('Prices'), 'lb');
    await waitFor(() => expect(router.state.location.search).toBe('?priceUnit=lb'));

    const range = screen.getByRole('form', { name: 'Price range' });
    enterValue(within(range).getByLabelText('Lowest ($ per lb)'), '10');
    enterValue(within(range).getByLabelText('Highest ($ per lb)'), '12.50');
    fireEvent.submit(range);

    // $10/lb = 2204.62 cents/kg, $12.50/lb = 2755.78 cents/kg (1 lb = 453.59237 g, NIST SP 811 App. B):
    // the lowest bound rounds up and the highest down, so no lot outside the typed range gets in.
    await waitFor(() => expect(router.state.location.search).toBe('?minPricePerKgCents=2205&maxPricePerKgCents=2755&priceUnit=lb'));
    await waitFor(() => expect(requestedUrls(fetchMock)).toContain('/api/lots?minPricePerKgCents=2205&maxPricePerKgCents=2755'));
    await waitFor(() => expect((screen.getByLabelText('Lowest ($ per lb)') as HTMLInputElement).value).toBe('10.00'));
    expect((screen.getByLabelText('Highest ($ per lb)') as HTMLInputElement).value).toBe('12.50');

    enterValue(screen.getByLabelText('Prices'), 'kg');
    await waitFor(() => expect((screen.getByLabelText('Lowest ($ per kg)') as HTMLInputElement).value).toBe('22.05'));
    expect(router.state.location.search).toBe('?minPricePerKgCents=2205&maxPricePerKgCents=2755');
  });

  it('says which price bound is wrong and changes nothing when the lowest is above the highest', async () => {
    stubFetch(() => jsonResponse({ items: [ethiopia] }));
    const { router } = renderApp('/lots');
    await screen.findAllByTestId('lot-card');

    const range = screen.getByRole('form', { name: 'Price range' });
    enterValue(within(range).getByLabelText('Lowest ($ per kg)'), '30');
    enterValue(within(range).getByLabelText('Highest ($ per kg)'), '20');
    fireEvent.submit(range);

    const lowest = await screen.findByLabelText('Lowest ($ per kg)');
    expect(lowest.getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByText('The lowest price must not be above the highest.')).toBeTruthy();
    expect(router.state.location.search).toBe('');
  });

  it('keeps the chosen sort in the URL and asks the API for it', async () => {
    const fetchMock = stubFetch(() => jsonResponse({ items: [ethiopia, brazil] }));
    const { router } = renderApp('/lots?process=washed');
    await screen.findAllByTestId('lot-card');

    enterValue(screen.getByLabelText('Sort by'), 'price-asc');
    await waitFor(() => expect(router.state.location.search).toBe('?process=washed&sort=price-asc'));
    await waitFor(() => expect(requestedUrls(fetchMock)).toContain('/api/lots?process=washed&sort=price-asc'));

    enterValue(screen.getByLabelText('Sort by'), 'origin');
    await waitFor(() => expect(router.state.location.search).toBe('?process=washed'));
  });

  it('ignores a filter value the API would refuse', async () => {
    const fetchMock = stubFetch(() => jsonResponse({ items: [ethiopia] }));
    renderApp('/lots?level=charcoal&process=washed');

    await screen.findAllByTestId('lot-card');
    expect(requestedUrls(fetchMock)).toContain('/api/lots?process=washed');
    expect(requestedUrls(fetchMock).some((url) => url.includes('charcoal'))).toBe(false);
  });
});
