// Test accounts signed in through the real API (the accounts themselves: tests/factories/users.ts).
import type { Express } from 'express';
import request from 'supertest';
import { userResponseSchema } from '@shared/schemas/auth';
import type { TestUser } from '../factories/index';

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
