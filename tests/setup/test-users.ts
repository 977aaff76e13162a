// Invented test accounts: created straight in the test database, signed in through the real API.
import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import request from 'supertest';
import type { Role } from '@shared/domain/vocabulary';
import { userResponseSchema } from '@shared/schemas/auth';
import { users } from '../../server/db/schema/index';
import { hashPassword } from '../../server/lib/password-hashing';
import { getTestDb } from './test-db';

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

/**
 * A supertest agent signed in as `user` through `POST /api/auth/sign-in`: it keeps the session
 * cookie and sends `X-Restday-Client: web` on every request.
 */
export async function signedInAgent(app: Express, user: Pick<TestUser, 'email' | 'password'>) {
  const agent = request.agent(app).set('X-Restday-Client', 'web');
  const response = await agent.post('/api/auth/sign-in').send({ email: user.email, password: user.password });
  if (response.status !== 200) throw new Error(`sign-in as ${user.email} answered ${response.status}: ${JSON.stringify(response.body)}`);
  userResponseSchema.parse(response.body);
  return agent;
}
