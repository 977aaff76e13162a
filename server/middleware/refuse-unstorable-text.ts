import type { RequestHandler } from 'express';
import { findUnstorableText, isStorableText, unstorableTextMessage } from '@shared/schemas/text';
import { AppError } from '../lib/app-error';

/**
 * Refuses, with a 400 naming the field, a request whose path, query or JSON body carries text
 * PostgreSQL cannot store (a NUL, a lone surrogate), before any route reads it.
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
  const inBody = findUnstorableText(req.body);
  if (inBody !== undefined) return next(AppError.badRequest('Some fields are not valid.', { [inBody]: unstorableTextMessage }));
  next();
};
