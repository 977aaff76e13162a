import { Router } from 'express';
import { z } from 'zod';
import {
  addressInputSchema,
  emailChangeSchema,
  passwordChangeSchema,
  profileUpdateSchema,
  type Address,
  type AddressListResponse,
} from '@shared/schemas/account';
import type { UserResponse } from '@shared/schemas/auth';
import type { Config } from '../../config';
import { requireUser } from '../../middleware/require-role';
import { type AuthThrottles, requestContext, writeSessionCookie } from '../auth';
import type { AccountService } from './account.service';

const addressParams = z.object({ id: z.uuid('No such address.') });

/** `/api/account`: the signed-in person's own account, whatever their role. */
export function accountRoutes({ service, throttles, config }: { service: AccountService; throttles: AuthThrottles; config: Pick<Config, 'NODE_ENV'> }): Router {
  const router = Router();
  router.use(requireUser);

  router.patch('/profile', async (req, res) => {
    const user = await service.updateProfile(req.user!, profileUpdateSchema.parse(req.body));
    res.json({ user } satisfies UserResponse);
  });

  router.put('/email', ...throttles.reauthentication, async (req, res) => {
    const user = await service.changeEmail(req.user!, emailChangeSchema.parse(req.body), requestContext(req));
    res.json({ user } satisfies UserResponse);
  });

  router.put('/password', ...throttles.reauthentication, async (req, res) => {
    const session = await service.changePassword(req.user!, passwordChangeSchema.parse(req.body), requestContext(req));
    writeSessionCookie(res, config, session);
    res.status(204).end();
  });

  router.get('/addresses', async (req, res) => {
    res.json({ items: await service.listAddresses(req.user!) } satisfies AddressListResponse);
  });

  router.post('/addresses', async (req, res) => {
    const address = await service.addAddress(req.user!, addressInputSchema.parse(req.body));
    res.status(201).json(address satisfies Address);
  });

  router.put('/addresses/:id', async (req, res) => {
    const { id } = addressParams.parse(req.params);
    res.json((await service.replaceAddress(req.user!, id, addressInputSchema.parse(req.body))) satisfies Address);
  });

  router.delete('/addresses/:id', async (req, res) => {
    const { id } = addressParams.parse(req.params);
    await service.deleteAddress(req.user!, id);
    res.status(204).end();
  });

  return router;
}
