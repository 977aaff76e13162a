// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { GreenStockItem } from '@shared/schemas/green-stock';
import type { LotStaffDetail } from '@shared/schemas/lots';
import { apiErrorResponse, jsonResponse, makeLotDetail, makeUser, renderApp, requestedUrls, sentRequests, stubFetch, enterValue } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const staff = makeUser({ role: 'staff', name: 'Oren Vale' });
const photoId = '5a7c9e1b-3d5f-4a7b-9c1d-3e5f7a9b1c3d';

type Movement = {
  id: string;
  deltaGrams: number;
  reason: string;
  note: string;
  orderId: string | null;
  batchId: string | null;
  actorName: string | null;
  createdAt: string;
};

/** A tiny in-memory server for the Roastery's lot routes, starting with one invented lot. */
function lotServer({ isListed = true, answer }: { isListed?: boolean; answer?: (method: string, path: string) => Response | undefined } = {}) {
  const lot: LotStaffDetail = {
    ...makeLotDetail({ stockGrams: 2000, photos: [`/api/uploads/${photoId}`] }),
    reorderPointGrams: 0,
    supplierLeadTimeDays: 14,
    isListed,
  };
  const movements: Movement[] = [
    {
      id: 'm1',
      deltaGrams: 2000,
      reason: 'arrival',
      note: 'First sacks',
      orderId: null,
      batchId: null,
      actorName: 'Oren Vale',
      createdAt: '2026-11-20T10:00:00.000Z',
    },
  ];
  const item = (): GreenStockItem => ({
    code: lot.code,
    name: lot.name,
    isListed: lot.isListed,
    stockGrams: lot.stockGrams,
    supplierLeadTimeDays: lot.supplierLeadTimeDays,
    reorderBy: null,
    reorderPointGrams: lot.reorderPointGrams,
    reorderAlert: lot.reorderPointGrams > 0 && lot.stockGrams <= lot.reorderPointGrams,
    usedGramsInWindow: 0,
    averageDailyUseGrams: 0,
    daysOfCover: null,
  });
  const fetchMock = stubFetch((url, init) => {
    const method = init?.method ?? 'GET';
    const path = url.pathname;
    const answered = answer?.(method, path);
    if (answered) return answered;
    const body = typeof init?.body === 'string' ? (JSON.parse(init.body) as Record<string, unknown>) : {};
    if (path === '/api/roastery/green-stock') return jsonResponse({ windowDays: 28, items: [item()] });
    if (path === `/api/lots/${lot.code}/stock-movements`) return jsonResponse({ items: movements });
    if (path === `/api/lots/${lot.code}/stock-adjustments`) {
      lot.stockGrams += Number(body.deltaGrams);
      movements.unshift({
        id: `m${movements.length + 1}`,
        deltaGrams: Number(body.deltaGrams),
        reason: String(body.reason),
        note: String(body.note ?? ''),
        orderId: null,
        batchId: null,
        actorName: 'Oren Vale',
        createdAt: '2026-12-01T16:00:00.000Z',
      });
      return jsonResponse({ stockGrams: lot.stockGrams });
    }
    if (path === `/api/lots/${lot.code}/photos` && method === 'POST') {
      const id = '6b8d0f2c-4e6a-4b8c-8d2e-4f6a8b0c2d4e';
      lot.photos.push(`/api/uploads/${id}`);
      return jsonResponse({ id, kind: 'photo', url: `/api/uploads/${id}`, contentType: 'image/png', byteSize: 2048 }, 201);
    }
    if (path === `/api/lots/${lot.code}/photos/${photoId}` && method === 'DELETE') {
      lot.photos = lot.photos.filter((url) => !url.endsWith(photoId));
      return new Response(null, { status: 204 });
    }
    if (path === `/api/lots/${lot.code}` && method === 'PATCH') {
      Object.assign(lot, body);
      return jsonResponse(lot);
    }
    if (path === `/api/roastery/green-stock/${lot.code}`) return jsonResponse(lot);
    return apiErrorResponse(404, 'not_found', `Nothing at ${path}.`);
  });
  return { fetchMock, lot };
}

async function openEditor(options?: Parameters<typeof lotServer>[0]) {
  const server = lotServer(options);
  const view = renderApp('/roastery/green-stock/RD-T01', { session: staff });
  // The first render in a file waits for Vite to transform the page and its many parts.
  await screen.findByRole('heading', { level: 1, name: 'Test Ridge Washed' }, { timeout: 15_000 });
  return { ...server, ...view };
}

describe('Lot page in Green Stock: stock', () => {
  it('records an arrival typed in pounds as grams, and the history and on-hand figure refresh', async () => {
    const { fetchMock } = await openEditor();
    const history = await screen.findByRole('table', { name: 'Stock history of RD-T01, newest first' });
    expect(within(history).getAllByRole('row')).toHaveLength(2);

    const form = screen.getByRole('form', { name: 'Adjust stock' });
    enterValue(within(form).getByLabelText('Unit'), 'lb');
    enterValue(within(form).getByLabelText('Change'), '5');
    // 5 lb × 453.59237 g/lb = 2267.96 g, to the nearest gram 2268 (NIST SP 811, Appendix B).
    expect(within(form).getByText(/That is 2\.3 kg\./)).toBeTruthy();
    enterValue(within(form).getByLabelText('Note'), 'Two sacks from the port');
    fireEvent.click(within(form).getByRole('button', { name: 'Record the change' }));

    expect(await within(form).findByText('Arrival recorded. On hand now: 4.3 kg · 9.4 lb.')).toBeTruthy();
    expect(sentRequests(fetchMock, 'POST', '/api/lots/RD-T01/stock-adjustments').map((request) => request.body)).toEqual([
      { deltaGrams: 2268, reason: 'arrival', note: 'Two sacks from the port' },
    ]);
    await waitFor(() => expect(within(history).getAllByRole('row')).toHaveLength(3));
    const newest = within(history).getAllByRole('row')[1] as HTMLElement;
    expect(within(newest).getByText('+2.3 kg')).toBeTruthy();
    expect(within(newest).getByText('Two sacks from the port')).toBeTruthy();
    const onHand = screen.getByText('On hand', { selector: 'dt' }).nextElementSibling;
    await waitFor(() => expect(onHand?.textContent).toBe('4.3 kg · 9.4 lb'));
    expect((within(form).getByLabelText('Change') as HTMLInputElement).value).toBe('');
  });

  it('refuses a sample that adds stock on its field, without asking the server', async () => {
    const { fetchMock } = await openEditor();
    const form = screen.getByRole('form', { name: 'Adjust stock' });
    enterValue(within(form).getByLabelText('Reason'), 'sample');
    const change = within(form).getByLabelText('Change');
    enterValue(change, '250');
    fireEvent.click(within(form).getByRole('button', { name: 'Record the change' }));

    await waitFor(() => expect(change.getAttribute('aria-invalid')).toBe('true'));
    const described = (change.getAttribute('aria-describedby') ?? '').split(' ').map((id) => document.getElementById(id)?.textContent);
    expect(described).toContain('A sample takes stock away.');
    expect(document.activeElement).toBe(change);
    expect(sentRequests(fetchMock, 'POST', '/api/lots/RD-T01/stock-adjustments')).toHaveLength(0);
  });

  it('shows the server’s refusal to go below zero on the change field', async () => {
    await openEditor({
      answer: (method, path) =>
        method === 'POST' && path.endsWith('/stock-adjustments')
          ? apiErrorResponse(409, 'stock_below_zero', 'Lot RD-T01 does not hold that many grams; stock cannot go below zero.', {
              deltaGrams: 'would take stock below zero',
            })
          : undefined,
    });
    const form = screen.getByRole('form', { name: 'Adjust stock' });
    enterValue(within(form).getByLabelText('Reason'), 'loss');
    enterValue(within(form).getByLabelText('Change'), '-9000');
    fireEvent.click(within(form).getByRole('button', { name: 'Record the change' }));

    expect(await within(form).findByText('The change would take stock below zero.')).toBeTruthy();
    expect(within(form).getByLabelText('Change').getAttribute('aria-invalid')).toBe('true');
  });

  it('sets the reorder point and raises the reorder alert', async () => {
    const { fetchMock } = await openEditor();
    const form = screen.getByRole('form', { name: 'Reorder point' });
    enterValue(within(form).getByLabelText('Reorder point'), '5 kg');
    fireEvent.click(within(form).getByRole('button', { name: 'Save reorder point' }));

    expect(await within(form).findByText('Reorder point set to 5 kg · 11 lb.')).toBeTruthy();
    expect(sentRequests(fetchMock, 'PATCH', '/api/lots/RD-T01').map((request) => request.body)).toEqual([{ reorderPointGrams: 5000 }]);
    expect(await screen.findByText('Time to reorder.')).toBeTruthy();
  });

  it('opens an unlisted lot whole and lists it in Green Lots', async () => {
    const { fetchMock } = await openEditor({ isListed: false });
    expect(await screen.findByRole('form', { name: 'Lot descriptors' })).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'List in Green Lots' }));
    await waitFor(() => expect(sentRequests(fetchMock, 'PATCH', '/api/lots/RD-T01').map((request) => request.body)).toEqual([{ isListed: true }]));
    expect(await screen.findByRole('button', { name: 'Take off Green Lots' })).toBeTruthy();
  });
});

describe('Lot page in Green Stock: photos and spec sheet', () => {
  const pickFile = (label: string, file: File) => fireEvent.change(screen.getByLabelText(label), { target: { files: [file] } });

  it('checks type and size before uploading, then uploads a photo and shows the server’s answer', async () => {
    const { fetchMock } = await openEditor();
    await screen.findByRole('region', { name: 'Photos' });

    pickFile('Add a photo', new File(['%PDF-1.7'], 'sheet.pdf', { type: 'application/pdf' }));
    expect(await screen.findByText('sheet.pdf is not a JPEG, PNG or WebP image.')).toBeTruthy();
    pickFile('Add a photo', new File([new Uint8Array(5 * 1024 * 1024 + 1)], 'huge.png', { type: 'image/png' }));
    expect(await screen.findByText('huge.png is 5 MB; the limit is 5 MB.')).toBeTruthy();
    expect(requestedUrls(fetchMock)).not.toContain('/api/lots/RD-T01/photos');

    pickFile('Add a photo', new File([new Uint8Array(2048)], 'sacks.png', { type: 'image/png' }));
    expect(await screen.findByText('Photo added (2 KB).')).toBeTruthy();
    const upload = fetchMock.mock.calls.find(([input, init]) => String(input) === '/api/lots/RD-T01/photos' && init?.method === 'POST');
    expect(upload?.[1]?.body).toBeInstanceOf(FormData);
    expect(((upload?.[1]?.body as FormData).get('file') as File).name).toBe('sacks.png');
    expect(new Headers(upload?.[1]?.headers).get('X-Restday-Client')).toBe('web');
    expect(within(screen.getByRole('list', { name: 'Photos of this lot' })).getAllByRole('img')).toHaveLength(2);
  });

  it('shows the server’s reason when it refuses a file by its content', async () => {
    await openEditor({
      answer: (method, path) =>
        method === 'POST' && path.endsWith('/spec-sheet')
          ? apiErrorResponse(415, 'unsupported_file_type', 'The file must be a PDF; its content is not.', { file: 'must be a PDF' })
          : undefined,
    });
    await screen.findByRole('region', { name: 'Spec sheet' });
    pickFile('Upload a spec sheet', new File(['not really a pdf'], 'sheet.pdf', { type: 'application/pdf' }));

    const reason = await screen.findByText('The file must be a PDF; its content is not.');
    const picker = screen.getByLabelText('Upload a spec sheet');
    expect(picker.getAttribute('aria-describedby')).toContain(reason.id);
    expect(picker.getAttribute('aria-invalid')).toBe('true');
  });

  it('deletes a photo', async () => {
    const { fetchMock } = await openEditor();
    fireEvent.click(await screen.findByRole('button', { name: 'Delete photo 1' }));

    await waitFor(() => expect(screen.queryByRole('list', { name: 'Photos of this lot' })).toBeNull());
    expect(sentRequests(fetchMock, 'DELETE', `/api/lots/RD-T01/photos/${photoId}`)).toHaveLength(1);
    expect(screen.getByText(/No photos yet/)).toBeTruthy();
  });
});

describe('Lot page in Green Stock: descriptors', () => {
  it('sends only what changed, with dollars as cents and notes as a list', async () => {
    const { fetchMock } = await openEditor();
    const form = await screen.findByRole('form', { name: 'Lot descriptors' });
    enterValue(within(form).getByLabelText('Name'), 'Test Ridge Washed, Second Pick');
    enterValue(within(form).getByLabelText('Price per kg ($)'), '26.80');
    enterValue(within(form).getByLabelText('Tasting notes'), 'bergamot, apricot, honey');
    fireEvent.click(within(form).getByRole('button', { name: 'Save changes' }));

    expect(await within(form).findByText('Saved. The lot page shows the changes now.')).toBeTruthy();

    // A second save sends only what changed since the first.
    enterValue(within(form).getByLabelText('Region'), 'Upper Sidama');
    fireEvent.click(within(form).getByRole('button', { name: 'Save changes' }));
    await waitFor(() => expect(sentRequests(fetchMock, 'PATCH', '/api/lots/RD-T01')).toHaveLength(2));
    expect(sentRequests(fetchMock, 'PATCH', '/api/lots/RD-T01').map((request) => request.body)).toEqual([
      { name: 'Test Ridge Washed, Second Pick', tastingNotes: ['bergamot', 'apricot', 'honey'], pricePerKgCents: 2680 },
      { region: 'Upper Sidama' },
    ]);
  });

  it('puts the server’s reasons on their fields', async () => {
    await openEditor({
      answer: (method, path) =>
        method === 'PATCH' && path === '/api/lots/RD-T01'
          ? apiErrorResponse(400, 'validation_failed', 'Some fields are not valid.', { suggestedLevel: 'must be one of the allowed levels' })
          : undefined,
    });
    const form = await screen.findByRole('form', { name: 'Lot descriptors' });
    enterValue(within(form).getByLabelText('Suggested level'), 'medium');
    fireEvent.click(within(form).getByRole('button', { name: 'Save changes' }));

    const suggested = within(form).getByLabelText('Suggested level');
    await waitFor(() => expect(suggested.getAttribute('aria-invalid')).toBe('true'));
    expect(document.getElementById(suggested.getAttribute('aria-describedby') ?? '')?.textContent).toBe('Suggested level must be one of the allowed levels.');
  });
});
