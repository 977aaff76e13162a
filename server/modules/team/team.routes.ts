import { Router } from 'express';
import { z } from 'zod';
import type { UserResponse } from '@shared/schemas/auth';
import {
  acceptInvitationSchema,
  invitationPreviewRequestSchema,
  teamInvitationSchema,
  teamMemberUpdateSchema,
  type InvitationPreview,
  type PendingInvitation,
  type TeamMember,
  type TeamResponse,
} from '@shared/schemas/team';
import type { Config } from '../../config';
import { requireRole } from '../../middleware/require-role';
import { type AuthThrottles, requestContext, writeSessionCookie } from '../auth';
import type { TeamService } from './team.service';

const idParams = z.object({ id: z.uuid('No such record.') });

/** `/api/owner/team`: the owner's Team page. */
export function teamRoutes({ service }: { service: TeamService }): Router {
  const router = Router();
  router.use(requireRole('owner'));

  router.get('/', async (_req, res) => {
    res.json((await service.list()) satisfies TeamResponse);
  });

  router.post('/', async (req, res) => {
    const invitation = await service.invite(req.user!, teamInvitationSchema.parse(req.body), requestContext(req));
    res.status(201).json(invitation satisfies PendingInvitation);
  });

  router.patch('/:id', async (req, res) => {
    const { id } = idParams.parse(req.params);
    res.json((await service.updateMember(req.user!, id, teamMemberUpdateSchema.parse(req.body), requestContext(req))) satisfies TeamMember);
  });

  router.delete('/invitations/:id', async (req, res) => {
    const { id } = idParams.parse(req.params);
    await service.revokeInvitation(req.user!, id, requestContext(req));
    res.status(204).end();
  });

  return router;
}

/** `/api/auth/invitations`: public, for the person holding an invitation link (token in the body, never the URL). */
export function invitationRoutes({ service, throttles, config }: { service: TeamService; throttles: AuthThrottles; config: Pick<Config, 'NODE_ENV'> }): Router {
  const router = Router();

  router.post('/preview', ...throttles.linkTokens, async (req, res) => {
    const { token } = invitationPreviewRequestSchema.parse(req.body);
    res.json((await service.previewInvitation(token)) satisfies InvitationPreview);
  });

  router.post('/accept', ...throttles.linkTokens, async (req, res) => {
    const { user, session } = await service.acceptInvitation(acceptInvitationSchema.parse(req.body), requestContext(req));
    writeSessionCookie(res, config, session);
    res.status(201).json({ user } satisfies UserResponse);
  });

  return router;
}
