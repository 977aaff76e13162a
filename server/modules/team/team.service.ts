import type { User } from '@shared/schemas/auth';
import { invitationLinkPath, tokenLink } from '@shared/schemas/auth';
import {
  teamRoles,
  type AcceptInvitationInput,
  type InvitationPreview,
  type PendingInvitation,
  type TeamInvitationInput,
  type TeamMember,
  type TeamMemberUpdate,
  type TeamResponse,
  type TeamRole,
} from '@shared/schemas/team';
import { AppError } from '../../lib/app-error';
import type { Clock } from '../../lib/clock';
import { hashPassword } from '../../lib/password-hashing';
import type { SessionUser } from '../../middleware/require-role';
import type { AuditTrail } from '../audit';
import {
  assertAcceptablePassword,
  createUserAccounts,
  randomToken,
  type RequestContext,
  type SessionsService,
  type StartedSession,
  tokenDigest,
  toUser,
  type UserAccounts,
} from '../auth';
import { queueEmail } from '../outbox';
import { createTeamRepo, type TeamRepo } from './team.repo';

/** An invitation link works once, for 7 days: long enough to reach someone on their days off. */
const INVITATION_TTL_MS = 7 * 24 * 60 * 60_000;

const asTeamRole = (role: string): TeamRole => ((teamRoles as readonly string[]).includes(role) ? (role as TeamRole) : 'staff');

const toMember = (row: { id: string; email: string; name: string; role: TeamMember['role']; disabledAt: Date | null; createdAt: Date }): TeamMember => ({
  id: row.id,
  email: row.email,
  name: row.name,
  role: row.role,
  disabled: row.disabledAt !== null,
  joinedAt: row.createdAt.toISOString(),
});

const invitationInvalid = () =>
  new AppError(404, 'invitation_invalid', 'This invitation has expired, was withdrawn or has already been used. Ask the owner for a new one.');

export interface TeamServiceDeps {
  repo: TeamRepo;
  authRepo: UserAccounts;
  sessions: SessionsService;
  audit: AuditTrail;
  clock: Clock;
  /** Where e-mailed links point: the shop's public address. */
  baseUrl: string;
}

/** The owner's Team page, and the invitation link a new team member follows. */
export function createTeamService({ repo, authRepo, sessions, audit, clock, baseUrl }: TeamServiceDeps) {
  return {
    async list(): Promise<TeamResponse> {
      const [members, invitations] = await Promise.all([repo.listMembers(), repo.listPendingInvitations(clock.now())]);
      return {
        members: members.map(toMember),
        invitations: invitations.map((row) => ({ ...row, role: asTeamRole(row.role), expiresAt: row.expiresAt.toISOString() })),
      };
    },

    /** Writes the invitation and its e-mail in one transaction; a repeat invitation replaces the earlier link. */
    async invite(owner: SessionUser, input: TeamInvitationInput, context: RequestContext): Promise<PendingInvitation> {
      if (await authRepo.isEmailTaken(input.email)) {
        throw new AppError(409, 'account_exists', 'Someone already has an account with this e-mail address. Invite a different address.', {
          email: 'This address already has an account.',
        });
      }
      const token = randomToken();
      const now = clock.now();
      const expiresAt = new Date(now.getTime() + INVITATION_TTL_MS);
      const { id } = await repo.transaction(async (tx) => {
        const invitation = await createTeamRepo(tx).replaceInvitation({
          email: input.email,
          role: input.role,
          tokenHash: tokenDigest(token),
          invitedBy: owner.id,
          createdAt: now,
          expiresAt,
        });
        await queueEmail(tx, {
          template: 'staff-invitation',
          to: input.email,
          payload: { invitedByName: owner.name, role: input.role, acceptUrl: tokenLink(baseUrl, invitationLinkPath, token), expiresAt },
          dedupeKey: `staff-invitation:${invitation.id}`,
        });
        return invitation;
      });
      await audit.record({ action: 'team.invited', actorId: owner.id, ip: context.ip, detail: { invitationId: id, role: input.role } });
      return { id, email: input.email, role: input.role, invitedBy: owner.name, expiresAt: expiresAt.toISOString() };
    },

    async revokeInvitation(owner: SessionUser, id: string, context: RequestContext): Promise<void> {
      if (!(await repo.deletePendingInvitation(id))) throw AppError.notFound('That invitation');
      await audit.record({ action: 'team.invitation_revoked', actorId: owner.id, ip: context.ip, detail: { invitationId: id } });
    },

    /**
     * Role and access changes apply on the person's next request (sessions read the account each
     * time); disabling also ends their sessions. No one changes their own access, so the shop
     * always keeps the owner who is making changes.
     */
    async updateMember(owner: SessionUser, userId: string, update: TeamMemberUpdate, context: RequestContext): Promise<TeamMember> {
      if (userId === owner.id) {
        throw new AppError(422, 'cannot_change_own_access', 'You cannot change your own role or turn off your own account.');
      }
      const member = await repo.findMember(userId);
      if (!member) throw AppError.notFound('That person');
      const disabledAt = update.disabled === undefined ? undefined : update.disabled ? (member.disabledAt ?? clock.now()) : null;
      const updated = (await repo.updateMember(userId, {
        ...(update.role ? { role: update.role } : {}),
        ...(disabledAt === undefined ? {} : { disabledAt }),
      }))!;
      if (update.role && update.role !== member.role) {
        await audit.record({ action: 'team.role_changed', actorId: owner.id, ip: context.ip, detail: { userId, from: member.role, to: update.role } });
      }
      if (update.disabled === true && !member.disabledAt) {
        await sessions.endAllFor(userId);
        await audit.record({ action: 'team.disabled', actorId: owner.id, ip: context.ip, detail: { userId } });
      }
      if (update.disabled === false && member.disabledAt) {
        await audit.record({ action: 'team.enabled', actorId: owner.id, ip: context.ip, detail: { userId } });
      }
      return toMember(updated);
    },

    async previewInvitation(token: string): Promise<InvitationPreview> {
      const invitation = await repo.findUsableInvitation(tokenDigest(token), clock.now());
      if (!invitation) throw invitationInvalid();
      return { email: invitation.email, role: asTeamRole(invitation.role), expiresAt: invitation.expiresAt.toISOString() };
    },

    /** Creates the team member's account from the link and signs them in. */
    async acceptInvitation(input: AcceptInvitationInput, context: RequestContext): Promise<{ user: User; session: StartedSession }> {
      const now = clock.now();
      const invitation = await repo.findUsableInvitation(tokenDigest(input.token), now);
      if (!invitation) throw invitationInvalid();
      assertAcceptablePassword(input.password, { email: invitation.email, name: input.name });
      const passwordHash = await hashPassword(input.password);
      const { user, session } = await repo.transaction(async (tx) => {
        if (!(await createTeamRepo(tx).markAccepted(invitation.id, now))) throw invitationInvalid();
        const txAuth = createUserAccounts(tx);
        const created = await txAuth.insertUser({ email: invitation.email, name: input.name, passwordHash, role: asTeamRole(invitation.role) });
        if (!created) throw new AppError(409, 'account_exists', 'This e-mail address already has an account. Sign in instead.');
        return { user: created, session: await sessions.start(created, context, txAuth) };
      });
      await audit.record({ action: 'team.joined', actorId: user.id, ip: context.ip, detail: { invitationId: invitation.id, role: user.role } });
      return { user: toUser(user), session };
    },
  };
}

export type TeamService = ReturnType<typeof createTeamService>;
