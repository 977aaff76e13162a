import type { RequestHandler } from 'express';
import { AppError } from '../lib/app-error';

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * A cross-site form or image can't set custom headers, so requiring one on every
 * state-changing request stops cross-site request forgery without tokens.
 */
export const requireClientHeader: RequestHandler = (req, _res, next) => {
  if (safeMethods.has(req.method) || req.get('X-Restday-Client') === 'web') return next();
  next(new AppError(403, 'client_header_required', 'State-changing requests must carry the X-Restday-Client: web header.'));
};
