import { and, eq, gt, isNull, ne } from 'drizzle-orm';
import type { DbOrTx, Tx } from '../../db/client';
import { passwordResetTokens, sessions, users } from '../../db/schema/index';

const publicUserColumns = { id: users.id, email: users.email, name: users.name, role: users.role } as const;

export function createAuthRepo(db: DbOrTx) {
  return {
    /** Runs `work` in one transaction; bind repos to `tx` with their create functions (and pass it to `queueEmail`). */
    transaction<T>(work: (tx: Tx) => Promise<T>): Promise<T> {
      return db.transaction(work);
    },

    async findUserByEmail(email: string) {
      const [user] = await db
        .select({ ...publicUserColumns, passwordHash: users.passwordHash, disabledAt: users.disabledAt })
        .from(users)
        .where(eq(users.email, email));
      return user;
    },

    async findUserById(id: string) {
      const [user] = await db
        .select({ ...publicUserColumns, passwordHash: users.passwordHash, disabledAt: users.disabledAt })
        .from(users)
        .where(eq(users.id, id));
      return user;
    },

    /** The new account, or undefined when the e-mail address already has one. */
    async insertUser(values: typeof users.$inferInsert) {
      const [user] = await db.insert(users).values(values).onConflictDoNothing({ target: users.email }).returning(publicUserColumns);
      return user;
    },

    async updateUser(id: string, patch: Partial<Pick<typeof users.$inferInsert, 'name' | 'email' | 'passwordHash' | 'role' | 'disabledAt'>>) {
      const [user] = await db.update(users).set(patch).where(eq(users.id, id)).returning(publicUserColumns);
      return user;
    },

    async isEmailTaken(email: string, exceptUserId?: string) {
      const [row] = await db
        .select({ id: users.id })
        .from(users)
        .where(exceptUserId ? and(eq(users.email, email), ne(users.id, exceptUserId)) : eq(users.email, email));
      return row !== undefined;
    },

    async insertSession(values: typeof sessions.$inferInsert) {
      await db.insert(sessions).values(values);
    },

    /** A session that was not revoked, with its account as it is now. */
    async findSessionWithUser(id: string) {
      const [row] = await db
        .select({
          id: sessions.id,
          userId: sessions.userId,
          createdAt: sessions.createdAt,
          lastSeenAt: sessions.lastSeenAt,
          expiresAt: sessions.expiresAt,
          user: { ...publicUserColumns, disabledAt: users.disabledAt },
        })
        .from(sessions)
        .innerJoin(users, eq(users.id, sessions.userId))
        .where(and(eq(sessions.id, id), isNull(sessions.revokedAt)));
      return row;
    },

    async touchSession(id: string, now: Date) {
      await db.update(sessions).set({ lastSeenAt: now }).where(eq(sessions.id, id));
    },

    async revokeSession(id: string, now: Date) {
      await db
        .update(sessions)
        .set({ revokedAt: now })
        .where(and(eq(sessions.id, id), isNull(sessions.revokedAt)));
    },

    /** Ends every live session of the account but `keepSessionId`; returns how many. */
    async revokeSessionsOfUser(userId: string, now: Date, keepSessionId?: string) {
      const live = and(eq(sessions.userId, userId), isNull(sessions.revokedAt));
      const revoked = await db
        .update(sessions)
        .set({ revokedAt: now })
        .where(keepSessionId ? and(live, ne(sessions.id, keepSessionId)) : live)
        .returning({ id: sessions.id });
      return revoked.length;
    },

    async insertResetToken(values: typeof passwordResetTokens.$inferInsert) {
      const [row] = await db.insert(passwordResetTokens).values(values).returning({ id: passwordResetTokens.id });
      return row!;
    },

    async findUsableResetToken(tokenHash: string, now: Date) {
      const [row] = await db
        .select({ id: passwordResetTokens.id, userId: passwordResetTokens.userId })
        .from(passwordResetTokens)
        .where(and(eq(passwordResetTokens.tokenHash, tokenHash), isNull(passwordResetTokens.usedAt), gt(passwordResetTokens.expiresAt, now)));
      return row;
    },

    /**
     * Marks every unused reset token of the account used. True when `tokenId` was still unused:
     * of two requests racing with the same link, only one sees true.
     */
    async useResetTokens(userId: string, tokenId: string, now: Date) {
      const used = await db
        .update(passwordResetTokens)
        .set({ usedAt: now })
        .where(and(eq(passwordResetTokens.userId, userId), isNull(passwordResetTokens.usedAt)))
        .returning({ id: passwordResetTokens.id });
      return used.some((row) => row.id === tokenId);
    },
  };
}

export type AuthRepo = ReturnType<typeof createAuthRepo>;
