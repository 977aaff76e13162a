// Helpers for the auth tests: an app on an adjustable clock and the auth requests they send.
import request, { type Response } from 'supertest';
import { createAdjustableClock } from '../../server/lib/clock';
import { createTestApp } from '../setup/test-app';
import { testAddress } from '../factories/index';

export const MINUTE = 60_000;
export const HOUR = 60 * MINUTE;
export const DAY = 24 * HOUR;

export const web = { 'X-Restday-Client': 'web' };

export function sessionCookie(response: Response): string {
  const header = ([] as string[]).concat(response.headers['set-cookie'] ?? []).find((cookie) => cookie.startsWith('restday_session='));
  if (!header) throw new Error(`no session cookie in ${JSON.stringify(response.headers['set-cookie'])}`);
  return header.split(';')[0]!;
}

/** A test app on its own clock, and the requests the auth tests make against it. */
export function authTestApp() {
  const clock = createAdjustableClock();
  const app = createTestApp({ clock });
  const client = () => request(app);
  return {
    clock,
    app,
    client,
    /** Moves the app's clock forward by `ms`, for session and link expiry. */
    advance: (ms: number) => clock.set(new Date(clock.now().getTime() + ms)),
    me: (cookie: string) => client().get('/api/auth/me').set('Cookie', cookie),
    signUp: (overrides: Partial<{ email: string; password: string; name: string }> = {}) =>
      client()
        .post('/api/auth/sign-up')
        .set(web)
        .send({ email: testAddress('signup'), password: 'amber lantern orchard', name: 'Sam Invented', ...overrides }),
    signIn: (email: string, password: string) => client().post('/api/auth/sign-in').set(web).send({ email, password }),
  };
}
