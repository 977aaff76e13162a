import type { RequestHandler } from 'express';
import type { Config } from '../../config';
import { clearSessionCookie, readCookie, sessionCookieName } from './session-tokens';
import type { SessionsService } from './sessions.service';

/** Mounted on `/api` before the feature routers: sets `req.user` for a live session, and drops a dead cookie. */
export function loadSession(sessions: SessionsService, config: Pick<Config, 'NODE_ENV'>): RequestHandler {
  const cookieName = sessionCookieName(config);
  return async (req, res, next) => {
    const token = readCookie(req.headers.cookie, cookieName);
    if (!token) return next();
    const user = await sessions.resolve(token);
    if (user) req.user = user;
    else clearSessionCookie(res, config);
    next();
  };
}
