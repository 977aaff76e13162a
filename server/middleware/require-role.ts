import type { RequestHandler } from 'express';
import type { Role } from '@shared/domain/vocabulary';
import { AppError } from '../lib/app-error';

/** Who is signed in, as the session middleware (the auth module's loadSession) found them on this request. */
export interface SessionUser {
  id: string;
  email: string;
  name: string;
  role: Role;
  /** Hash of the session's id (the JWT's jti), as stored in the sessions table. */
  sessionId: string;
}

declare module 'express-serve-static-core' {
  interface Request {
    /** Set for a live session of an enabled account; role and name are read fresh on every request. */
    user?: SessionUser;
  }
}

const signInRequired = () => new AppError(401, 'sign_in_required', 'Please sign in to continue.');

/** Who may call a route: anyone, any signed-in account, the packer (and staff and the owner), staff (and the owner), or the owner alone. */
export type AccessRule = 'public' | 'customer' | 'packer' | 'staff' | 'owner';

const accessRules = new WeakMap<RequestHandler, AccessRule>();

/** The rule a guard enforces, or undefined for a handler that is not a guard (`npm run routes` reads it). */
export const accessRuleOf = (handler: RequestHandler): AccessRule | undefined => accessRules.get(handler);

function guard(rule: AccessRule, handler: RequestHandler): RequestHandler {
  accessRules.set(handler, rule);
  return handler;
}

/** Any signed-in account; routes behind it must still keep each customer to their own records. */
export const requireUser: RequestHandler = guard('customer', (req, _res, next) => {
  next(req.user ? undefined : signInRequired());
});

/** The Pack List, shipping and reading orders: the packer's work, which staff and the owner do too. */
export const packingRoles: readonly Role[] = ['packer', 'staff', 'owner'];

/** Signed in with one of `roles` (list every role allowed: `requireRole('staff', 'owner')`). */
export function requireRole(...roles: Role[]): RequestHandler {
  const allowed = new Set(roles);
  // The least role allowed names the rule: staff routes are open to the owner too.
  const rule: AccessRule = allowed.has('customer') ? 'customer' : allowed.has('packer') ? 'packer' : allowed.has('staff') ? 'staff' : 'owner';
  return guard(rule, (req, _res, next) => {
    if (!req.user) return next(signInRequired());
    if (!allowed.has(req.user.role)) return next(new AppError(403, 'forbidden', 'Your account does not have access to this.'));
    next();
  });
}
