import type { Router } from 'express';
import type { AppDeps } from '../../app';
import { createAccountRepo } from '../account/account.repo';
import { accountRoutes } from '../account/account.routes';
import { createAccountService } from '../account/account.service';
import { createAuditRepo } from '../audit/audit.repo';
import { auditDenials, createAuditTrail } from '../audit/audit-trail';
import { createTeamRepo } from '../team/team.repo';
import { invitationRoutes, teamRoutes } from '../team/team.routes';
import { createTeamService } from '../team/team.service';
import { createAuthRepo } from './auth.repo';
import { authRoutes } from './auth.routes';
import { createAuthService } from './auth.service';
import { loadSession } from './load-session';
import { createSessionTokens } from './session-tokens';
import { createSessionsService } from './sessions.service';
import { createThrottleRepo } from './throttle.repo';
import { createAuthThrottles } from './throttles';

/**
 * Accounts, roles and the security baseline, wired once for createApp: the session loader to
 * mount before every feature router, the routers, and the audit step for refused requests.
 */
export function createAccountsModule({ config, database, logger, clock }: AppDeps) {
  const db = database.db;
  const authRepo = createAuthRepo(db);
  const audit = createAuditTrail({ repo: createAuditRepo(db), logger, clock });
  const sessions = createSessionsService({ repo: authRepo, tokens: createSessionTokens(config), clock });
  const throttles = createAuthThrottles({ config, repo: createThrottleRepo(db), clock, logger, audit });
  const baseUrl = config.PUBLIC_URL ?? `http://${config.HOST}:${config.PORT}`;
  const teamService = createTeamService({ repo: createTeamRepo(db), authRepo, sessions, audit, clock, baseUrl });

  const routers: [path: string, router: Router][] = [
    ['/auth/invitations', invitationRoutes({ service: teamService, throttles, config })],
    ['/auth', authRoutes({ service: createAuthService({ repo: authRepo, sessions, audit, clock, logger, baseUrl }), throttles, config })],
    ['/account', accountRoutes({ service: createAccountService({ repo: createAccountRepo(db), authRepo, sessions, audit }), throttles, config })],
    ['/owner/team', teamRoutes({ service: teamService })],
  ];

  return {
    /** Sets `req.user` from the session cookie; mount it on the API router before the feature routers. */
    loadSession: loadSession(sessions, config),
    routers,
    /** Records every 401 and 403; mount it on the API router after everything else. */
    auditDenials: auditDenials(audit),
  };
}
