import type { AddressInput, EmailChange, PasswordChange, ProfileUpdate } from '@shared/schemas/account';
import type { User } from '@shared/schemas/auth';
import { AppError } from '../../lib/app-error';
import { hashPassword, verifyPassword } from '../../lib/password-hashing';
import type { SessionUser } from '../../middleware/require-role';
import type { AuditTrail } from '../audit';
import {
  assertAcceptablePassword,
  createUserAccounts,
  type RequestContext,
  type SessionsService,
  type StartedSession,
  toUser,
  type UserAccounts,
} from '../auth';
import type { AccountRepo } from './account.repo';

export interface AccountServiceDeps {
  repo: AccountRepo;
  authRepo: UserAccounts;
  sessions: SessionsService;
  audit: AuditTrail;
}

/** The signed-in person's own account: profile, e-mail, password and address book. */
export function createAccountService({ repo, authRepo, sessions, audit }: AccountServiceDeps) {
  /** Re-authentication: the current password, checked against the stored hash. */
  async function assertCurrentPassword(user: SessionUser, password: string) {
    const account = await authRepo.findUserById(user.id);
    if (!account || !(await verifyPassword(account.passwordHash, password))) {
      throw new AppError(400, 'wrong_password', 'That is not your current password.', { currentPassword: 'That is not your current password.' });
    }
  }

  const addressNotFound = () => new AppError(404, 'address_not_found', 'That address is not in your address book.');

  return {
    async updateProfile(user: SessionUser, update: ProfileUpdate): Promise<User> {
      return toUser((await authRepo.updateUser(user.id, { name: update.name }))!);
    },

    /** Changes the sign-in address after the current password; every other session ends. */
    async changeEmail(user: SessionUser, change: EmailChange, context: RequestContext): Promise<User> {
      await assertCurrentPassword(user, change.currentPassword);
      if (change.email === user.email) return toUser(user);
      if (await authRepo.isEmailTaken(change.email, user.id)) {
        throw new AppError(409, 'email_taken', 'Another account already uses that e-mail address.', {
          email: 'Another account already uses that e-mail address.',
        });
      }
      const updated = await authRepo.updateUser(user.id, { email: change.email });
      await sessions.endOthers(user);
      await audit.record({ action: 'email.changed', actorId: user.id, ip: context.ip });
      return toUser(updated!);
    },

    /** Sets a new password and ends every session of the account, this one too; returns a fresh one for this device. */
    async changePassword(user: SessionUser, change: PasswordChange, context: RequestContext): Promise<StartedSession> {
      await assertCurrentPassword(user, change.currentPassword);
      assertAcceptablePassword(change.newPassword, user, 'newPassword');
      const passwordHash = await hashPassword(change.newPassword);
      const session = await authRepo.transaction(async (tx) => {
        const txRepo = createUserAccounts(tx);
        await txRepo.updateUser(user.id, { passwordHash });
        await sessions.endAllFor(user.id, txRepo);
        return sessions.start(user, context, txRepo);
      });
      await audit.record({ action: 'password.changed', actorId: user.id, ip: context.ip });
      return session;
    },

    listAddresses: (user: SessionUser) => repo.listAddresses(user.id),

    addAddress: (user: SessionUser, input: AddressInput) => repo.addAddress(user.id, input),

    async replaceAddress(user: SessionUser, id: string, input: AddressInput) {
      const address = await repo.replaceAddress(user.id, id, input);
      if (!address) throw addressNotFound();
      return address;
    },

    async deleteAddress(user: SessionUser, id: string): Promise<void> {
      if (!(await repo.deleteAddress(user.id, id))) throw addressNotFound();
    },
  };
}

export type AccountService = ReturnType<typeof createAccountService>;
