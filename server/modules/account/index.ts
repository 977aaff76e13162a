import type { PostalAddressInput } from '@shared/schemas/address';
import type { Config } from '../../config';
import type { Db } from '../../db/client';
import type { ApiModule } from '../../lib/api-module';
import type { AuditTrail } from '../audit';
import { createUserAccounts, type AuthThrottles, type SessionsService } from '../auth';
import { createAccountRepo } from './account.repo';
import { accountRoutes } from './account.routes';
import { createAccountService } from './account.service';

export interface AccountModuleDeps {
  config: Config;
  db: Db;
  audit: AuditTrail;
  sessions: SessionsService;
  throttles: AuthThrottles;
}

/** A signed-in account's own profile, e-mail, password and addresses. */
export function createAccountModule({ config, db, audit, sessions, throttles }: AccountModuleDeps): ApiModule {
  const service = createAccountService({ repo: createAccountRepo(db), authRepo: createUserAccounts(db), sessions, audit });
  return { mounts: [{ path: '/account', router: accountRoutes({ service, throttles, config }) }] };
}

/** For checkouts: keeps the address a customer asked to save for next time in their address book. */
export interface AddressBook {
  keep(userId: string, address: PostalAddressInput): Promise<void>;
}

export function createAddressBook(db: Db): AddressBook {
  const repo = createAccountRepo(db);
  return { keep: (userId, address) => repo.keepAddress(userId, address) };
}
