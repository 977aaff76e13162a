import { publicBaseUrl, type Config } from '../../config';
import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import type { Clock } from '../../lib/clock';
import type { AuditTrail } from '../audit';
import { createUserAccounts, type AuthThrottles, type SessionsService } from '../auth';
import { createTeamRepo } from './team.repo';
import { invitationRoutes, teamRoutes } from './team.routes';
import { createTeamService } from './team.service';

export interface TeamModuleDeps {
  config: Config;
  db: Db;
  clock: Clock;
  audit: AuditTrail;
  sessions: SessionsService;
  throttles: AuthThrottles;
}

/** The owner's team (`/api/owner/team`) and the invitation links a new member opens (`/api/auth/invitations`). */
export function createTeamModule({ config, db, clock, audit, sessions, throttles }: TeamModuleDeps): ApiModule {
  const service = createTeamService({ repo: createTeamRepo(db), authRepo: createUserAccounts(db), sessions, audit, clock, baseUrl: publicBaseUrl(config) });
  return {
    mounts: [
      { path: '/auth/invitations', router: invitationRoutes({ service, throttles, config }) },
      { path: '/owner/team', router: teamRoutes({ service }) },
    ],
  };
}
