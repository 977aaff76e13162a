// Invented test accounts, written straight to the test database (they sign in through the real API:
// tests/setup/test-users.ts).
import { randomUUID } from 'node:crypto';
import type { Role } from '@shared/domain/vocabulary';
import { users } from '../../server/db/schema/index';
import { hashPassword } from '../../server/lib/password-hashing';
import { getTestDb } from '../setup/test-db';
import { testAddress } from './unique';

/** Every test account's password (long, and on no common-password list). */
export const TEST_PASSWORD = 'quiet harbour kettle 42';

let testPasswordHash: Promise<string> | undefined;

export interface TestUser {
  id: string;
  email: string;
  name: string;
  role: Role;
  password: string;
}

/** A fresh account with a unique e-mail address, so test files never collide. */
export async function createTestUser(role: Role = 'customer', overrides: { name?: string; email?: string } = {}): Promise<TestUser> {
  testPasswordHash ??= hashPassword(TEST_PASSWORD);
  const email = overrides.email ?? `${role}-${randomUUID().slice(0, 12)}@example.test`;
  const name = overrides.name ?? `Test ${role} ${email.slice(role.length + 1, role.length + 7)}`;
  const [row] = await getTestDb()
    .insert(users)
    .values({ email, name, role, passwordHash: await testPasswordHash })
    .returning({ id: users.id });
  return { id: row!.id, email, name, role, password: TEST_PASSWORD };
}

/** A customer whose mail the test reads: the address starts with `tag`. */
export async function createCustomer(tag: string): Promise<TestUser> {
  return createTestUser('customer', { email: testAddress(tag), name: 'Robin Testroaster' });
}
