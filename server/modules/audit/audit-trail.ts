import type { ErrorRequestHandler, Request } from 'express';
import type { Clock } from '../../lib/clock';
import type { Logger } from '../../lib/logger';
import { AppError } from '../../lib/app-error';
import type { AuditRepo } from './audit.repo';

export type AuditAction =
  | 'sign_in.succeeded'
  | 'sign_in.failed'
  | 'throttled'
  | 'sign_out'
  | 'sign_up'
  | 'password_reset.requested'
  | 'password_reset.completed'
  | 'password.changed'
  | 'email.changed'
  | 'team.invited'
  | 'team.invitation_revoked'
  | 'team.joined'
  | 'team.role_changed'
  | 'team.disabled'
  | 'team.enabled'
  | 'rotation.picked'
  | 'order.cancelled'
  | 'order.email_resent'
  | 'order.address_corrected'
  | 'order.note_saved'
  | 'subscription.changed_by_staff'
  | 'access.denied';

export interface AuditEvent {
  action: AuditAction;
  /** The account acting (or tried), when known. */
  actorId?: string | null;
  ip?: string | null;
  /** Ids, codes and reasons only: never a password, token, link or cookie. */
  detail?: Record<string, string | number | boolean | null>;
}

/**
 * Security events go to two places: a row in audit_log (kept, queryable) and a log line, both
 * stamped in UTC. Recording never fails the request it describes.
 */
export function createAuditTrail({ repo, logger, clock }: { repo: AuditRepo; logger: Logger; clock: Clock }) {
  return {
    async record(event: AuditEvent): Promise<void> {
      const at = clock.now();
      const detail = event.detail ?? {};
      logger.info({ audit: event.action, actorId: event.actorId ?? null, ip: event.ip ?? null, at: at.toISOString(), ...detail }, `audit ${event.action}`);
      try {
        await repo.insert({ at, action: event.action, actorId: event.actorId ?? null, ip: event.ip ?? null, detail });
      } catch (error) {
        logger.warn({ err: error, audit: event.action }, 'audit record could not be written');
      }
    },
  };
}

export type AuditTrail = ReturnType<typeof createAuditTrail>;

/** Recorded elsewhere or not a refusal: `GET /api/auth/me` answers "who am I?", and sign-in records its own failures. */
const notDenials = new Set(['not_signed_in', 'invalid_credentials', 'account_disabled']);

/**
 * Error middleware at the end of the API router: every 401 and 403 (no session, wrong role,
 * missing client header, foreign Origin) is recorded before the error handler answers it.
 */
export function auditDenials(trail: AuditTrail): ErrorRequestHandler {
  return async (error, req: Request, _res, next) => {
    if (error instanceof AppError && (error.status === 401 || error.status === 403) && !notDenials.has(error.code)) {
      await trail.record({
        action: 'access.denied',
        actorId: req.user?.id ?? null,
        ip: req.ip ?? null,
        detail: { status: error.status, code: error.code, method: req.method, path: req.baseUrl + req.path, role: req.user?.role ?? null },
      });
    }
    next(error);
  };
}
