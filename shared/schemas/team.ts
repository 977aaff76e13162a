import { z } from 'zod';
import { roles } from '../domain/vocabulary';
import { emailSchema, linkTokenSchema, newPasswordSchema, personNameSchema } from './auth';

/** Roles the owner can invite someone into; customers sign themselves up. */
export const teamRoles = ['packer', 'staff', 'owner'] as const;
export type TeamRole = (typeof teamRoles)[number];

export const teamMemberSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: z.enum(roles),
  disabled: z.boolean(),
  joinedAt: z.iso.datetime(),
});
export type TeamMember = z.infer<typeof teamMemberSchema>;

export const pendingInvitationSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  role: z.enum(teamRoles),
  invitedBy: z.string().nullable(),
  expiresAt: z.iso.datetime(),
});
export type PendingInvitation = z.infer<typeof pendingInvitationSchema>;

/** `GET /api/owner/team` → staff and owner accounts (disabled ones too) and invitations not yet accepted or expired. */
export const teamResponseSchema = z.object({
  members: z.array(teamMemberSchema),
  invitations: z.array(pendingInvitationSchema),
});
export type TeamResponse = z.infer<typeof teamResponseSchema>;

/** `POST /api/owner/team` → 201 PendingInvitation; the invitation link goes out by e-mail. */
export const teamInvitationSchema = z.object({
  email: emailSchema,
  role: z.enum(teamRoles).default('staff'),
});
export type TeamInvitationInput = z.infer<typeof teamInvitationSchema>;

/**
 * `PATCH /api/owner/team/:userId` → 200 TeamMember. Takes effect on the person's next request;
 * disabling also ends their sessions. The owner cannot change or disable their own account.
 */
export const teamMemberUpdateSchema = z
  .object({
    role: z.enum(roles).optional(),
    disabled: z.boolean().optional(),
  })
  .refine((update) => update.role !== undefined || update.disabled !== undefined, {
    message: 'Change the role, the access, or both.',
  });
export type TeamMemberUpdate = z.infer<typeof teamMemberUpdateSchema>;

/** `POST /api/auth/invitations/preview` {token} → 200 InvitationPreview, or 404 when the link is used or expired. */
export const invitationPreviewRequestSchema = z.object({ token: linkTokenSchema });
export const invitationPreviewSchema = z.object({
  email: z.string(),
  role: z.enum(teamRoles),
  expiresAt: z.iso.datetime(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

/** `POST /api/auth/invitations/accept` → 201 {user}, signed in. */
export const acceptInvitationSchema = z.object({
  token: linkTokenSchema,
  name: personNameSchema,
  password: newPasswordSchema,
});
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;
