import { publicBaseUrl, type Config } from '../../config';
import type { Db } from '../../db/client';
import type { ApiMount } from '../../lib/api-module';
import type { Clock } from '../../lib/clock';
import type { Logger } from '../../lib/logger';
import type { AuditTrail } from '../audit';
import { createAuthRepo } from './auth.repo';
import { authRoutes } from './auth.routes';
import { createAuthService } from './auth.service';
import { loadSession } from './load-session';
import { createSessionTokens } from './session-tokens';
import { createSessionsService } from './sessions.service';
import { createThrottleRepo } from './throttle.repo';
import { createAuthThrottles } from './throttles';

// Named ports for the account and team modules, which sign people in and change their accounts too.
export { toUser } from './auth.service';
export { createAuthRepo as createUserAccounts, type AuthRepo as UserAccounts } from './auth.repo';
export { assertAcceptablePassword } from './password-policy';
export { randomToken, tokenDigest, writeSessionCookie } from './session-tokens';
export { requestContext, type RequestContext, type SessionsService, type StartedSession } from './sessions.service';
export type { AuthThrottles } from './throttles';

export interface AuthModuleDeps {
  config: Config;
  db: Db;
  logger: Logger;
  clock: Clock;
  audit: AuditTrail;
}

/**
 * Sign-up, sign-in and password resets at `/api/auth`, and what every other router relies on: the
 * session loader (`req.user`), the sessions service and the throttles.
 */
export function createAuthModule({ config, db, logger, clock, audit }: AuthModuleDeps) {
  const users = createAuthRepo(db);
  const sessions = createSessionsService({ repo: users, tokens: createSessionTokens(config), clock });
  const throttles = createAuthThrottles({ config, repo: createThrottleRepo(db), clock, logger, audit });
  const service = createAuthService({ repo: users, sessions, audit, clock, logger, baseUrl: publicBaseUrl(config) });
  return {
    mounts: [{ path: '/auth', router: authRoutes({ service, throttles, config }) }] satisfies ApiMount[],
    /** Sets `req.user` from the session cookie; mount it on the API router before the feature routers. */
    loadSession: loadSession(sessions, config),
    sessions,
    throttles,
  };
}
