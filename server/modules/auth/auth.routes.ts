import { Router } from 'express';
import { passwordResetConfirmSchema, passwordResetRequestSchema, signInSchema, signUpSchema, type MeResponse, type UserResponse } from '@shared/schemas/auth';
import type { Config } from '../../config';
import { clearSessionCookie, writeSessionCookie } from './session-tokens';
import { requestContext } from './sessions.service';
import { toUser, type AuthService } from './auth.service';
import type { AuthThrottles } from './throttles';

/** `/api/auth`: every route here is public; each answers for the caller's own session only. */
export function authRoutes({ service, throttles, config }: { service: AuthService; throttles: AuthThrottles; config: Pick<Config, 'NODE_ENV'> }): Router {
  const router = Router();

  router.post('/sign-up', ...throttles.signUp, async (req, res) => {
    const { user, session } = await service.signUp(signUpSchema.parse(req.body), requestContext(req));
    writeSessionCookie(res, config, session);
    res.status(201).json({ user } satisfies UserResponse);
  });

  router.post('/sign-in', ...throttles.signIn, async (req, res) => {
    const { user, session } = await service.signIn(signInSchema.parse(req.body), requestContext(req));
    writeSessionCookie(res, config, session);
    res.json({ user } satisfies UserResponse);
  });

  router.post('/sign-out', async (req, res) => {
    await service.signOut(req.user, requestContext(req));
    clearSessionCookie(res, config);
    res.status(204).end();
  });

  router.get('/me', (req, res) => {
    res.json({ user: req.user ? toUser(req.user) : null } satisfies MeResponse);
  });

  router.post('/password-reset', ...throttles.passwordReset, async (req, res) => {
    const { email } = passwordResetRequestSchema.parse(req.body);
    // Answer first: the same 202, just as fast, whether or not the address has an account.
    res.status(202).end();
    await service.requestPasswordReset(email, requestContext(req));
  });

  router.post('/password-reset/confirm', ...throttles.linkTokens, async (req, res) => {
    await service.confirmPasswordReset(passwordResetConfirmSchema.parse(req.body), requestContext(req));
    clearSessionCookie(res, config);
    res.status(204).end();
  });

  return router;
}
