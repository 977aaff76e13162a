import type { DbOrTx } from '../../db/client';
import type { Clock } from '../../lib/clock';
import type { Logger } from '../../lib/logger';
import { createAuditRepo } from './audit.repo';
import { createAuditTrail, type AuditTrail } from './audit-trail';

export { auditDenials, type AuditAction, type AuditEvent, type AuditTrail } from './audit-trail';

/** The one audit trail of the app: security events and staff actions, kept in the database. */
export function createAudit({ db, logger, clock }: { db: DbOrTx; logger: Logger; clock: Clock }): AuditTrail {
  return createAuditTrail({ repo: createAuditRepo(db), logger, clock });
}
