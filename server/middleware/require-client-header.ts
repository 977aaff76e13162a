import type { Request, RequestHandler } from 'express';
import type { Config } from '../config';
import { AppError } from '../lib/app-error';

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/** The origin this request was addressed to, as the browser saw it (Host, and the scheme a trusted proxy reports). */
const ownOrigin = (req: Request) => `${req.protocol}://${req.get('host') ?? ''}`;

/**
 * Cross-site request forgery defence for every state-changing request, in two layers:
 * - a custom header, which a cross-site form or image cannot send, and fetch cannot send
 *   cross-site without CORS consent we never give;
 * - when the browser names the page's Origin, it must be this site's (PUBLIC_URL, or the host the
 *   request was addressed to). Browsers send Origin on every cross-site POST, PUT, PATCH and
 *   DELETE; clients that are not browsers send none and are judged by the header alone.
 */
export function requireClientHeader(config: Pick<Config, 'PUBLIC_URL'>): RequestHandler {
  const publicOrigin = config.PUBLIC_URL ? new URL(config.PUBLIC_URL).origin : undefined;
  return (req, _res, next) => {
    if (safeMethods.has(req.method)) return next();
    if (req.get('X-Restday-Client') !== 'web') {
      return next(new AppError(403, 'client_header_required', 'State-changing requests must carry the X-Restday-Client: web header.'));
    }
    const origin = req.get('Origin');
    if (origin !== undefined && origin !== publicOrigin && origin !== ownOrigin(req)) {
      return next(new AppError(403, 'origin_mismatch', 'This request came from another site and was refused.'));
    }
    next();
  };
}
