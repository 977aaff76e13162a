import type { z } from 'zod';
import { apiErrorSchema } from '@shared/schemas/errors';

/** A failed API call, carrying the API's one error shape (`{ error: { code, message, fields? } }`). */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string> | undefined;

  constructor(status: number, code: string, message: string, fields?: Record<string, string>) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
  }
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export type ApiRequestOptions<S extends z.ZodType> = {
  /** Parses the response body; a body that does not match is an error, never silently used. */
  schema: S;
  method?: Method;
  /** Sent as JSON. */
  body?: unknown;
  params?: URLSearchParams;
  signal?: AbortSignal;
  /** Extra request headers, e.g. an Idempotency-Key. */
  headers?: Record<string, string>;
};

const NETWORK_MESSAGE = 'Restday could not be reached. Check your connection and try again.';

function messageForStatus(status: number): string {
  if (status >= 500) return 'Restday hit a problem on its side. Please try again in a moment.';
  if (status === 404) return 'That could not be found.';
  return 'That request could not be completed.';
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (text === '') return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return undefined;
  }
}

let preloadedAnswers: Map<string, unknown> | undefined;

/**
 * The public GET answers the server put into the page's HTML (script#restday-preloaded), each used
 * once, by the first render: later reads ask the server, so they are never stale.
 */
function takePreloaded(url: string): unknown {
  if (!preloadedAnswers) {
    const script = typeof document === 'undefined' ? null : document.getElementById('restday-preloaded');
    preloadedAnswers = new Map(Object.entries(script?.textContent ? (JSON.parse(script.textContent) as Record<string, unknown>) : {}));
  }
  const answer = preloadedAnswers.get(url);
  preloadedAnswers.delete(url);
  return answer;
}

let firstAnswerFor: (url: string) => unknown = takePreloaded;

/**
 * Where a GET looks before it asks the network: the page's preloaded answers in a browser; the
 * answers of the page being rendered on the server, which has no network to ask.
 */
export function takeFirstAnswersFrom(source: (url: string) => unknown) {
  firstAnswerFor = source;
}

/**
 * Calls Restday's API on the same origin. Every response body goes through `schema`; every
 * failure becomes an `ApiError`. State-changing requests carry `X-Restday-Client: web`, which the
 * server requires of them.
 */
export async function apiRequest<S extends z.ZodType>(path: string, options: ApiRequestOptions<S>): Promise<z.output<S>> {
  const { schema, method = 'GET', body, params, signal, headers: extraHeaders } = options;
  const query = params?.toString();
  const url = query ? `${path}?${query}` : path;
  if (method === 'GET') {
    const preloaded = firstAnswerFor(url);
    if (preloaded !== undefined) return schema.parse(preloaded);
  }

  const headers: Record<string, string> = { Accept: 'application/json', ...extraHeaders };
  if (method !== 'GET') headers['X-Restday-Client'] = 'web';
  if (body !== undefined) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(url, {
      method,
      headers,
      credentials: 'same-origin',
      body: body === undefined ? undefined : JSON.stringify(body),
      signal,
    });
  } catch (cause) {
    if (signal?.aborted) throw cause;
    throw new ApiError(0, 'network_error', NETWORK_MESSAGE);
  }

  const payload = await readJson(response);

  if (!response.ok) {
    const parsed = apiErrorSchema.safeParse(payload);
    if (parsed.success) {
      const { code, message, fields } = parsed.data.error;
      throw new ApiError(response.status, code, message, fields);
    }
    throw new ApiError(response.status, 'http_error', messageForStatus(response.status));
  }

  const parsed = schema.safeParse(payload);
  if (!parsed.success) {
    throw new ApiError(response.status, 'invalid_response', 'Restday sent a reply this page does not understand. Reload the page to get the latest version.');
  }
  return parsed.data;
}
