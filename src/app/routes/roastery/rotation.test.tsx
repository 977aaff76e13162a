// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { RotationDay } from '@shared/schemas/rotation';
import { jsonResponse, makeLot, makeUser, renderApp, sentRequests, stubFetch, enterValue } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const staff = makeUser({ role: 'staff', name: 'Oren Vale', email: 'oren.vale@example.test' });

// Invented roast days and lots.
function rotationServer() {
  const days: RotationDay[] = [
    { roastDate: '2026-12-09', lotCode: null, coffee: null, note: '', subscribers: 7, bags: 9, roastedGrams: 3523 },
    { roastDate: '2026-12-11', lotCode: 'RD-T01', coffee: 'Test Ridge Washed', note: '', subscribers: 4, bags: 4, roastedGrams: 1364 },
  ];
  return stubFetch((url, init) => {
    if (url.pathname === '/api/lots') return jsonResponse({ items: [makeLot(), makeLot({ code: 'RD-T02', name: 'Test Basin Natural', stockGrams: 900 })] });
    if ((init?.method ?? 'GET') === 'PUT') {
      const day = days.find((each) => each.roastDate === url.pathname.split('/').pop()) as RotationDay;
      const body = JSON.parse(String(init?.body)) as { lotCode: string; note: string };
      Object.assign(day, { lotCode: body.lotCode, coffee: 'Test Basin Natural', note: body.note });
      return jsonResponse({
        roastDate: day.roastDate,
        lotCode: body.lotCode,
        coffee: 'Test Basin Natural',
        note: body.note,
        warnings: [{ code: 'short_of_stock', message: 'RD-T02 has 900 g of green coffee; this day’s rotation needs about 4.2 kg.' }],
      });
    }
    return jsonResponse({ days });
  });
}

describe('Roaster’s Rotation (Roastery)', () => {
  it('lists the coming roast days with their rotation subscribers and the pick so far', async () => {
    rotationServer();
    renderApp('/roastery/rotation', { session: staff });

    const days = await screen.findByRole('list', { name: 'Roast days' }, { timeout: 15_000 });
    const first = within(days).getByRole('listitem', { name: 'Wed, Dec 9, 2026' });
    expect(first.textContent).toContain('7 subscribers · 9 bags · 3.5 kg roasted');
    expect(first.textContent).toContain('No lot picked yet.');
    expect(within(days).getByRole('listitem', { name: 'Fri, Dec 11, 2026' }).textContent).toContain('Picked: Test Ridge Washed');
    expect(screen.getByRole('link', { name: 'Rotation' }).getAttribute('aria-current')).toBe('page');
  });

  it('asks for a lot before saving, then saves the pick and shows the server’s warnings', async () => {
    const fetchMock = rotationServer();
    renderApp('/roastery/rotation', { session: staff });

    const day = await screen.findByRole('listitem', { name: 'Wed, Dec 9, 2026' }, { timeout: 15_000 });
    fireEvent.click(within(day).getByRole('button', { name: 'Save the pick' }));
    const error = await within(day).findByText('Choose a lot.');
    expect(within(day).getByLabelText('Lot').getAttribute('aria-describedby')).toBe(error.id);
    expect(sentRequests(fetchMock, 'PUT', '/api/roastery/rotation/2026-12-09')).toHaveLength(0);

    enterValue(within(day).getByLabelText('Lot'), 'RD-T02');
    enterValue(within(day).getByLabelText('Note for the team (optional)'), 'Sweet and heavy for the holidays');
    fireEvent.click(within(day).getByRole('button', { name: 'Save the pick' }));

    expect(await within(day).findByText(/this day’s rotation needs about 4.2 kg/)).toBeTruthy();
    expect(within(day).getByText('Test Basin Natural is the Roaster’s Rotation on Wed, Dec 9, 2026.')).toBeTruthy();
    expect(sentRequests(fetchMock, 'PUT', '/api/roastery/rotation/2026-12-09')[0]?.body).toEqual({
      lotCode: 'RD-T02',
      note: 'Sweet and heavy for the holidays',
    });
    await waitFor(() => expect(within(day).getByText(/Picked:/).textContent).toContain('Test Basin Natural'));
  });
});
