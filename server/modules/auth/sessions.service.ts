import type { Request } from 'express';
import type { Role } from '@shared/domain/vocabulary';
import type { Clock } from '../../lib/clock';
import type { SessionUser } from '../../middleware/require-role';
import type { AuthRepo } from './auth.repo';
import { SESSION_TOUCH_INTERVAL_MS, sessionEndsAt, sessionTimeouts } from './session-policy';
import { randomToken, tokenDigest, type SessionTokens } from './session-tokens';

export interface RequestContext {
  ip?: string | undefined;
  userAgent?: string | undefined;
}

export const requestContext = (req: Request): RequestContext => ({ ip: req.ip, userAgent: req.get('user-agent') });

export interface StartedSession {
  /** The cookie's value. */
  token: string;
  /** The cookie's lifetime: the session's absolute limit for this role. */
  maxAgeMs: number;
}

/**
 * Server-side sessions behind the signed cookie. A session is live while its row is not revoked,
 * its account is enabled, and neither the idle nor the absolute limit of the account's current
 * role has passed; every check reads the database, so revoking, disabling or a role change
 * takes effect on the very next request.
 */
export function createSessionsService({ repo, tokens, clock }: { repo: AuthRepo; tokens: SessionTokens; clock: Clock }) {
  return {
    async start(user: { id: string; role: Role }, context: RequestContext, inRepo: AuthRepo = repo): Promise<StartedSession> {
      const now = clock.now();
      const maxAgeMs = sessionTimeouts[user.role].absoluteMs;
      const expiresAt = new Date(now.getTime() + maxAgeMs);
      const sessionKey = randomToken();
      await inRepo.insertSession({
        id: tokenDigest(sessionKey),
        userId: user.id,
        createdAt: now,
        lastSeenAt: now,
        expiresAt,
        ip: context.ip ?? null,
        userAgent: context.userAgent?.slice(0, 300) ?? null,
      });
      return { token: await tokens.sign({ userId: user.id, sessionKey }, now, expiresAt), maxAgeMs };
    },

    /** Who a cookie belongs to, or undefined when it is forged, expired, revoked or its account disabled. */
    async resolve(token: string): Promise<SessionUser | undefined> {
      const now = clock.now();
      const claims = await tokens.verify(token, now);
      if (!claims) return undefined;
      const sessionId = tokenDigest(claims.sessionKey);
      const session = await repo.findSessionWithUser(sessionId);
      if (!session || session.userId !== claims.userId || session.user.disabledAt) return undefined;
      if (now >= session.expiresAt || now >= sessionEndsAt(session.user.role, session)) {
        await repo.revokeSession(sessionId, now);
        return undefined;
      }
      if (now.getTime() - session.lastSeenAt.getTime() >= SESSION_TOUCH_INTERVAL_MS) await repo.touchSession(sessionId, now);
      const { id, email, name, role } = session.user;
      return { id, email, name, role, sessionId };
    },

    async end(sessionId: string): Promise<void> {
      await repo.revokeSession(sessionId, clock.now());
    },

    async endAllFor(userId: string, inRepo: AuthRepo = repo): Promise<number> {
      return inRepo.revokeSessionsOfUser(userId, clock.now());
    },

    async endOthers(user: SessionUser): Promise<number> {
      return repo.revokeSessionsOfUser(user.id, clock.now(), user.sessionId);
    },
  };
}

export type SessionsService = ReturnType<typeof createSessionsService>;
