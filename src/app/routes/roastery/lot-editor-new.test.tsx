// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { LotCreate, LotStaffDetail } from '@shared/schemas/lots';
import { apiErrorResponse, jsonResponse, makeUser, renderApp, requestedUrls, sentRequests, stubFetch, enterValue } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const staff = makeUser({ role: 'staff' });

/** Answers like the server: a created lot comes back in full and appears in Green Stock with no stock. */
function newLotServer(refuse?: Response) {
  const created: LotStaffDetail[] = [];
  const fetchMock = stubFetch((url, init) => {
    const method = init?.method ?? 'GET';
    if (url.pathname === '/api/lots' && method === 'POST') {
      if (refuse) return refuse;
      const input = JSON.parse(String(init?.body)) as LotCreate;
      const lot: LotStaffDetail = { ...input, supplierLeadTimeDays: 14, stockGrams: 0, photos: [], specSheetUrl: null };
      created.push(lot);
      return jsonResponse(lot, 201);
    }
    if (url.pathname === '/api/roastery/green-stock') {
      return jsonResponse({
        windowDays: 28,
        items: created.map((lot) => ({
          code: lot.code,
          name: lot.name,
          isListed: lot.isListed,
          stockGrams: 0,
          reorderPointGrams: lot.reorderPointGrams,
          supplierLeadTimeDays: lot.supplierLeadTimeDays,
          reorderBy: null,
          reorderAlert: false,
          usedGramsInWindow: 0,
          averageDailyUseGrams: 0,
          daysOfCover: null,
        })),
      });
    }
    if (url.pathname.endsWith('/stock-movements')) return jsonResponse({ items: [] });
    return apiErrorResponse(404, 'not_found', 'Nothing here.');
  });
  return fetchMock;
}

async function openForm() {
  renderApp('/roastery/green-stock/new', { session: staff });
  // The first render in a file waits for Vite to transform the page and its many parts.
  return screen.findByRole('form', { name: 'New lot' }, { timeout: 15_000 });
}

const type = (form: HTMLElement, label: string, value: string) => enterValue(within(form).getByLabelText(label), value);

describe('New lot', () => {
  it('shows the shared schema’s reasons on their fields, focuses the first, and sends nothing', async () => {
    const fetchMock = newLotServer();
    const form = await openForm();
    type(form, 'Lot code', 'rd 1');
    type(form, 'Moisture (%)', '10.855');
    fireEvent.click(within(form).getByRole('button', { name: 'Add the lot' }));

    const code = within(form).getByLabelText('Lot code');
    await waitFor(() => expect(code.getAttribute('aria-invalid')).toBe('true'));
    const describedText = (label: string) =>
      (within(form).getByLabelText(label).getAttribute('aria-describedby') ?? '')
        .split(' ')
        .map((id) => document.getElementById(id)?.textContent)
        .join(' | ');
    expect(describedText('Lot code')).toContain('Use 2 to 40 capital letters, digits and hyphens, e.g. WR-26-ETH-01.');
    expect(describedText('Name')).toContain('Name is required.');
    expect(describedText('Altitude (m)')).toContain('Enter whole metres, e.g. 1850.');
    expect(describedText('Moisture (%)')).toContain('Use at most two decimals.');
    expect(describedText('Price per kg ($)')).toContain('Enter dollars and cents, e.g. 24.50.');
    expect(document.activeElement).toBe(code);
    expect(sentRequests(fetchMock, 'POST', '/api/lots')).toHaveLength(0);
  });

  it('sends the lot as the API takes it and opens its page, ready for the first arrival', async () => {
    const fetchMock = newLotServer();
    const form = await openForm();
    type(form, 'Lot code', 'RD-26-INV-07');
    type(form, 'Name', 'Invented Terrace Honey');
    type(form, 'Origin', 'Costa Rica');
    type(form, 'Region', 'West Valley');
    type(form, 'Producer', 'Invented Terrace Mill');
    type(form, 'Variety', 'Caturra');
    type(form, 'Process', 'honey');
    type(form, 'Crop year', '2025');
    type(form, 'Altitude (m)', '1650');
    type(form, 'Moisture (%)', '10.6');
    type(form, 'Cupping score', '86.5');
    type(form, 'Tasting notes', 'panela, red apple, cocoa');
    type(form, 'Description', 'A sweet, round lot invented for tests.');
    type(form, 'Suggested level', 'light');
    type(form, 'Price per kg ($)', '22.40');
    fireEvent.click(within(form).getByRole('button', { name: 'Add a quantity break' }));
    type(form, 'Break 1: from (g)', '2268');
    type(form, 'Break 1: price per kg ($)', '20');
    type(form, 'Reorder point', '10 lb');
    fireEvent.click(within(form).getByRole('button', { name: 'Add the lot' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Invented Terrace Honey' })).toBeTruthy();
    expect(sentRequests(fetchMock, 'POST', '/api/lots').map((request) => request.body)).toEqual([
      {
        code: 'RD-26-INV-07',
        name: 'Invented Terrace Honey',
        origin: 'Costa Rica',
        region: 'West Valley',
        producer: 'Invented Terrace Mill',
        variety: 'Caturra',
        process: 'honey',
        altitudeM: 1650,
        cropYear: 2025,
        moisturePct: 10.6,
        densityGPerL: null,
        screenSize: null,
        cuppingScore: 86.5,
        tastingNotes: ['panela', 'red apple', 'cocoa'],
        description: 'A sweet, round lot invented for tests.',
        suggestedLevel: 'light',
        allowedLevels: ['light', 'medium', 'medium-dark'],
        pricePerKgCents: 2240,
        priceBreaks: [{ minGrams: 2268, pricePerKgCents: 2000 }],
        reorderPointGrams: 4536,
        isListed: true,
      },
    ]);
    const notice = screen.getByText('Lot added with no stock. Record its arrival below to put it in stock.');
    await waitFor(() => expect(notice.closest('[tabindex="-1"]')).toBe(document.activeElement));
    // What the server answered opens the descriptors at once.
    expect(screen.getByRole('form', { name: 'Lot descriptors' })).toBeTruthy();
    expect(requestedUrls(fetchMock)).not.toContain('/api/lots/RD-26-INV-07');
  });

  it('puts a taken code on the code field', async () => {
    newLotServer(apiErrorResponse(409, 'lot_code_taken', 'A lot with code RD-T01 already exists.', { code: 'is already used by another lot' }));
    const form = await openForm();
    for (const [label, value] of [
      ['Lot code', 'RD-T01'],
      ['Name', 'Twice Named'],
      ['Origin', 'Kenya'],
      ['Region', 'Invented Hills'],
      ['Producer', 'Invented Cooperative'],
      ['Variety', 'SL28'],
      ['Crop year', '2025'],
      ['Altitude (m)', '1800'],
      ['Moisture (%)', '10.2'],
      ['Price per kg ($)', '25'],
    ] as const) {
      type(form, label, value);
    }
    fireEvent.click(within(form).getByRole('button', { name: 'Add the lot' }));

    const code = within(form).getByLabelText('Lot code');
    await waitFor(() => expect(code.getAttribute('aria-invalid')).toBe('true'));
    expect(within(form).getByText('Lot code is already used by another lot.')).toBeTruthy();
    expect(document.activeElement).toBe(code);
  });
});
