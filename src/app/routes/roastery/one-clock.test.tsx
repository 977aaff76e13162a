// @vitest-environment happy-dom
import { cleanup, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Batch, RoastListResponse } from '@shared/schemas/roastery';
import { defaultShopSettings } from '@shared/schemas/settings';
import { jsonResponse, makeLotDetail, makeUser, renderApp, stubFetch } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const staff = makeUser({ role: 'staff' });
const lot = makeLotDetail();
const day = '2026-12-03';
// One moment: 16:03 UTC is 10:03 in the morning in Chicago (UTC−6 in December, CST; IANA tz database),
// whatever zone the reader's browser is in.
const moment = '2026-12-03T16:03:00.000Z';

const roastList: RoastListResponse = {
  date: day,
  day: { open: true, capacityGrams: 48_000 },
  lines: [],
  pull: [],
  totals: { roastedGrams: 0, greenGrams: 0, batches: 0, toRoast: { roastedGrams: 0, greenGrams: 0, batches: 0 } },
  warnings: [],
};

// An invented batch and the stock movement it made, recorded at the same moment.
const batch: Batch = {
  id: '5a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d',
  roastDate: day,
  lotCode: lot.code,
  lotName: lot.name,
  roastLevel: 'medium',
  greenGramsIn: 4_635,
  roastedGramsOut: 3_940,
  totalSeconds: null,
  firstCrackSeconds: null,
  lossPct: 14.99,
  withinExpected: true,
  developmentTimeRatio: null,
  operatorName: 'Oren Vale',
  notes: '',
  createdAt: moment,
};
const movement = { id: 'm1', deltaGrams: -4_635, reason: 'roast', note: '', orderId: null, batchId: batch.id, actorName: 'Oren Vale', createdAt: moment };

const stockItem = {
  code: lot.code,
  name: lot.name,
  isListed: true,
  stockGrams: 13_765,
  reorderPointGrams: 9_072,
  supplierLeadTimeDays: 14,
  reorderBy: null,
  reorderAlert: false,
  usedGramsInWindow: 4_635,
  averageDailyUseGrams: 166,
  daysOfCover: 83,
};

function shopServer() {
  return stubFetch((url) => {
    if (url.pathname === '/api/roastery/settings') return jsonResponse({ ...defaultShopSettings, timeZone: 'America/Chicago' });
    if (url.pathname === `/api/roastery/days/${day}/roast-list`) return jsonResponse(roastList);
    if (url.pathname === `/api/roastery/days/${day}/batches`) return jsonResponse({ items: [batch] });
    if (url.pathname === `/api/roastery/days/${day}/pack-list`) return jsonResponse({ date: day, orders: [] });
    if (url.pathname === '/api/roastery/green-stock') return jsonResponse({ windowDays: 28, items: [stockItem] });
    if (url.pathname.endsWith('/stock-movements')) return jsonResponse({ items: [movement] });
    if (url.pathname === `/api/roastery/green-stock/${lot.code}`)
      return jsonResponse({ ...lot, isListed: true, reorderPointGrams: 9_072, supplierLeadTimeDays: 14 });
    return jsonResponse({ items: [] });
  });
}

describe('one clock on the staff pages', () => {
  it('the Day Sheet and Stock history show the same moment at the same shop time, with the zone named', async () => {
    shopServer();
    renderApp(`/roastery/days/${day}`, { session: staff });
    const batches = await screen.findByRole('table', { name: 'Batches recorded for the day' }, { timeout: 15_000 });
    const daySheetRow = within(batches).getByRole('row', { name: new RegExp(lot.name) });
    await within(daySheetRow).findByText('10:03 AM CST');
    const daySheetTime = '10:03 AM CST';
    cleanup();

    shopServer();
    renderApp(`/roastery/green-stock/${lot.code}`, { session: staff });
    const history = await screen.findByRole('table', { name: /Stock history/ }, { timeout: 15_000 });
    const historyRow = within(history).getAllByRole('row')[1]!;
    const historyCell = await within(historyRow).findByText('Dec 3, 2026, 10:03 AM CST');
    // The same clock time, zone and all: the history only adds the day.
    expect(historyCell.textContent?.endsWith(daySheetTime)).toBe(true);
  }, 40_000);
});
