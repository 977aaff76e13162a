import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { ApiError, apiRequest } from './api-client';

afterEach(() => {
  vi.unstubAllGlobals();
});

function stubFetchOnce(response: Response | Error) {
  const fetchMock = vi.fn(() => (response instanceof Error ? Promise.reject(response) : Promise.resolve(response)));
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

function json(body: unknown, status: number): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

const pingSchema = z.object({ ok: z.boolean() });

async function caught(promise: Promise<unknown>): Promise<ApiError> {
  const error = await promise.then(
    () => undefined,
    (reason: unknown) => reason,
  );
  if (!(error instanceof ApiError)) throw new Error(`expected an ApiError, got ${String(error)}`);
  return error;
}

describe('apiRequest', () => {
  it('returns the body parsed by the schema, with the query string attached', async () => {
    const fetchMock = stubFetchOnce(json({ ok: true, extra: 'dropped' }, 200));
    const body = await apiRequest('/api/ping', { schema: pingSchema, params: new URLSearchParams({ q: 'a b' }) });

    expect(body).toEqual({ ok: true });
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/ping?q=a+b');
    expect(init.method).toBe('GET');
    expect(init.credentials).toBe('same-origin');
    expect(new Headers(init.headers).has('X-Restday-Client')).toBe(false);
  });

  it('marks every state-changing request with X-Restday-Client and sends JSON', async () => {
    const fetchMock = stubFetchOnce(json({ ok: true }, 201));
    await apiRequest('/api/things', { schema: pingSchema, method: 'POST', body: { name: 'x' } });

    const [, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    const headers = new Headers(init.headers);
    expect(headers.get('X-Restday-Client')).toBe('web');
    expect(headers.get('Content-Type')).toBe('application/json');
    expect(init.credentials).toBe('same-origin');
    expect(init.body).toBe('{"name":"x"}');
  });

  it('turns the API error body into an ApiError with status, code, message and fields', async () => {
    stubFetchOnce(json({ error: { code: 'invalid_input', message: 'Check the form.', fields: { email: 'Not an e-mail address.' } } }, 400));
    const error = await caught(apiRequest('/api/things', { schema: pingSchema, method: 'POST', body: {} }));

    expect(error.status).toBe(400);
    expect(error.code).toBe('invalid_input');
    expect(error.message).toBe('Check the form.');
    expect(error.fields).toEqual({ email: 'Not an e-mail address.' });
  });

  it('still gives an ApiError when a failure has no error body', async () => {
    stubFetchOnce(new Response('<html>Bad gateway</html>', { status: 502 }));
    const error = await caught(apiRequest('/api/ping', { schema: pingSchema }));

    expect(error.status).toBe(502);
    expect(error.code).toBe('http_error');
    expect(error.message).toMatch(/try again/i);
  });

  it('refuses a successful reply that does not match the schema', async () => {
    stubFetchOnce(json({ ok: 'yes' }, 200));
    const error = await caught(apiRequest('/api/ping', { schema: pingSchema }));

    expect(error.code).toBe('invalid_response');
    expect(error.status).toBe(200);
  });

  it('reports an unreachable server as a network error', async () => {
    stubFetchOnce(new TypeError('Failed to fetch'));
    const error = await caught(apiRequest('/api/ping', { schema: pingSchema }));

    expect(error.status).toBe(0);
    expect(error.code).toBe('network_error');
  });

  it('accepts an empty reply when the schema expects none', async () => {
    stubFetchOnce(new Response(null, { status: 204 }));
    await expect(apiRequest('/api/auth/sign-out', { schema: z.undefined(), method: 'POST' })).resolves.toBeUndefined();
  });

  it('lets a cancelled request stay cancelled', async () => {
    const controller = new AbortController();
    controller.abort();
    stubFetchOnce(new DOMException('The operation was aborted.', 'AbortError'));
    await expect(apiRequest('/api/ping', { schema: pingSchema, signal: controller.signal })).rejects.toMatchObject({ name: 'AbortError' });
  });
});
