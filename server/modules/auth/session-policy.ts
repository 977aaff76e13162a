import type { Role } from '@shared/domain/vocabulary';

const MINUTE_MS = 60_000;
const HOUR_MS = 60 * MINUTE_MS;
const DAY_MS = 24 * HOUR_MS;

/**
 * How long a session lives (DEVELOPERS.md decision log has the reasons). Customers order every
 * few weeks and hold only their own data: 7 days idle, 30 days at most (NIST SP 800-63B AAL1).
 * Packers, staff and owner reach every customer's orders and addresses, and the owner refunds and runs
 * the team: 30 minutes idle, 12 hours at most, about one roast day (NIST SP 800-63B AAL2).
 * Read with the role the account has now, so a promotion shortens a live session at once.
 */
export const sessionTimeouts: Record<Role, { idleMs: number; absoluteMs: number }> = {
  customer: { idleMs: 7 * DAY_MS, absoluteMs: 30 * DAY_MS },
  packer: { idleMs: 30 * MINUTE_MS, absoluteMs: 12 * HOUR_MS },
  staff: { idleMs: 30 * MINUTE_MS, absoluteMs: 12 * HOUR_MS },
  owner: { idleMs: 30 * MINUTE_MS, absoluteMs: 12 * HOUR_MS },
};

/** Activity is written back at most this often, so a busy page does not write on every request. */
export const SESSION_TOUCH_INTERVAL_MS = MINUTE_MS;

export function sessionEndsAt(role: Role, session: { createdAt: Date; lastSeenAt: Date }): Date {
  const { idleMs, absoluteMs } = sessionTimeouts[role];
  return new Date(Math.min(session.createdAt.getTime() + absoluteMs, session.lastSeenAt.getTime() + idleMs));
}
