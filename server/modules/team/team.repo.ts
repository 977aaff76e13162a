import { and, asc, desc, eq, gt, inArray, isNull } from 'drizzle-orm';
import { teamRoles, type TeamRole } from '@shared/schemas/team';
import type { DbOrTx, Tx } from '../../db/client';
import { invitations, users } from '../../db/schema/index';

const memberColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  disabledAt: users.disabledAt,
  createdAt: users.createdAt,
} as const;

export function createTeamRepo(db: DbOrTx) {
  return {
    transaction<T>(work: (tx: Tx) => Promise<T>): Promise<T> {
      return db.transaction(work);
    },

    /** The team's accounts (packers, staff, owners), owners first. */
    listMembers() {
      return db
        .select(memberColumns)
        .from(users)
        .where(inArray(users.role, [...teamRoles]))
        .orderBy(desc(users.role), asc(users.name));
    },

    async findMember(id: string) {
      const [member] = await db.select(memberColumns).from(users).where(eq(users.id, id));
      return member;
    },

    async updateMember(id: string, patch: Partial<Pick<typeof users.$inferInsert, 'role' | 'disabledAt'>>) {
      const [member] = await db.update(users).set(patch).where(eq(users.id, id)).returning(memberColumns);
      return member;
    },

    /** Invitations not yet accepted and not expired, newest first, with who sent them. */
    listPendingInvitations(now: Date) {
      return db
        .select({ id: invitations.id, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt, invitedBy: users.name })
        .from(invitations)
        .leftJoin(users, eq(users.id, invitations.invitedBy))
        .where(and(isNull(invitations.acceptedAt), gt(invitations.expiresAt, now)))
        .orderBy(desc(invitations.createdAt));
    },

    /** A new invitation for an address replaces any earlier one not yet accepted. */
    async replaceInvitation(values: { email: string; role: TeamRole; tokenHash: string; invitedBy: string; createdAt: Date; expiresAt: Date }) {
      await db.delete(invitations).where(and(eq(invitations.email, values.email), isNull(invitations.acceptedAt)));
      const [row] = await db.insert(invitations).values(values).returning({ id: invitations.id });
      return row!;
    },

    async deletePendingInvitation(id: string) {
      const deleted = await db
        .delete(invitations)
        .where(and(eq(invitations.id, id), isNull(invitations.acceptedAt)))
        .returning({ id: invitations.id });
      return deleted.length > 0;
    },

    async findUsableInvitation(tokenHash: string, now: Date) {
      const [row] = await db
        .select({ id: invitations.id, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt })
        .from(invitations)
        .where(and(eq(invitations.tokenHash, tokenHash), isNull(invitations.acceptedAt), gt(invitations.expiresAt, now)));
      return row;
    },

    /** True for the one request that accepts a still-open invitation. */
    async markAccepted(id: string, now: Date) {
      const accepted = await db
        .update(invitations)
        .set({ acceptedAt: now })
        .where(and(eq(invitations.id, id), isNull(invitations.acceptedAt), gt(invitations.expiresAt, now)))
        .returning({ id: invitations.id });
      return accepted.length > 0;
    },
  };
}

export type TeamRepo = ReturnType<typeof createTeamRepo>;
