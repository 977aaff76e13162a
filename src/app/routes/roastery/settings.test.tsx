// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { defaultShopSettings, type ShopSettings } from '@shared/schemas/settings';
import { axeViolations } from '@/testing/axe';
import { apiErrorResponse, jsonResponse, makeUser, renderApp, sentRequests, stubFetch, enterValue } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const owner = makeUser({ role: 'owner', name: 'Wren Calloway', email: 'wren@example.test' });
// An invented place of business.
const placeOfBusiness = { line1: '9 Millrace Yard', line2: null, city: 'Greyhaven', region: 'WA', postalCode: '98201', country: 'US' };
const stored: ShopSettings = { ...defaultShopSettings, timeZone: 'America/Denver', placeOfBusiness };

function settingsServer(put: (body: ShopSettings) => Response = (body) => jsonResponse(body), current: ShopSettings = stored) {
  return stubFetch((url, init) => {
    if (url.pathname !== '/api/roastery/settings') return apiErrorResponse(404, 'not_found', 'No fake');
    if ((init?.method ?? 'GET') === 'PUT') return put(JSON.parse(String(init?.body)) as ShopSettings);
    return jsonResponse(current);
  });
}

describe('Shop settings', () => {
  it('asks for the place of business the labels print before it saves, then sends it with the rest', async () => {
    const fetchMock = settingsServer(undefined, { ...stored, placeOfBusiness: null });
    renderApp('/roastery/settings', { session: owner });

    const place = await screen.findByRole('group', { name: 'Place of business' }, { timeout: 15_000 });
    const street = within(place).getByLabelText('Street address');
    expect((street as HTMLInputElement).value).toBe('');
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await waitFor(() => expect(street.getAttribute('aria-invalid')).toBe('true'));
    expect(within(place).getByText('Enter the street address.')).toBeTruthy();
    expect(await axeViolations()).toEqual([]);
    expect(sentRequests(fetchMock, 'PUT', '/api/roastery/settings')).toHaveLength(0);

    enterValue(street, placeOfBusiness.line1);
    enterValue(within(place).getByLabelText('City or town'), placeOfBusiness.city);
    enterValue(within(place).getByLabelText('State or region'), placeOfBusiness.region);
    enterValue(within(place).getByLabelText('Postal code'), placeOfBusiness.postalCode);
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));

    expect(await screen.findByText('Settings saved.')).toBeTruthy();
    const body = sentRequests(fetchMock, 'PUT', '/api/roastery/settings')[0]?.body as ShopSettings;
    expect(body.placeOfBusiness).toEqual(placeOfBusiness);
  });

  it('shows every setting and saves the whole set as the server’s schema expects', async () => {
    const fetchMock = settingsServer();
    renderApp('/roastery/settings', { session: owner });

    const timeZone = await screen.findByLabelText('Time zone', {}, { timeout: 15_000 });
    await waitFor(() => expect((timeZone as HTMLSelectElement).value).toBe('America/Denver'));
    const roastDays = screen.getByRole('group', { name: 'Roast days' });
    expect((within(roastDays).getByLabelText('Wednesday') as HTMLInputElement).checked).toBe(true);
    expect((screen.getByLabelText('Roasted 12 oz bag') as HTMLInputElement).value).toBe('18.00');
    expect(screen.getByRole('list', { name: 'Weight bands' }).children).toHaveLength(5);

    fireEvent.click(within(roastDays).getByLabelText('Saturday'));
    enterValue(screen.getByLabelText('Overage (%)'), '3');
    const medium = screen.getByRole('group', { name: 'Medium' });
    enterValue(within(medium).getByLabelText('Planned loss (%)'), '15.5');
    enterValue(screen.getByLabelText('Roasted 12 oz bag'), '19.50');
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));

    expect(await screen.findByText('Settings saved.')).toBeTruthy();
    const body = sentRequests(fetchMock, 'PUT', '/api/roastery/settings')[0]?.body as ShopSettings;
    expect(body.roastWeekdays).toEqual(['mon', 'wed', 'fri', 'sat']);
    expect(body.overagePct).toBe(3);
    expect(body.lossModel.medium).toEqual({ minPct: 14, maxPct: 16, defaultPct: 15.5 });
    expect(body.roastedBagPriceCents['12oz']).toBe(1950);
    expect(body.shipping.bands).toEqual(stored.shipping.bands);
    // Left as stored: ready on arrival, the weekend hold on, light rests a day longer.
    expect(body.shipPolicy).toBe('ready_on_arrival');
    expect(body.holdOverWeekend).toBe(true);
    expect(body.restAdjustDays).toEqual({ light: 1, medium: 0, 'medium-dark': -1, dark: -1, french: -1 });
  });

  it('lets the owner ship after the degassing hold and let parcels travel over a weekend', async () => {
    const fetchMock = settingsServer();
    renderApp('/roastery/settings', { session: owner });

    const when = await screen.findByRole('group', { name: 'When roasted coffee ships' }, { timeout: 15_000 });
    expect((within(when).getByLabelText('Ship so it is ready to brew on arrival') as HTMLInputElement).checked).toBe(true);
    fireEvent.click(within(when).getByLabelText('Ship after the degassing hold, and tell the customer the ready-from date'));
    const weekendHold = screen.getByLabelText(/No parcel sits over a weekend/) as HTMLInputElement;
    expect(weekendHold.checked).toBe(true);
    fireEvent.click(weekendHold);
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));

    expect(await screen.findByText('Settings saved.')).toBeTruthy();
    const body = sentRequests(fetchMock, 'PUT', '/api/roastery/settings')[0]?.body as ShopSettings;
    expect(body.shipPolicy).toBe('after_degassing');
    expect(body.holdOverWeekend).toBe(false);
  });

  it('picks the time zone from the list of zones, offers no three-decimal currency, and saves a carrier with its tracking page', async () => {
    const fetchMock = settingsServer();
    renderApp('/roastery/settings', { session: owner });

    const timeZone = (await screen.findByLabelText('Time zone', {}, { timeout: 15_000 })) as HTMLSelectElement;
    expect(timeZone.tagName).toBe('SELECT');
    expect([...timeZone.options].map((option) => option.value)).toContain('Europe/Lisbon');
    enterValue(timeZone, 'Europe/Lisbon');
    const currencyCodes = [...(screen.getByLabelText('Currency') as HTMLSelectElement).options].map((option) => option.value);
    expect(currencyCodes).toContain('jpy');
    expect(currencyCodes).not.toContain('kwd');

    fireEvent.click(screen.getByRole('button', { name: 'Add a carrier' }));
    enterValue(await screen.findByLabelText('Carrier 1: name'), 'Kestrel Post');
    const page = screen.getByLabelText('Carrier 1: tracking page');
    enterValue(page, 'https://track.example.com/parcel/');
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await waitFor(() => expect(page.getAttribute('aria-invalid')).toBe('true'));
    expect(sentRequests(fetchMock, 'PUT', '/api/roastery/settings')).toHaveLength(0);

    enterValue(page, 'https://track.example.com/parcel/{tracking}');
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    expect(await screen.findByText('Settings saved.')).toBeTruthy();
    const body = sentRequests(fetchMock, 'PUT', '/api/roastery/settings')[0]?.body as ShopSettings;
    expect(body.timeZone).toBe('Europe/Lisbon');
    expect(body.carriers).toEqual([{ name: 'Kestrel Post', trackingUrlTemplate: 'https://track.example.com/parcel/{tracking}' }]);
  });

  it('checks the form with the shared schema before sending', async () => {
    const fetchMock = settingsServer();
    renderApp('/roastery/settings', { session: owner });

    const medium = await screen.findByRole('group', { name: 'Medium' }, { timeout: 15_000 });
    const planned = within(medium).getByLabelText('Planned loss (%)');
    enterValue(planned, '18');
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));

    await waitFor(() => expect(planned.getAttribute('aria-invalid')).toBe('true'));
    expect(within(medium).getByText('The default must lie between the minimum and the maximum.')).toBeTruthy();
    expect(sentRequests(fetchMock, 'PUT', '/api/roastery/settings')).toHaveLength(0);
  });

  it('puts the server’s reasons on their fields', async () => {
    settingsServer(() =>
      apiErrorResponse(400, 'validation_failed', 'Check the highlighted fields.', { 'roaster.capacityGrams': 'Too small for a shop roaster.' }),
    );
    renderApp('/roastery/settings', { session: owner });

    const capacity = await screen.findByLabelText('Roaster capacity (g of green a batch)', {}, { timeout: 15_000 });
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await waitFor(() => expect(capacity.getAttribute('aria-invalid')).toBe('true'));
    expect(screen.getByText('Too small for a shop roaster.')).toBeTruthy();
  });

  it('stays closed to staff, and out of their navigation (their browser reads the settings only for the shop’s clock)', async () => {
    const fetchMock = settingsServer();
    renderApp('/roastery/settings', { session: makeUser({ role: 'staff' }) });

    expect(await screen.findByRole('heading', { level: 1, name: 'Settings are for the owner' }, { timeout: 15_000 })).toBeTruthy();
    const nav = screen.getByRole('navigation', { name: 'Roastery' });
    expect(within(nav).queryByRole('link', { name: 'Settings' })).toBeNull();
    expect(within(nav).getByRole('link', { name: 'Day Sheet' })).toBeTruthy();
    expect(within(nav).getByRole('link', { name: 'Roast Calendar' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Save settings' })).toBeNull();
    expect(sentRequests(fetchMock, 'PUT', '/api/roastery/settings')).toHaveLength(0);
  });
});
