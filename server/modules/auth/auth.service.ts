import { passwordResetLinkPath, tokenLink, type PasswordResetConfirm, type SignInInput, type SignUpInput, type User } from '@shared/schemas/auth';
import { AppError } from '../../lib/app-error';
import type { Clock } from '../../lib/clock';
import type { Logger } from '../../lib/logger';
import { hashPassword, needsRehash, verifyPassword } from '../../lib/password-hashing';
import type { SessionUser } from '../../middleware/require-role';
import type { AuditTrail } from '../audit';
import { queueEmail } from '../outbox';
import { createAuthRepo, type AuthRepo } from './auth.repo';
import { assertAcceptablePassword } from './password-policy';
import { randomToken, tokenDigest } from './session-tokens';
import type { RequestContext, SessionsService, StartedSession } from './sessions.service';

/** A reset link works once, for 30 minutes. */
const PASSWORD_RESET_TTL_MS = 30 * 60_000;

export const toUser = ({ id, email, name, role }: Pick<SessionUser, 'id' | 'email' | 'name' | 'role'>): User => ({ id, email, name, role });

const invalidCredentials = () => new AppError(401, 'invalid_credentials', 'That e-mail address and password do not match an account.');
const invalidResetLink = () =>
  new AppError(400, 'reset_link_invalid', 'This reset link has expired or has already been used. Ask for a new one.', {
    token: 'This reset link has expired or has already been used.',
  });

export interface AuthServiceDeps {
  repo: AuthRepo;
  sessions: SessionsService;
  audit: AuditTrail;
  clock: Clock;
  logger: Logger;
  /** Where e-mailed links point: the shop's public address. */
  baseUrl: string;
}

export function createAuthService({ repo, sessions, audit, clock, logger, baseUrl }: AuthServiceDeps) {
  // An unknown e-mail is checked against this real hash, so it takes as long as a wrong password.
  let decoyHash: Promise<string> | undefined;
  const decoy = () => (decoyHash ??= hashPassword(randomToken()));

  return {
    async signUp(input: SignUpInput, context: RequestContext): Promise<{ user: User; session: StartedSession }> {
      assertAcceptablePassword(input.password, input);
      const emailTaken = () =>
        AppError.conflict('email_taken', 'An account with this e-mail address already exists. Sign in, or reset your password if you have forgotten it.');
      if (await repo.isEmailTaken(input.email)) throw emailTaken();
      const passwordHash = await hashPassword(input.password);
      const user = await repo.insertUser({ email: input.email, name: input.name, passwordHash, role: 'customer' });
      if (!user) throw emailTaken();
      const session = await sessions.start(user, context);
      await audit.record({ action: 'sign_up', actorId: user.id, ip: context.ip });
      return { user: toUser(user), session };
    },

    async signIn(input: SignInInput, context: RequestContext): Promise<{ user: User; session: StartedSession }> {
      const account = await repo.findUserByEmail(input.email);
      const passwordMatches = await verifyPassword(account?.passwordHash ?? (await decoy()), input.password);
      if (!account || !passwordMatches) {
        await audit.record({
          action: 'sign_in.failed',
          actorId: account?.id ?? null,
          ip: context.ip,
          detail: { reason: account ? 'wrong_password' : 'unknown_account' },
        });
        throw invalidCredentials();
      }
      if (account.disabledAt) {
        await audit.record({ action: 'sign_in.failed', actorId: account.id, ip: context.ip, detail: { reason: 'disabled' } });
        throw new AppError(403, 'account_disabled', 'This account has been turned off. Please contact the shop if you think this is a mistake.');
      }
      if (needsRehash(account.passwordHash)) await repo.updateUser(account.id, { passwordHash: await hashPassword(input.password) });
      const session = await sessions.start(account, context);
      await audit.record({ action: 'sign_in.succeeded', actorId: account.id, ip: context.ip, detail: { role: account.role } });
      return { user: toUser(account), session };
    },

    async signOut(user: SessionUser | undefined, context: RequestContext): Promise<void> {
      if (!user) return;
      await sessions.end(user.sessionId);
      await audit.record({ action: 'sign_out', actorId: user.id, ip: context.ip });
    },

    /**
     * Mails a single-use link when the address belongs to an enabled account, and does nothing
     * otherwise. The route has already answered 202 by the time this runs, so the answer and its
     * timing are the same either way; a failure is logged, never shown.
     */
    async requestPasswordReset(email: string, context: RequestContext): Promise<void> {
      try {
        const account = await repo.findUserByEmail(email);
        if (!account || account.disabledAt) return;
        const token = randomToken();
        const now = clock.now();
        const expiresAt = new Date(now.getTime() + PASSWORD_RESET_TTL_MS);
        await repo.transaction(async (tx) => {
          const { id } = await createAuthRepo(tx).insertResetToken({ tokenHash: tokenDigest(token), userId: account.id, createdAt: now, expiresAt });
          await queueEmail(tx, {
            template: 'password-reset',
            to: account.email,
            payload: { name: account.name, resetUrl: tokenLink(baseUrl, passwordResetLinkPath, token), expiresAt },
            dedupeKey: `password-reset:${id}`,
          });
        });
        await audit.record({ action: 'password_reset.requested', actorId: account.id, ip: context.ip });
      } catch (error) {
        logger.error({ err: error }, 'password reset e-mail could not be queued');
      }
    },

    /** Sets the new password, uses up every reset link of the account and ends all its sessions. */
    async confirmPasswordReset(input: PasswordResetConfirm, context: RequestContext): Promise<void> {
      const now = clock.now();
      const token = await repo.findUsableResetToken(tokenDigest(input.token), now);
      const account = token && (await repo.findUserById(token.userId));
      if (!token || !account || account.disabledAt) throw invalidResetLink();
      assertAcceptablePassword(input.password, account);
      const passwordHash = await hashPassword(input.password);
      await repo.transaction(async (tx) => {
        const txRepo = createAuthRepo(tx);
        if (!(await txRepo.useResetTokens(account.id, token.id, now))) throw invalidResetLink();
        await txRepo.updateUser(account.id, { passwordHash });
        await sessions.endAllFor(account.id, txRepo);
      });
      await audit.record({ action: 'password_reset.completed', actorId: account.id, ip: context.ip });
    },
  };
}

export type AuthService = ReturnType<typeof createAuthService>;
