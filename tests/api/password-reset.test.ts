import { and, eq, isNull, like } from 'drizzle-orm';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { tokenFromFragment } from '@shared/schemas/auth';
import { apiErrorSchema } from '@shared/schemas/errors';
import { emailOutbox, passwordResetTokens } from '../../server/db/schema/index';
import { getTestDb } from '../setup/test-db';
import { authTestApp, MINUTE, sessionCookie, web } from './auth-support';
import { inboxOf, testRelay, waitFor } from './outbox-support';
import { createTestUser, TEST_PASSWORD, testAddress } from '../factories/index';

const { client, advance, me, signIn } = authTestApp();

describe('password reset by e-mail', () => {
  const mailCatcherUrl = inject('mailCatcherUrl');
  const { relay, mailer } = testRelay({ smtpUrl: inject('smtpUrl') });
  afterAll(() => mailer.close());

  async function resetLinkFor(email: string): Promise<string> {
    const [mail] = await waitFor(
      async () => {
        await relay.relayOnce();
        return inboxOf(mailCatcherUrl, email);
      },
      (mails) => mails.length > 0,
      10_000,
      `a reset e-mail to ${email}`,
    );
    const link = /https?:\/\/[^\s"<>]+#token=[\w-]+/.exec(mail!.text ?? mail!.html ?? '')?.[0];
    if (!link) throw new Error(`no reset link in ${mail!.text}`);
    return link;
  }

  it('the e-mailed link resets the password: 202, a link carrying its token in the fragment, 204, every session ended, the new password works', async () => {
    const user = await createTestUser('customer', { email: testAddress('forgetful') });
    const before = sessionCookie(await signIn(user.email, user.password));

    const requested = await client().post('/api/auth/password-reset').set(web).send({ email: user.email });
    expect(requested.status).toBe(202);
    const link = await resetLinkFor(user.email);
    expect(new URL(link).pathname).toBe('/reset-password');
    expect(new URL(link).search).toBe('');
    const token = tokenFromFragment(new URL(link).hash)!;

    const [stored] = await getTestDb().select().from(passwordResetTokens).where(eq(passwordResetTokens.userId, user.id));
    expect(stored!.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(stored!.tokenHash).not.toBe(token);
    expect(stored!.expiresAt.getTime() - stored!.createdAt.getTime()).toBe(30 * MINUTE);
    // Once sent, the outbox keeps no copy of the link: the token lives only in the customer's inbox.
    const [sentRow] = await getTestDb()
      .select()
      .from(emailOutbox)
      .where(and(eq(emailOutbox.toAddress, user.email), eq(emailOutbox.status, 'sent')));
    expect(JSON.stringify(sentRow!.payload)).not.toContain(token);

    const confirmed = await client().post('/api/auth/password-reset/confirm').set(web).send({ token, password: 'new kettle morning light' });
    expect(confirmed.status).toBe(204);
    expect((await me(before)).body.user).toBeNull();
    expect((await signIn(user.email, user.password)).status).toBe(401);
    expect((await signIn(user.email, 'new kettle morning light')).status).toBe(200);

    const again = await client().post('/api/auth/password-reset/confirm').set(web).send({ token, password: 'another fresh passphrase' });
    expect(again.status).toBe(400);
    expect(apiErrorSchema.parse(again.body).error.code).toBe('reset_link_invalid');
  });

  it('an unknown address gets the same 202 and no e-mail is queued', async () => {
    const nobody = testAddress('unknown');
    const response = await client().post('/api/auth/password-reset').set(web).send({ email: nobody });
    expect(response.status).toBe(202);
    expect(response.text).toBe('');
    await new Promise((resolve) => setTimeout(resolve, 200));
    expect(await getTestDb().select().from(emailOutbox).where(eq(emailOutbox.toAddress, nobody))).toEqual([]);
  });

  async function queuedToken(email: string): Promise<string> {
    const [row] = await waitFor(
      () =>
        getTestDb()
          .select({ payload: emailOutbox.payload })
          .from(emailOutbox)
          .where(and(eq(emailOutbox.toAddress, email), like(emailOutbox.template, 'password-reset'))),
      (rows) => rows.length > 0,
      5000,
      'a queued reset e-mail',
    );
    return tokenFromFragment(new URL(String(row!.payload.resetUrl)).hash)!;
  }

  it('a link used 31 minutes after it was sent, then 400 reset_link_invalid and the old password still works', async () => {
    const user = await createTestUser('customer');
    await client().post('/api/auth/password-reset').set(web).send({ email: user.email }).expect(202);
    const token = await queuedToken(user.email);
    advance(31 * MINUTE);
    const late = await client().post('/api/auth/password-reset/confirm').set(web).send({ token, password: 'too late for this one' });
    expect(late.status).toBe(400);
    expect(apiErrorSchema.parse(late.body).error.code).toBe('reset_link_invalid');
    expect((await signIn(user.email, TEST_PASSWORD)).status).toBe(200);
  });

  it('a common password is refused at reset without using up the link', async () => {
    const user = await createTestUser('customer');
    await client().post('/api/auth/password-reset').set(web).send({ email: user.email }).expect(202);
    const token = await queuedToken(user.email);
    const weak = await client().post('/api/auth/password-reset/confirm').set(web).send({ token, password: 'password123' });
    expect(weak.status).toBe(400);
    expect(apiErrorSchema.parse(weak.body).error.fields).toHaveProperty('password');
    const unused = await getTestDb()
      .select()
      .from(passwordResetTokens)
      .where(and(eq(passwordResetTokens.userId, user.id), isNull(passwordResetTokens.usedAt)));
    expect(unused).toHaveLength(1);
    await client().post('/api/auth/password-reset/confirm').set(web).send({ token, password: 'a much better passphrase' }).expect(204);
  });
});
