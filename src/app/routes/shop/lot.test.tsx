// @vitest-environment happy-dom
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { apiErrorResponse, jsonResponse, makeLotDetail, renderApp, requestedUrls, stubFetch } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('lot page', () => {
  it('reads /api/lots/:code and shows the green coffee descriptors', async () => {
    const fetchMock = stubFetch(() => jsonResponse(makeLotDetail()));
    renderApp('/lots/RD-T01');

    expect(await screen.findByRole('heading', { level: 1, name: 'Test Ridge Washed' })).toBeTruthy();
    expect(requestedUrls(fetchMock)).toEqual(['/api/lots/RD-T01']);

    const descriptors = screen.getByRole('region', { name: 'Green coffee descriptors' });
    const value = (term: string) => within(descriptors).getByText(term).nextElementSibling?.textContent;
    expect(value('Producer')).toBe('Invented Hills Cooperative');
    expect(value('Altitude')).toBe('1,950 m');
    expect(value('Crop year')).toBe('2025');
    expect(value('Moisture')).toBe('10.8%');
    expect(value('Density')).toBe('712 g/L');
    expect(value('Screen size')).toBe('17/18');
    expect(value('Cupping score')).toBe('87.25');
    expect(value('Roast levels that suit it')).toBe('Light, Medium');

    expect(screen.getByText('2.3 kg or more: $22.00 / kg')).toBeTruthy();
    expect(screen.getByRole('region', { name: 'Roast safely' })).toBeTruthy();
    await waitFor(() => expect(document.title).toBe('Test Ridge Washed · Green Lots · Restday'));
  });

  it('says when no lot has that code', async () => {
    stubFetch(() => apiErrorResponse(404, 'lot_not_found', 'No lot with that code.'));
    renderApp('/lots/RD-GONE');

    expect(await screen.findByRole('heading', { level: 1, name: 'Lot not found' })).toBeTruthy();
    expect(screen.getByText(/No green lot has the code RD-GONE/)).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Go to the home page' }).getAttribute('href')).toBe('/');
  });
});
