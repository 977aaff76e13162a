// @vitest-environment happy-dom
import { cleanup, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { BatchTrace, OrderTrace } from '@shared/schemas/packing';
import { apiErrorResponse, jsonResponse, makeUser, renderApp, stubFetch } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const staff = makeUser({ role: 'staff' });
const batchId = '5a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d';
const orderId = '6b2c3d4e-5f6a-4b7c-9d8e-0f1a2b3c4d5e';

// Invented trace data.
const batchTrace: BatchTrace = {
  batch: {
    id: batchId,
    roastDate: '2026-12-03',
    lotCode: 'RD-T01',
    lotName: 'Test Ridge Washed',
    roastLevel: 'medium',
    greenGramsIn: 4_635,
    roastedGramsOut: 3_940,
    allocatedGrams: 1_136,
  },
  orders: [
    {
      orderId,
      customerName: 'Juno Reed',
      customerEmail: 'juno.reed@example.test',
      status: 'shipped',
      shipDate: '2026-12-04',
      shippedAt: '2026-12-04T22:00:00.000Z',
      bags: 2,
      grams: 682,
    },
    {
      orderId: '7c3d4e5f-6a7b-4c8d-8e9f-1a2b3c4d5e6f',
      customerName: 'Tamsin Okerlund',
      customerEmail: 'tamsin@example.test',
      status: 'packed',
      shipDate: '2026-12-04',
      shippedAt: null,
      bags: 1,
      grams: 454,
    },
  ],
};

const orderTrace: OrderTrace = {
  order: {
    id: orderId,
    kind: 'roasted',
    status: 'shipped',
    customerName: 'Juno Reed',
    customerEmail: 'juno.reed@example.test',
    roastDate: '2026-12-03',
    shipDate: '2026-12-04',
    shippedAt: '2026-12-04T22:00:00.000Z',
  },
  bags: [
    { batchId, lotCode: 'RD-T01', lotName: 'Test Ridge Washed', roastLevel: 'medium', roastDate: '2026-12-03', size: '12oz', bags: 2, grams: 682 },
    { batchId: null, lotCode: 'RD-T02', lotName: 'Invented Valley Natural', roastLevel: 'light', roastDate: null, size: '1lb', bags: 1, grams: 454 },
  ],
};

describe('Trace', () => {
  it('follows a batch to every order it went into', async () => {
    stubFetch((url) =>
      url.pathname === `/api/roastery/batches/${batchId}/trace` ? jsonResponse(batchTrace) : apiErrorResponse(404, 'not_found', 'Not found.'),
    );
    renderApp(`/roastery/batches/${batchId}`, { session: staff });

    expect(await screen.findByRole('heading', { level: 1, name: 'Batch of Test Ridge Washed, Medium' }, { timeout: 15_000 })).toBeTruthy();
    expect(screen.getByText('1,136 g')).toBeTruthy();
    const orders = screen.getByRole('region', { name: 'Orders from this batch' });
    const juno = within(orders).getByRole('row', { name: /6B2C3D4E/ });
    expect(juno.textContent).toContain('Juno Reed');
    expect(juno.textContent).toContain('2 (682 g)');
    expect(juno.textContent).toContain('Shipped');
    expect(within(juno).getByRole('link', { name: '6B2C3D4E' }).getAttribute('href')).toBe(`/roastery/orders/${orderId}/trace`);
    expect(within(orders).getAllByRole('row')).toHaveLength(3);
    expect(screen.getByRole('link', { name: 'Open its Day Sheet' }).getAttribute('href')).toBe('/roastery/days/2026-12-03');
  });

  it('says plainly when there is no such batch', async () => {
    stubFetch(() => apiErrorResponse(404, 'not_found', 'No such batch.'));
    renderApp(`/roastery/batches/${batchId}`, { session: staff });
    expect(await screen.findByRole('heading', { level: 1, name: 'No such batch' }, { timeout: 15_000 })).toBeTruthy();
  });

  it('follows an order back to its batches and lots, and says which bags no batch has filled yet', async () => {
    stubFetch((url) => (url.pathname === `/api/orders/${orderId}/trace` ? jsonResponse(orderTrace) : apiErrorResponse(404, 'not_found', 'Not found.')));
    renderApp(`/roastery/orders/${orderId}/trace`, { session: staff });

    const section = await screen.findByRole('region', { name: 'Trace: batches and lots' }, { timeout: 15_000 });
    expect(await within(section).findByText(/Order 6B2C3D4E for Juno Reed/)).toBeTruthy();
    const ridge = within(section).getByRole('row', { name: /Test Ridge Washed/ });
    expect(ridge.textContent).toContain('2 × 12 oz (682 g)');
    expect(within(ridge).getByRole('link', { name: 'Open batch of Test Ridge Washed' }).getAttribute('href')).toBe(`/roastery/batches/${batchId}`);
    expect(within(section).getByRole('row', { name: /Invented Valley Natural/ }).textContent).toContain('Not filled from a batch yet');
  });
});
