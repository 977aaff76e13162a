// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { addDays, weekdayOf } from '@shared/domain/shop-time';
import { defaultShopSettings } from '@shared/schemas/settings';
import type { CalendarDay, CalendarDayUpdateResponse } from '@shared/schemas/roastery';
import { apiErrorResponse, jsonResponse, makeUser, renderApp, requestedUrls, sentRequests, stubFetch, enterValue } from '@/testing/test-utils';

// The calendar marks the shop's today; these tests read December 2026 from a day before it, so no
// day of it carries that mark whenever they run.
beforeEach(() => {
  vi.useFakeTimers({ toFake: ['Date'] });
  vi.setSystemTime(new Date('2026-11-20T17:00:00Z'));
});

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  vi.useRealTimers();
});

const staff = makeUser({ role: 'staff' });

/** An invented December: roasting on Tuesdays and Thursdays, the 3rd with 10 orders, the 1st already roasted. */
function december(): CalendarDay[] {
  const days: CalendarDay[] = [];
  for (let date = '2026-12-01'; date <= '2026-12-31'; date = addDays(date, 1)) {
    const weekday = weekdayOf(date);
    const open = weekday === 'tue' || weekday === 'thu';
    days.push({
      date,
      weekday,
      open,
      shipOpen: weekday !== 'sat' && weekday !== 'sun' && date !== '2026-12-25',
      shipOverride: null,
      holiday: date === '2026-12-25' ? 'Christmas Day' : null,
      capacityGrams: open ? 48_000 : 0,
      plannedGreenGrams: date === '2026-12-03' ? 18_240 : 0,
      note: date === '2026-12-24' ? 'Holiday (invented)' : null,
      ordersCount: date === '2026-12-03' ? 10 : 0,
      roasted: date === '2026-12-01' ? { batches: 3, greenGrams: 14_200, roastedGrams: 12_070 } : { batches: 0, greenGrams: 0, roastedGrams: 0 },
      overridden: date === '2026-12-24',
    });
  }
  return days.map((day) => (day.date === '2026-12-24' ? { ...day, open: false, capacityGrams: 0 } : day));
}

function calendarServer() {
  const days = december();
  return stubFetch((url, init) => {
    const method = init?.method ?? 'GET';
    if (url.pathname === '/api/roastery/settings') return jsonResponse({ ...defaultShopSettings, timeZone: 'America/Denver' });
    if (url.pathname === '/api/roastery/calendar') {
      const from = url.searchParams.get('from') ?? '';
      const to = url.searchParams.get('to') ?? '';
      return jsonResponse({ days: days.filter((day) => day.date >= from && day.date <= to) });
    }
    const match = /^\/api\/roastery\/calendar\/(.+)$/.exec(url.pathname);
    if (match && method === 'PUT') {
      const body = JSON.parse(String(init?.body)) as { open: boolean; shipOpen: boolean | null; capacityGrams: number | null; note: string };
      const index = days.findIndex((day) => day.date === match[1]);
      const before = days[index] as CalendarDay;
      const after: CalendarDay = {
        ...before,
        open: body.open,
        shipOverride: body.shipOpen,
        shipOpen: body.shipOpen ?? before.shipOpen,
        note: body.note || null,
        overridden: true,
        ordersCount: body.open ? before.ordersCount : 0,
      };
      days[index] = after;
      const answer: CalendarDayUpdateResponse = {
        ...after,
        moved: body.open
          ? []
          : [
              { orderId: '8d4e5f6a-7b8c-4d9e-8f0a-2b3c4d5e6f7a', from: before.date, to: '2026-12-08' },
              { orderId: '9e5f6a7b-8c9d-4e0f-9a1b-3c4d5e6f7a8b', from: before.date, to: '2026-12-08' },
            ],
        movedDeliveries: [],
        shipMoved: [],
      };
      return jsonResponse(answer);
    }
    return apiErrorResponse(404, 'not_found', `No fake for ${method} ${url.pathname}`);
  });
}

describe('Roast Calendar', () => {
  it('shows a month of roast days with planned load against capacity, closures and their notes', async () => {
    const fetchMock = calendarServer();
    renderApp('/roastery/calendar?month=2026-12', { session: staff });

    expect(await screen.findByRole('heading', { level: 2, name: 'December 2026' }, { timeout: 15_000 })).toBeTruthy();
    const grid = await screen.findByRole('table', { name: 'Roast days in the month, Monday first' });
    const third = within(grid).getByText('Thursday, December 3', { selector: 'time > span' }).closest('td') as HTMLElement;
    expect(third.textContent).toContain('Roast day');
    expect(third.textContent).toContain('18.2 kg of 48 kg green');
    expect(third.textContent).toContain('10 orders');
    const holiday = within(grid).getByText('Thursday, December 24', { selector: 'time > span' }).closest('td') as HTMLElement;
    expect(holiday.textContent).toContain('Closed');
    expect(holiday.textContent).toContain('Holiday (invented)');
    // A day with recorded batches shows what it roasted instead of its planned load.
    const roasted = within(grid).getByText('Tuesday, December 1', { selector: 'time > span' }).closest('td') as HTMLElement;
    expect(roasted.textContent).toContain('Roasted 14.2 kg green in 3 batches, 12.1 kg out');
    expect(roasted.textContent).not.toContain('of 48 kg green');
    expect(within(grid).getByRole('link', { name: 'Day Sheet for Thursday, December 3' }).getAttribute('href')).toBe('/roastery/days/2026-12-03');
    expect(requestedUrls(fetchMock)).toContain('/api/roastery/calendar?from=2026-12-01&to=2026-12-31');
  });

  it('moves to the next month in the address', async () => {
    const fetchMock = calendarServer();
    const { router } = renderApp('/roastery/calendar?month=2026-12', { session: staff });

    fireEvent.click(await screen.findByRole('link', { name: 'January 2027' }, { timeout: 15_000 }));
    expect(await screen.findByRole('heading', { level: 2, name: 'January 2027' })).toBeTruthy();
    expect(router.state.location.search).toBe('?month=2027-01');
    await waitFor(() => expect(requestedUrls(fetchMock)).toContain('/api/roastery/calendar?from=2027-01-01&to=2027-01-31'));
  });

  it('asks before closing a day with orders, then shows which orders moved where', async () => {
    const fetchMock = calendarServer();
    renderApp('/roastery/calendar?month=2026-12', { session: staff });

    fireEvent.click(await screen.findByRole('button', { name: 'Change Thursday, December 3' }, { timeout: 15_000 }));
    const editor = await screen.findByRole('region', { name: 'Change Thursday, December 3' });
    fireEvent.click(within(editor).getByLabelText('Closed'));
    enterValue(within(editor).getByLabelText('Note'), 'Burner service (invented)');
    fireEvent.click(within(editor).getByRole('button', { name: 'Save day' }));

    const confirm = await within(editor).findByRole('alertdialog', { name: 'Close roasting on Thursday, December 3?' });
    expect(confirm.textContent).toContain('Its 10 orders');
    expect(confirm.textContent).toContain('e-mail');
    expect(sentRequests(fetchMock, 'PUT', '/api/roastery/calendar/2026-12-03')).toHaveLength(0);
    fireEvent.click(within(confirm).getByRole('button', { name: 'Close the day and move its orders' }));

    expect(await within(editor).findByText(/2 orders and 0 scheduled deliveries moved/)).toBeTruthy();
    expect(within(editor).getAllByText(/Thu, Dec 3 → Tue, Dec 8/)).toHaveLength(2);
    expect(sentRequests(fetchMock, 'PUT', '/api/roastery/calendar/2026-12-03')[0]?.body).toEqual({
      open: false,
      shipOpen: null,
      capacityGrams: null,
      note: 'Burner service (invented)',
    });
  });

  it('sets a day’s capacity without asking, since nothing moves', async () => {
    const fetchMock = calendarServer();
    renderApp('/roastery/calendar?month=2026-12', { session: staff });

    fireEvent.click(await screen.findByRole('button', { name: 'Change Tuesday, December 8' }, { timeout: 15_000 }));
    const editor = await screen.findByRole('region', { name: 'Change Tuesday, December 8' });
    enterValue(within(editor).getByLabelText('Capacity (g of green)'), '30000');
    fireEvent.click(within(editor).getByRole('button', { name: 'Save day' }));

    expect(await within(editor).findByText(/Nothing needed to move/)).toBeTruthy();
    expect(sentRequests(fetchMock, 'PUT', '/api/roastery/calendar/2026-12-08')[0]?.body).toEqual({
      open: true,
      shipOpen: null,
      capacityGrams: 30_000,
      note: '',
    });
  });

  it('shows carrier holidays and closes shipping on a day without closing roasting', async () => {
    const fetchMock = calendarServer();
    renderApp('/roastery/calendar?month=2026-12', { session: staff });

    const grid = await screen.findByRole('table', { name: 'Roast days in the month, Monday first' }, { timeout: 15_000 });
    const christmas = within(grid).getByText('Friday, December 25', { selector: 'time > span' }).closest('td') as HTMLElement;
    expect(christmas.textContent).toContain('Christmas Day');
    expect(christmas.textContent).toContain('No shipping');
    const eighth = within(grid).getByText('Tuesday, December 8', { selector: 'time > span' }).closest('td') as HTMLElement;
    expect(eighth.textContent).toContain('Ships');

    fireEvent.click(within(grid).getByRole('button', { name: 'Change Tuesday, December 8' }));
    const editor = await screen.findByRole('region', { name: 'Change Tuesday, December 8' });
    fireEvent.click(within(editor).getByLabelText('Closed: no parcels go out'));
    fireEvent.click(within(editor).getByRole('button', { name: 'Save day' }));

    // Roasting stays open, so nothing asks first and no roast day moves.
    expect(await within(editor).findByText(/Nothing needed to move/)).toBeTruthy();
    expect(sentRequests(fetchMock, 'PUT', '/api/roastery/calendar/2026-12-08')[0]?.body).toEqual({
      open: true,
      shipOpen: false,
      capacityGrams: null,
      note: '',
    });
  });
});
