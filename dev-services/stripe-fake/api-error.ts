import type { ErrorRequestHandler } from 'express';
import { ZodError, type z } from 'zod';

export type StripeErrorType = 'invalid_request_error' | 'card_error' | 'idempotency_error' | 'api_error';

export interface StripeErrorBody {
  type: StripeErrorType;
  message: string;
  code?: string;
  param?: string;
  decline_code?: string;
}

/** An error the fake answers in Stripe's format, `{error: {type, code, message, param}}`, so the SDK raises its typed error. */
export class StripeApiError extends Error {
  constructor(
    readonly status: number,
    readonly body: StripeErrorBody,
  ) {
    super(body.message);
    this.name = 'StripeApiError';
  }

  static invalid(message: string, param?: string, code = 'parameter_invalid') {
    return new StripeApiError(400, { type: 'invalid_request_error', code, message, ...(param ? { param } : {}) });
  }

  static missing(kind: string, id: string, param = 'id') {
    return new StripeApiError(404, { type: 'invalid_request_error', code: 'resource_missing', message: `No such ${kind}: '${id}'`, param });
  }

  static card(code: string, message: string, declineCode?: string) {
    return new StripeApiError(402, { type: 'card_error', code, message, ...(declineCode ? { decline_code: declineCode } : {}) });
  }
}

/** Stripe names nested parameters the way they are form-encoded: `line_items[0][price_data][currency]`. */
export function paramName(path: readonly PropertyKey[]): string {
  const [first, ...rest] = path.map(String);
  return `${first ?? ''}${rest.map((part) => `[${part}]`).join('')}`;
}

function fromZod(error: ZodError): StripeApiError {
  const issue = error.issues[0];
  if (!issue) return StripeApiError.invalid('Invalid request.');
  if (issue.code === 'unrecognized_keys') {
    const param = paramName([...issue.path, issue.keys[0] ?? '']);
    return StripeApiError.invalid(`Received unknown parameter: ${param}`, param, 'parameter_unknown');
  }
  const param = paramName(issue.path);
  if (issue.code === 'invalid_type' && issue.input === undefined) {
    return StripeApiError.invalid(`Missing required param: ${param}.`, param, 'parameter_missing');
  }
  return StripeApiError.invalid(`Invalid ${param}: ${issue.message}`, param);
}

/** Parses a request's parameters, answering a Stripe-style 400 that names the first bad parameter. */
export function parseParams<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const parsed = schema.safeParse(input);
  if (!parsed.success) throw fromZod(parsed.error);
  return parsed.data;
}

export const stripeErrorHandler: ErrorRequestHandler = (error, _req, res, _next) => {
  if (error instanceof StripeApiError) {
    res.status(error.status).json({ error: error.body });
    return;
  }
  if (error instanceof ZodError) {
    const converted = fromZod(error);
    res.status(converted.status).json({ error: converted.body });
    return;
  }
  const parserError = error as { status?: number; type?: string };
  if (typeof parserError.status === 'number' && parserError.status < 500) {
    res.status(400).json({ error: { type: 'invalid_request_error', message: 'The request body could not be read.' } });
    return;
  }
  console.error('Stripe fake: request failed', error);
  res.status(500).json({ error: { type: 'api_error', message: 'The local payment fake failed to handle this request.' } });
};
