// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Address } from '@shared/schemas/account';
import { apiErrorResponse, jsonResponse, makeUser, renderApp, sentRequests, stubFetch, enterValue } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// Invented addresses.
const home: Address = {
  id: '6f1d2a4b-8c3e-4f5a-9b7d-1e2c3d4f5a6b',
  name: 'Ines Marlow',
  line1: '14 Quarry Lane',
  line2: null,
  city: 'Ashfield',
  region: 'OR',
  postalCode: '97000',
  country: 'US',
  isDefault: true,
};
const office: Address = {
  ...home,
  id: '7a2e3b5c-9d4f-4a6b-8c8e-2f3d4e5a6b7c',
  name: 'Ines at the studio',
  line1: '3 Kiln Row',
  line2: 'Unit 2',
  isDefault: false,
};

/** A tiny in-memory server for the address routes. */
function addressServer(initial: Address[]) {
  let items = [...initial];
  return stubFetch((url, init) => {
    const method = init?.method ?? 'GET';
    const id = url.pathname.split('/')[4];
    if (method === 'GET') return jsonResponse({ items });
    if (method === 'DELETE') {
      items = items.filter((item) => item.id !== id);
      return new Response(null, { status: 204 });
    }
    const body = JSON.parse(String(init?.body)) as Omit<Address, 'id'>;
    const saved: Address = { ...body, id: id ?? '8b3f4c6d-0e5a-4b7c-9d9f-3a4e5f6a7b8c' };
    if (saved.isDefault) items = items.map((item) => ({ ...item, isDefault: false }));
    items = method === 'POST' ? [...items, saved] : items.map((item) => (item.id === id ? saved : item));
    return jsonResponse(saved, method === 'POST' ? 201 : 200);
  });
}

function fill(label: string, value: string) {
  enterValue(screen.getByLabelText(label), value);
}

function cardOf(name: string): HTMLElement {
  return screen.getByRole('listitem', { name });
}

describe('addresses page', () => {
  it('lists the addresses, marking the one checkout uses first', async () => {
    addressServer([home, office]);
    renderApp('/account/addresses', { session: makeUser() });

    const list = await screen.findByRole('list', { name: 'Your addresses' });
    const cards = within(list).getAllByRole('listitem');
    expect(cards).toHaveLength(2);
    expect(within(cardOf('Ines Marlow')).getByText('Used first at checkout')).toBeTruthy();
    expect(within(cardOf('Ines at the studio')).queryByText('Used first at checkout')).toBeNull();
    expect(within(cardOf('Ines at the studio')).getByText(/Unit 2/)).toBeTruthy();
  });

  it('offers to add the first address when there is none, and checks the form before sending it', async () => {
    const fetchMock = addressServer([]);
    renderApp('/account/addresses', { session: makeUser() });

    fireEvent.click(await screen.findByRole('button', { name: 'Add an address' }));
    const form = screen.getByRole('region', { name: 'New address' });
    await waitFor(() => expect(document.activeElement).toBe(within(form).getByLabelText('Recipient’s name')));
    expect(within(form).getByLabelText('Street address').getAttribute('autocomplete')).toBe('shipping address-line1');

    fireEvent.click(within(form).getByRole('button', { name: 'Save address' }));
    expect(await within(form).findByText('Enter the street address.')).toBeTruthy();
    expect(sentRequests(fetchMock, 'POST', '/api/account/addresses')).toHaveLength(0);

    fill('Recipient’s name', 'Ines Marlow');
    fill('Street address', '14 Quarry Lane');
    fill('City or town', 'Ashfield');
    fill('State or region', 'OR');
    fill('ZIP or postal code', '97000');
    fill('Country code', 'us');
    fireEvent.click(screen.getByLabelText('Use this address first at checkout'));
    fireEvent.click(within(form).getByRole('button', { name: 'Save address' }));

    expect(await screen.findByRole('listitem', { name: 'Ines Marlow' })).toBeTruthy();
    expect(screen.getByText('Address saved.')).toBeTruthy();
    expect(sentRequests(fetchMock, 'POST', '/api/account/addresses')[0]?.body).toEqual({
      name: 'Ines Marlow',
      line1: '14 Quarry Lane',
      line2: null,
      city: 'Ashfield',
      region: 'OR',
      postalCode: '97000',
      country: 'US',
      isDefault: true,
    });
    await waitFor(() => expect(document.activeElement).toBe(screen.getByRole('button', { name: 'Add an address' })));
  });

  it('shows a server’s reason on its field', async () => {
    stubFetch((_url, init) =>
      (init?.method ?? 'GET') === 'GET'
        ? jsonResponse({ items: [] })
        : apiErrorResponse(400, 'invalid_input', 'Check the marked fields.', { postalCode: 'That ZIP code does not match the state.' }),
    );
    renderApp('/account/addresses', { session: makeUser() });
    fireEvent.click(await screen.findByRole('button', { name: 'Add an address' }));
    fill('Recipient’s name', 'Ines Marlow');
    fill('Street address', '14 Quarry Lane');
    fill('City or town', 'Ashfield');
    fill('State or region', 'OR');
    fill('ZIP or postal code', '10001');
    fireEvent.click(screen.getByRole('button', { name: 'Save address' }));

    const zip = screen.getByLabelText('ZIP or postal code');
    await waitFor(() => expect(zip.getAttribute('aria-invalid')).toBe('true'));
    expect(document.getElementById(zip.getAttribute('aria-describedby') ?? '')?.textContent).toBe('That ZIP code does not match the state.');
  });

  it('edits an address in place and returns focus to its Edit button', async () => {
    const fetchMock = addressServer([home, office]);
    renderApp('/account/addresses', { session: makeUser() });

    fireEvent.click(within(await screen.findByRole('listitem', { name: 'Ines at the studio' })).getByRole('button', { name: 'Edit' }));
    const form = screen.getByRole('listitem', { name: 'Edit address' });
    expect((within(form).getByLabelText('Apartment, suite or unit (optional)') as HTMLInputElement).value).toBe('Unit 2');
    enterValue(within(form).getByLabelText('Street address'), '5 Kiln Row');
    fireEvent.click(within(form).getByRole('button', { name: 'Save address' }));

    const card = await screen.findByRole('listitem', { name: 'Ines at the studio' });
    expect(within(card).getByText(/5 Kiln Row/)).toBeTruthy();
    expect(sentRequests(fetchMock, 'PUT', `/api/account/addresses/${office.id}`)[0]?.body).toMatchObject({ line1: '5 Kiln Row', line2: 'Unit 2' });
    await waitFor(() => expect(document.activeElement).toBe(within(card).getByRole('button', { name: 'Edit' })));
  });

  it('makes another address the one checkout uses first', async () => {
    const fetchMock = addressServer([home, office]);
    renderApp('/account/addresses', { session: makeUser() });

    fireEvent.click(within(await screen.findByRole('listitem', { name: 'Ines at the studio' })).getByRole('button', { name: 'Use first at checkout' }));

    await waitFor(() => expect(within(cardOf('Ines at the studio')).getByText('Used first at checkout')).toBeTruthy());
    expect(within(cardOf('Ines Marlow')).queryByText('Used first at checkout')).toBeNull();
    const [request] = sentRequests(fetchMock, 'PUT', `/api/account/addresses/${office.id}`);
    expect(request?.body).toMatchObject({ isDefault: true, line1: '3 Kiln Row' });
    expect(request?.body).not.toHaveProperty('id');
  });

  it('asks before deleting, and keeps the address when the customer changes their mind', async () => {
    const fetchMock = addressServer([home, office]);
    renderApp('/account/addresses', { session: makeUser() });

    const card = await screen.findByRole('listitem', { name: 'Ines at the studio' });
    fireEvent.click(within(card).getByRole('button', { name: 'Delete' }));
    expect(within(card).getByText('Delete this address?')).toBeTruthy();
    await waitFor(() => expect(document.activeElement).toBe(within(card).getByRole('button', { name: 'Delete address' })));

    fireEvent.click(within(card).getByRole('button', { name: 'Keep it' }));
    await waitFor(() => expect(document.activeElement).toBe(within(card).getByRole('button', { name: 'Delete' })));
    expect(sentRequests(fetchMock, 'DELETE', `/api/account/addresses/${office.id}`)).toHaveLength(0);

    fireEvent.click(within(card).getByRole('button', { name: 'Delete' }));
    fireEvent.click(within(card).getByRole('button', { name: 'Delete address' }));

    await waitFor(() => expect(screen.queryByRole('listitem', { name: 'Ines at the studio' })).toBeNull());
    expect(screen.getByText('Address deleted.')).toBeTruthy();
    expect(sentRequests(fetchMock, 'DELETE', `/api/account/addresses/${office.id}`)).toHaveLength(1);
  });
});
