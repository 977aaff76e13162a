import type { RequestHandler } from 'express';
import { findUnstorableText, isStorableText, unstorableTextMessage } from '@shared/schemas/text';
import { AppError } from '../lib/app-error';

/** No request shape of the API nests deeper than a handful of levels; this leaves ample room. */
export const maxBodyDepth = 32;

/** Whether a parsed JSON value nests deeper than `limit` arrays and objects (walked without recursion). */
function nestsDeeperThan(value: unknown, limit: number): boolean {
  const pending: { value: unknown; depth: number }[] = [{ value, depth: 0 }];
  while (pending.length > 0) {
    const next = pending.pop()!;
    if (next.value === null || typeof next.value !== 'object') continue;
    if (next.depth >= limit) return true;
    for (const item of Object.values(next.value)) pending.push({ value: item, depth: next.depth + 1 });
  }
  return false;
}

/**
 * Refuses, with a 400 naming the field, a request whose path, query or JSON body carries text
 * PostgreSQL cannot store (a NUL, a lone surrogate), before any route reads it. A body nested past
 * `maxBodyDepth` is refused first: walking (or validating) thousands of levels would overflow the stack.
 */
export const refuseUnstorableText: RequestHandler = (req, _res, next) => {
  let path: string;
  try {
    path = decodeURIComponent(req.path);
  } catch {
    return next(AppError.badRequest('The address is not valid.', { path: 'has a broken %-escape' }));
  }
  if (!isStorableText(path)) return next(AppError.badRequest('The address has characters Restday cannot read.', { path: unstorableTextMessage }));
  const inQuery = findUnstorableText(req.query);
  if (inQuery !== undefined) return next(AppError.badRequest('Some fields are not valid.', { [inQuery]: unstorableTextMessage }));
  if (nestsDeeperThan(req.body, maxBodyDepth)) {
    return next(new AppError(400, 'body_too_deep', `The request body nests deeper than ${maxBodyDepth} levels.`));
  }
  const inBody = findUnstorableText(req.body);
  if (inBody !== undefined) return next(AppError.badRequest('Some fields are not valid.', { [inBody]: unstorableTextMessage }));
  next();
};
