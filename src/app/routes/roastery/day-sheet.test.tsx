// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { addDays, localDateOf } from '@shared/domain/shop-time';
import type { PackListResponse, PackOrder } from '@shared/schemas/packing';
import type { Batch, BatchCreated, RoastListResponse } from '@shared/schemas/roastery';
import { defaultShopSettings } from '@shared/schemas/settings';
import { axeViolations } from '@/testing/axe';
import { apiErrorResponse, jsonResponse, makeUser, renderApp, sentRequests, stubFetch, enterValue } from '@/testing/test-utils';

beforeEach(() => window.localStorage.clear());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const staff = makeUser({ role: 'staff', name: 'Oren Vale', email: 'oren.vale@example.test' });
const day = '2026-12-03';

// An invented day. The figures follow the hand-worked example: 6 bags of 12 oz (341 g) +
// 4 of 1 lb (454 g) = 3,862 g roasted; with 2 % overage and 15 % loss, green = ceil(3,862 × 1.02 ÷ 0.85) = 4,635 g.
const roastList: RoastListResponse = {
  date: day,
  day: { open: true, capacityGrams: 48_000 },
  lines: [
    {
      lotCode: 'RD-T01',
      lotName: 'Test Ridge Washed',
      roastLevel: 'medium',
      bags: 10,
      roastedGrams: 3_862,
      lossPct: 15,
      lossSource: 'level',
      greenGrams: 4_635,
      batches: [{ greenGrams: 4_635 }],
      recorded: { batches: 0, greenGrams: 0, roastedGrams: 0 },
      toRoast: { roastedGrams: 3_862, greenGrams: 4_635, batches: [{ greenGrams: 4_635 }] },
    },
    {
      lotCode: 'RD-T02',
      lotName: 'Invented Valley Natural',
      roastLevel: 'light',
      bags: 4,
      roastedGrams: 1_816,
      lossPct: 12.84,
      lossSource: 'lot',
      greenGrams: 2_126,
      batches: [{ greenGrams: 2_126 }],
      recorded: { batches: 0, greenGrams: 0, roastedGrams: 0 },
      toRoast: { roastedGrams: 1_816, greenGrams: 2_126, batches: [{ greenGrams: 2_126 }] },
    },
  ],
  pull: [
    { lotCode: 'RD-T01', lotName: 'Test Ridge Washed', greenGrams: 4_635, stockGrams: 18_400, shortfallGrams: 0 },
    { lotCode: 'RD-T02', lotName: 'Invented Valley Natural', greenGrams: 2_126, stockGrams: 1_500, shortfallGrams: 626 },
  ],
  totals: { roastedGrams: 5_678, greenGrams: 6_761, batches: 2, toRoast: { roastedGrams: 5_678, greenGrams: 6_761, batches: 2 } },
  warnings: [
    {
      code: 'below_preferred_load',
      message: 'Test Ridge Washed, medium: 4,635 g is below the preferred 6,000 g load.',
      lotCode: 'RD-T01',
      roastLevel: 'medium',
    },
    { code: 'green_shortfall', message: 'Invented Valley Natural is 626 g short.', lotCode: 'RD-T02' },
  ],
};

/** The same day once the Test Ridge batch is recorded: that line is done, and only Invented Valley is left to pull. */
const roastListAfterBatch: RoastListResponse = {
  ...roastList,
  lines: roastList.lines.map((line) =>
    line.lotCode === 'RD-T01'
      ? { ...line, recorded: { batches: 1, greenGrams: 4_635, roastedGrams: 3_940 }, toRoast: { roastedGrams: 0, greenGrams: 0, batches: [] } }
      : line,
  ),
  pull: roastList.pull.filter((pull) => pull.lotCode !== 'RD-T01'),
  totals: { ...roastList.totals, toRoast: { roastedGrams: 1_816, greenGrams: 2_126, batches: 1 } },
};

const recordedBatch: Batch = {
  id: '5a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d',
  roastDate: day,
  lotCode: 'RD-T01',
  lotName: 'Test Ridge Washed',
  roastLevel: 'medium',
  greenGramsIn: 4_635,
  roastedGramsOut: 3_940,
  totalSeconds: 705,
  firstCrackSeconds: 555,
  lossPct: 14.99,
  withinExpected: true,
  developmentTimeRatio: 21.28,
  operatorName: 'Oren Vale',
  notes: '',
  createdAt: '2026-12-03T15:20:00.000Z',
};

function packOrder(overrides: Partial<PackOrder> = {}): PackOrder {
  return {
    orderId: '6b2c3d4e-5f6a-4b7c-9d8e-0f1a2b3c4d5e',
    customerName: 'Juno Reed',
    kind: 'roasted',
    status: 'roasted',
    shipDate: day,
    packedAt: null,
    shippedAt: null,
    carrier: null,
    trackingNumber: null,
    bags: [
      {
        orderItemId: '7c3d4e5f-6a7b-4c8d-8e9f-1a2b3c4d5e6f',
        bagNumber: 1,
        coffee: 'Test Ridge Washed',
        lotCode: 'RD-T01',
        roastLevel: 'medium',
        grind: 'whole-bean',
        size: '12oz',
        netGrams: 341,
        netLabel: 'Net Wt 12 oz (340 g)',
        roastDate: '2026-12-01',
        readyFrom: '2026-12-03',
        bestBefore: '2026-12-29',
        batchId: null,
      },
    ],
    // 341 + 20 + 180 = 541 g → the 1 kg band (Restday's default bands).
    parcels: [{ parcelNumber: 1, bagNumbers: [1], grams: 541, bandMaxGrams: 1000, cents: 895 }],
    parcelNote: null,
    ...overrides,
  };
}

/** A small in-memory Roastery server for one day. */
function daySheetServer({ batchAnswer, date = day }: { batchAnswer?: () => Response; date?: string } = {}) {
  const batches: Batch[] = [];
  let order = packOrder();
  return stubFetch((url, init) => {
    const method = init?.method ?? 'GET';
    const path = url.pathname;
    if (path === '/api/roastery/settings') {
      // Invented carriers on reserved example domains.
      return jsonResponse({
        ...defaultShopSettings,
        timeZone: 'America/Denver',
        carriers: [
          { name: 'Kestrel Post', trackingUrlTemplate: 'https://track.example.com/{tracking}' },
          { name: 'Larkspur Freight', trackingUrlTemplate: 'https://larkspur.example.net/find/{tracking}' },
        ],
      });
    }
    if (path === `/api/roastery/days/${date}/roast-list`) return jsonResponse({ ...(batches.length > 0 ? roastListAfterBatch : roastList), date });
    if (path === `/api/roastery/days/${date}/batches`) return jsonResponse({ items: batches });
    if (path === `/api/roastery/days/${date}/pack-list`) return jsonResponse({ date, orders: [order] } satisfies PackListResponse);
    if (path === '/api/roastery/batches' && method === 'POST') {
      if (batchAnswer) return batchAnswer();
      batches.push(recordedBatch);
      const created: BatchCreated = {
        id: recordedBatch.id,
        lossPct: 14.99,
        withinExpected: true,
        lossPosition: 'within',
        expectedLossPct: { min: 14, max: 16 },
        developmentSeconds: 150,
        developmentTimeRatio: 21.28,
        lossSource: 'level',
        plannedLossPct: 15,
        stockGrams: 13_765,
      };
      return jsonResponse(created, 201);
    }
    if (path === `/api/orders/${order.orderId}/pack` && method === 'POST') {
      order = packOrder({ status: 'packed', packedAt: '2026-12-03T16:00:00.000Z', bags: order.bags.map((bag) => ({ ...bag, batchId: recordedBatch.id })) });
      return jsonResponse(order);
    }
    if (path === `/api/orders/${order.orderId}/ship` && method === 'POST') {
      const body = JSON.parse(String(init?.body)) as { carrier: string; trackingNumber: string };
      order = { ...order, status: 'shipped', shippedAt: '2026-12-03T17:00:00.000Z', ...body };
      return jsonResponse(order);
    }
    return apiErrorResponse(404, 'not_found', `No fake for ${method} ${path}`);
  });
}

describe('Day Sheet → Roast List', () => {
  it('shows each line with its loss source, batches, the pull list with shortfalls, totals, warnings and downloads', async () => {
    daySheetServer();
    renderApp(`/roastery/days/${day}`, { session: staff });

    // The first render in the file waits for the lazy route modules to compile.
    expect(await screen.findByRole('heading', { level: 1, name: 'Thursday, December 3, 2026' }, { timeout: 15_000 })).toBeTruthy();
    const tab = screen.getByRole('tab', { name: /^Roast List/ });
    expect(tab.getAttribute('aria-selected')).toBe('true');
    const panel = screen.getByRole('tabpanel', { name: /^Roast List/ });

    const lines = await within(panel).findByRole('region', { name: 'By lot and roast level' });
    const ridge = within(lines).getByRole('row', { name: /Test Ridge Washed/ });
    expect(ridge.textContent).toContain('3,862 g');
    expect(ridge.textContent).toContain('15.0 %');
    expect(ridge.textContent).toContain('level default');
    expect(ridge.textContent).toContain('4,635 g');
    expect(ridge.textContent).toContain('1 × 4,635 g');
    expect(within(lines).getByRole('row', { name: /Invented Valley Natural/ }).textContent).toContain('this lot’s batches');

    const pull = within(panel).getByRole('region', { name: 'Pull list' });
    expect(within(pull).getByRole('row', { name: /Invented Valley Natural/ }).textContent).toContain('626 g');
    expect(within(pull).getByRole('row', { name: /Test Ridge Washed/ }).textContent).toContain('None');

    const warnings = within(panel).getByRole('region', { name: 'Warnings' });
    expect(within(warnings).getAllByRole('listitem')).toHaveLength(2);
    expect(within(panel).getByText('6,761 g')).toBeTruthy();

    expect(within(panel).getByRole('link', { name: 'Roast List (CSV)' }).getAttribute('href')).toBe(`/api/roastery/days/${day}/roast-list.csv`);
    expect(within(panel).getByRole('link', { name: 'Roast List (PDF, A4)' }).getAttribute('href')).toBe(`/api/roastery/days/${day}/roast-list.pdf?paper=a4`);
    expect(within(panel).getByText('No batches recorded for this day yet.')).toBeTruthy();
  });

  it('records a batch with live loss and development time ratio, then shows the server’s verdict and the batch', async () => {
    const fetchMock = daySheetServer();
    renderApp(`/roastery/days/${day}`, { session: staff });

    const record = await screen.findByRole('button', { name: 'Record batch of Test Ridge Washed, Medium' });
    fireEvent.click(record);
    expect(record.getAttribute('aria-expanded')).toBe('true');
    const form = screen.getByRole('form', { name: 'Record a batch of Test Ridge Washed, Medium' });
    // The planned load is offered as the green weight.
    expect((within(form).getByLabelText('Green in (g)') as HTMLInputElement).value).toBe('4635');
    enterValue(within(form).getByLabelText('Roasted out (g)'), '3940');
    enterValue(within(form).getByLabelText(/Total time/), '11:45');
    enterValue(within(form).getByLabelText(/First crack at/), '9:15');

    // Loss = (4,635 − 3,940) ÷ 4,635 = 14.99 %; DTR = (705 − 555) ÷ 705 = 21.28 % (S. Rao, development time ratio).
    await waitFor(() => expect(within(form).getByRole('status').textContent).toContain('Loss 14.99 %'));
    expect(within(form).getByRole('status').textContent).toContain('development time ratio 21.28 %');

    fireEvent.click(within(form).getByRole('button', { name: 'Save batch' }));
    // Saved, the form closes at once (no second entry of the same numbers one click away) and the verdict stays.
    expect(await screen.findByText(/Batch recorded\. Loss 14\.99 % is within the expected 14\.0 %–16\.0 % for Medium\./)).toBeTruthy();
    expect(screen.queryByRole('form', { name: 'Record a batch of Test Ridge Washed, Medium' })).toBeNull();
    expect(record.getAttribute('aria-expanded')).toBe('false');
    await waitFor(() => expect(document.activeElement).toBe(record));
    expect(sentRequests(fetchMock, 'POST', '/api/roastery/batches')).toHaveLength(1);
    expect(sentRequests(fetchMock, 'POST', '/api/roastery/batches')[0]?.body).toEqual({
      roastDate: day,
      lotCode: 'RD-T01',
      roastLevel: 'medium',
      greenGramsIn: 4635,
      roastedGramsOut: 3940,
      totalSeconds: 705,
      firstCrackSeconds: 555,
    });
    expect(screen.getByRole('link', { name: 'Trace this batch' }).getAttribute('href')).toBe(`/roastery/batches/${recordedBatch.id}`);

    // The pull list now shows only what is still to pull.
    const pull = screen.getByRole('region', { name: 'Pull list' });
    await waitFor(() => expect(within(pull).queryByRole('row', { name: /Test Ridge Washed/ })).toBeNull());
    expect(within(pull).getByRole('row', { name: /Invented Valley Natural/ }).textContent).toContain('2,126 g');
    expect(await axeViolations()).toEqual([]);

    const recorded = await screen.findByRole('table', { name: 'Batches recorded for the day' });
    const row = within(recorded).getByRole('row', { name: /Test Ridge Washed/ });
    expect(row.textContent).toContain('Within expected');
    expect(row.textContent).toContain('11:45 total');
    // Recorded at 15:20 UTC: 8:20 in the morning in Denver (UTC−7 in December, MST; IANA tz database).
    await waitFor(() => expect(row.textContent).toContain('8:20 AM MST'));
  });

  it('asks before recording a batch for a roast day still ahead, and records nothing when told to go back', async () => {
    const later = addDays(localDateOf(new Date(), 'America/Denver'), 7);
    const fetchMock = daySheetServer({ date: later });
    renderApp(`/roastery/days/${later}`, { session: staff });

    fireEvent.click(await screen.findByRole('button', { name: 'Record batch of Test Ridge Washed, Medium' }));
    const form = screen.getByRole('form', { name: 'Record a batch of Test Ridge Washed, Medium' });
    enterValue(within(form).getByLabelText('Roasted out (g)'), '3940');
    fireEvent.click(within(form).getByRole('button', { name: 'Save batch' }));

    const dialog = await screen.findByRole('dialog', { name: /^Record this batch for / });
    expect(dialog.textContent).toContain('That roast day is still ahead');
    expect(await axeViolations()).toEqual([]);
    fireEvent.click(within(dialog).getByRole('button', { name: 'Go back' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(sentRequests(fetchMock, 'POST', '/api/roastery/batches')).toHaveLength(0);

    fireEvent.click(within(form).getByRole('button', { name: 'Save batch' }));
    fireEvent.click(within(await screen.findByRole('dialog')).getByRole('button', { name: 'Record it for that day' }));
    expect(await screen.findByText(/Batch recorded\./)).toBeTruthy();
    expect(sentRequests(fetchMock, 'POST', '/api/roastery/batches')[0]?.body).toMatchObject({ roastDate: later, roastedGramsOut: 3940 });
  });

  it('prints a column to write each batch’s actual weights by hand', async () => {
    daySheetServer();
    renderApp(`/roastery/days/${day}`, { session: staff });

    const lines = await screen.findByRole('region', { name: 'By lot and roast level' });
    const writeIn = within(lines).getByRole('columnheader', { name: 'Actual weights, written in by hand' });
    // Shown on paper only.
    expect(writeIn.className).toContain('hidden');
    expect(writeIn.className).toContain('print:table-cell');
    expect(within(lines).getByRole('row', { name: /Test Ridge Washed/ }).textContent).toContain('in ___');
  });

  it('refuses a roasted weight above the green before sending anything, and shows a server refusal on its field', async () => {
    const fetchMock = daySheetServer({
      batchAnswer: () => apiErrorResponse(409, 'insufficient_stock', 'Not enough green in stock.', { greenGramsIn: 'Only 1,500 g of RD-T01 is in stock.' }),
    });
    renderApp(`/roastery/days/${day}`, { session: staff });

    fireEvent.click(await screen.findByRole('button', { name: 'Record batch of Test Ridge Washed, Medium' }));
    const form = screen.getByRole('form', { name: 'Record a batch of Test Ridge Washed, Medium' });
    const roasted = within(form).getByLabelText('Roasted out (g)');
    enterValue(roasted, '5000');
    fireEvent.click(within(form).getByRole('button', { name: 'Save batch' }));
    await waitFor(() => expect(roasted.getAttribute('aria-invalid')).toBe('true'));
    expect(sentRequests(fetchMock, 'POST', '/api/roastery/batches')).toHaveLength(0);

    enterValue(roasted, '3940');
    fireEvent.click(within(form).getByRole('button', { name: 'Save batch' }));
    const green = within(form).getByLabelText('Green in (g)');
    await waitFor(() => expect(green.getAttribute('aria-invalid')).toBe('true'));
    expect(within(form).getByText('Only 1,500 g of RD-T01 is in stock.')).toBeTruthy();
  });

  it('shows the roasting cautions open until read, then folded', async () => {
    daySheetServer();
    const first = renderApp(`/roastery/days/${day}`, { session: staff });
    const summary = await screen.findByText('Safety before you start the roaster');
    const details = summary.closest('details') as HTMLDetailsElement;
    expect(details.open).toBe(true);
    expect(within(details).getByText(/Chaff fires\./)).toBeTruthy();
    expect(within(details).getByText(/carbon monoxide/)).toBeTruthy();
    expect(within(details).getAllByText(/licensed installers/).length).toBeGreaterThan(0);
    fireEvent.click(within(details).getByRole('button', { name: 'I have read these' }));
    await waitFor(() => expect(details.open).toBe(false));
    first.unmount();

    renderApp(`/roastery/days/${day}`, { session: staff });
    const again = (await screen.findByText('Safety before you start the roaster')).closest('details') as HTMLDetailsElement;
    expect(again.open).toBe(false);
  });
});

describe('Day Sheet tabs and Pack List', () => {
  it('moves between tabs with the arrow keys and keeps the tab in the address', async () => {
    daySheetServer();
    const { router } = renderApp(`/roastery/days/${day}`, { session: staff });

    const roastTab = await screen.findByRole('tab', { name: /^Roast List/ });
    expect(roastTab.getAttribute('tabindex')).toBe('0');
    expect(screen.getByRole('tab', { name: /^Pack List/ }).getAttribute('tabindex')).toBe('-1');
    fireEvent.keyDown(roastTab, { key: 'ArrowRight' });

    const packTab = screen.getByRole('tab', { name: /^Pack List/ });
    await waitFor(() => expect(packTab.getAttribute('aria-selected')).toBe('true'));
    expect(document.activeElement).toBe(packTab);
    expect(router.state.location.search).toBe('?tab=pack');
    expect(await screen.findByRole('list', { name: 'Orders to pack' })).toBeTruthy();
  });

  it('marks an order packed, then shipped with carrier and tracking number', async () => {
    const fetchMock = daySheetServer();
    renderApp(`/roastery/days/${day}?tab=pack`, { session: staff });

    const order = await screen.findByRole('listitem', { name: /Juno Reed/ });
    expect(within(order).getByText('Roasted', { selector: 'span' })).toBeTruthy();
    expect(within(order).getByText('Net Wt 12 oz (340 g)')).toBeTruthy();
    expect(within(order).queryByRole('button', { name: 'Mark shipped' })).toBeNull();
    expect(screen.getByRole('link', { name: 'Labels (PDF)' }).getAttribute('href')).toBe(`/api/roastery/days/${day}/labels.pdf`);
    expect(within(order).getByRole('link', { name: 'Trace this order for Juno Reed' }).getAttribute('href')).toBe(
      '/roastery/orders/6b2c3d4e-5f6a-4b7c-9d8e-0f1a2b3c4d5e/trace',
    );

    fireEvent.click(within(order).getByRole('button', { name: 'Mark packed' }));
    const packQuestion = await screen.findByRole('dialog', { name: 'Mark Juno Reed’s order packed?' });
    fireEvent.click(within(packQuestion).getByRole('button', { name: 'Mark packed' }));
    await waitFor(() => expect(within(order).getByText('Packed', { selector: 'span' })).toBeTruthy());
    expect(
      within(order)
        .getByRole('link', { name: /Trace the batch of bag 1/ })
        .getAttribute('href'),
    ).toBe(`/roastery/batches/${recordedBatch.id}`);

    fireEvent.click(within(order).getByRole('button', { name: 'Mark shipped' }));
    const dialog = await screen.findByRole('dialog', { name: 'Mark Juno Reed’s order shipped' });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Mark shipped' }));
    expect(await within(dialog).findByText('Name the carrier.')).toBeTruthy();
    // The shop's carriers are offered as the packer types.
    const carrierInput = within(dialog).getByLabelText('Carrier');
    const offered = document.getElementById(carrierInput.getAttribute('list') ?? '');
    expect([...(offered?.querySelectorAll('option') ?? [])].map((option) => option.value)).toEqual(['Kestrel Post', 'Larkspur Freight']);
    enterValue(carrierInput, 'Kestrel Post');
    enterValue(within(dialog).getByLabelText('Tracking number'), 'wr 1234 5678');
    fireEvent.click(within(dialog).getByRole('button', { name: 'Mark shipped' }));

    expect(await screen.findByText(/order is marked shipped \(Kestrel Post WR12345678\)/)).toBeTruthy();
    expect(sentRequests(fetchMock, 'POST', '/api/orders/6b2c3d4e-5f6a-4b7c-9d8e-0f1a2b3c4d5e/ship')[0]?.body).toEqual({
      carrier: 'Kestrel Post',
      trackingNumber: 'WR12345678',
    });
    // Shipped orders leave the list of those still to ship; the Shipped filter shows them.
    await waitFor(() => expect(screen.queryByRole('listitem', { name: /Juno Reed/ })).toBeNull());
    fireEvent.click(screen.getByRole('radio', { name: /^Shipped \(1\)$/ }));
    const shipped = await screen.findByRole('listitem', { name: /Juno Reed/ });
    expect(within(shipped).getByText('Shipped', { selector: 'span' })).toBeTruthy();
  });
});

describe('Reaching the Day Sheet', () => {
  /** Today as the server reports it, with the next roast day `daysAhead` after the shop's today (none when null). */
  function todayServer(daysAhead: number | null) {
    // UTC+14 all year (IANA tz database): a day no browser in a test run is likely to share with UTC.
    const today = localDateOf(new Date(), 'Pacific/Kiritimati');
    const roastDay = daysAhead === null ? null : addDays(today, daysAhead);
    const fetchMock = stubFetch((url) => {
      if (url.pathname === '/api/roastery/settings') return jsonResponse({ ...defaultShopSettings, timeZone: 'Pacific/Kiritimati' });
      if (url.pathname === '/api/roastery/today') {
        return jsonResponse({
          today,
          nextRoastDay: roastDay && {
            date: roastDay,
            isToday: daysAhead === 0,
            bags: 0,
            roastedGrams: 0,
            greenGrams: 0,
            batches: 0,
            shortfalls: [],
            warnings: 0,
          },
          parcels: { toPack: 0, toShip: 0 },
          stuck: { held: 0, awaitingPayment: 0, awaitingPaymentHours: 24 },
          failedMessages: { count: 0, items: [] },
          reorder: [],
        });
      }
      if (url.pathname.endsWith('/batches')) return jsonResponse({ items: [] });
      if (url.pathname.endsWith('/pack-list')) return jsonResponse({ date: url.pathname.split('/')[4] ?? '', orders: [] });
      if (url.pathname.endsWith('/roast-list')) {
        const date = url.pathname.split('/')[4] ?? '';
        return jsonResponse({ ...roastList, date, lines: [], pull: [], warnings: [] });
      }
      return apiErrorResponse(404, 'not_found', 'No fake');
    });
    return { fetchMock, today, roastDay };
  }

  it('opens the next roast day’s sheet from the navigation and from Today when today does not roast', async () => {
    const { fetchMock, roastDay } = todayServer(2);
    const { router } = renderApp('/roastery', { session: staff });

    const nav = await screen.findByRole('navigation', { name: 'Roastery' }, { timeout: 15_000 });
    expect((await screen.findByRole('link', { name: 'Open the Roast List' })).getAttribute('href')).toBe(`/roastery/days/${roastDay}`);
    fireEvent.click(within(nav).getByRole('link', { name: 'Day Sheet' }));
    await waitFor(() => expect(router.state.location.pathname).toBe(`/roastery/days/${roastDay}`));
    expect(await screen.findByText('Nothing to roast')).toBeTruthy();
    expect(sentRequests(fetchMock, 'GET', `/api/roastery/days/${roastDay}/roast-list`).length).toBeGreaterThan(0);
    expect(within(nav).getByRole('link', { name: 'Day Sheet' }).getAttribute('aria-current')).toBe('page');
    // Each tab shows its count once its list has loaded.
    expect(await screen.findByRole('tab', { name: /^Roast List\W+0 bags$/ })).toBeTruthy();
    expect(await screen.findByRole('tab', { name: /^Pack List\W+0 orders$/ })).toBeTruthy();
  });

  it('opens today’s sheet in the shop’s time zone when no roast day lies ahead', async () => {
    const { today } = todayServer(null);
    const { router } = renderApp('/roastery/days', { session: staff });
    await waitFor(() => expect(router.state.location.pathname).toBe(`/roastery/days/${today}`), { timeout: 15_000 });
  });

  it('answers an address that is not a date with the not-found page', async () => {
    daySheetServer();
    renderApp('/roastery/days/someday', { session: staff });
    expect(await screen.findByRole('heading', { level: 1, name: 'Page not found' }, { timeout: 15_000 })).toBeTruthy();
  });
});
