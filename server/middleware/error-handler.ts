import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import type { ApiErrorBody } from '@shared/schemas/errors';
import { AppError } from '../lib/app-error';
import { isDatabaseUnavailable } from '../db/client';
import { isPaymentsUnavailable } from '../integrations/payments';

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'route_not_found', `No API route matches ${req.method} ${req.path}.`));
};

function fieldsOf(error: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length > 0 ? issue.path.join('.') : '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

function toAppError(error: unknown): AppError | undefined {
  if (error instanceof AppError) return error;
  if (error instanceof ZodError) return AppError.badRequest('Some fields are not valid.', fieldsOf(error));
  if (isDatabaseUnavailable(error)) {
    return new AppError(503, 'database_unavailable', 'The shop database is not reachable right now. Please try again shortly.');
  }
  if (isPaymentsUnavailable(error)) {
    return new AppError(503, 'payments_unavailable', 'Payments cannot be taken right now. Nothing was charged; please try again shortly.');
  }
  // body-parser marks its own failures (bad JSON, too large) with an HTTP status and a type.
  const parserError = error as { status?: number; type?: string };
  if (parserError.type === 'entity.parse.failed') return new AppError(400, 'invalid_json', 'The request body is not valid JSON.');
  if (parserError.type === 'entity.too.large') return new AppError(413, 'body_too_large', 'The request body is too large.');
  if (typeof parserError.status === 'number' && parserError.status >= 400 && parserError.status < 500) {
    return new AppError(parserError.status, 'bad_request', 'The request could not be read.');
  }
  return undefined;
}

/**
 * How a failure reads on the request's one log line: what it was and its first cause (a failed
 * query's cause says why; the query text would only repeat the route), never a stack.
 */
export function briefError(error: unknown): Record<string, unknown> {
  type Failure = { name?: string; constructor?: { name?: string }; message?: string; code?: unknown; cause?: unknown };
  const top = (error ?? {}) as Failure;
  let root = top;
  for (let depth = 0; root.cause && typeof root.cause === 'object' && depth < 5; depth++) root = root.cause as Failure;
  const message = String(root.message ?? error).slice(0, 300);
  const code = root.code ?? top.code;
  return { type: top.name ?? top.constructor?.name ?? typeof error, message, ...(code === undefined ? {} : { code }) };
}

/**
 * Answers every failure in the one error shape. The request's log line (pino-http's, when the
 * response ends) carries the failure once; a 5xx's stack goes to debug, for whoever turns it on.
 */
export const errorHandler: ErrorRequestHandler = (error, req, res, _next) => {
  const known = toAppError(error);
  if (!known || known.status >= 500) {
    res.err = error instanceof Error ? error : new Error(String(error));
    req.log.debug({ stack: (error as { stack?: string } | undefined)?.stack }, 'stack of the failed request');
  }

  const appError = known ?? new AppError(500, 'internal_error', 'Something went wrong on our side. Please try again.');
  const body: ApiErrorBody = { error: { code: appError.code, message: appError.message } };
  if (appError.fields) body.error.fields = appError.fields;
  if (appError.status === 503) res.setHeader('Retry-After', '5');
  res.status(appError.status).json(body);
};
