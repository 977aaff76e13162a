import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { describe, expect, inject, it } from 'vitest';
import { tokenFromFragment, userResponseSchema } from '@shared/schemas/auth';
import { apiErrorSchema } from '@shared/schemas/errors';
import { invitationPreviewSchema, pendingInvitationSchema, teamMemberSchema, teamResponseSchema } from '@shared/schemas/team';
import { emailOutbox, invitations } from '../../server/db/schema/index';
import { tokenDigest } from '../../server/modules/auth/session-tokens';
import { createAdjustableClock } from '../../server/lib/clock';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { inboxOf, testRelay, waitFor } from './outbox-support';
import { createTestUser, testAddress } from '../factories/index';

const clock = createAdjustableClock();
const app = createTestApp({ clock });
const web = { 'X-Restday-Client': 'web' };
const signIn = (email: string, password: string) => request(app).post('/api/auth/sign-in').set(web).send({ email, password });

async function ownerAgent() {
  const owner = await createTestUser('owner');
  return { owner, agent: await signedInAgent(app, owner) };
}

/** The invitation token, read from the outbox row written with the invitation. */
async function invitationToken(email: string): Promise<string> {
  const [row] = await getTestDb()
    .select({ payload: emailOutbox.payload })
    .from(emailOutbox)
    .where(and(eq(emailOutbox.toAddress, email), eq(emailOutbox.template, 'staff-invitation')))
    .orderBy(emailOutbox.createdAt);
  return tokenFromFragment(new URL(String(row!.payload.acceptUrl)).hash)!;
}

describe('the owner’s Team page', () => {
  it('GET /api/owner/team — lists staff and owner accounts (not customers) and pending invitations', async () => {
    const { owner, agent } = await ownerAgent();
    const staff = await createTestUser('staff');
    const customer = await createTestUser('customer');
    const invitee = testAddress('pending');
    await agent.post('/api/owner/team').send({ email: invitee }).expect(201);

    const team = teamResponseSchema.parse((await agent.get('/api/owner/team')).body);
    const ids = team.members.map((member) => member.id);
    expect(ids).toContain(owner.id);
    expect(ids).toContain(staff.id);
    expect(ids).not.toContain(customer.id);
    expect(team.invitations.find((invitation) => invitation.email === invitee)).toMatchObject({ role: 'staff', invitedBy: owner.name });
  });

  it('POST /api/owner/team — then 201, and the invitation e-mail reaches the mail catcher with a link whose token sits in the fragment', async () => {
    const { relay, mailer } = testRelay({ smtpUrl: inject('smtpUrl') });
    const { agent } = await ownerAgent();
    const invitee = testAddress('newroaster');
    const response = await agent.post('/api/owner/team').send({ email: invitee, role: 'staff' });
    expect(response.status).toBe(201);
    expect(pendingInvitationSchema.parse(response.body)).toMatchObject({ email: invitee, role: 'staff' });
    const [mail] = await waitFor(
      async () => {
        await relay.relayOnce();
        return inboxOf(inject('mailCatcherUrl'), invitee);
      },
      (mails) => mails.length > 0,
      10_000,
      'the invitation e-mail',
    );
    mailer.close();
    const link = /https?:\/\/[^\s"<>]+#token=[\w-]+/.exec(mail!.text ?? '')?.[0];
    expect(new URL(link!).pathname).toBe('/join');
    // The e-mailed token is the one the invitation stores (as a digest only), and once the
    // e-mail is sent the outbox keeps no copy of the link.
    const [invitation] = await getTestDb().select().from(invitations).where(eq(invitations.email, invitee));
    expect(tokenDigest(tokenFromFragment(new URL(link!).hash)!)).toBe(invitation!.tokenHash);
    const [sentRow] = await getTestDb().select().from(emailOutbox).where(eq(emailOutbox.toAddress, invitee));
    expect(sentRow).toMatchObject({ status: 'sent' });
    expect(sentRow!.payload).not.toHaveProperty('acceptUrl');
  });

  it('an invitation for an address that already has an account, then 409 account_exists', async () => {
    const { agent } = await ownerAgent();
    const customer = await createTestUser('customer');
    const response = await agent.post('/api/owner/team').send({ email: customer.email, role: 'staff' });
    expect(response.status).toBe(409);
    expect(apiErrorSchema.parse(response.body).error.code).toBe('account_exists');
  });
});

describe('accepting an invitation', () => {
  it('preview shows the address and role; accepting creates a staff account, signed in; the link then stops working', async () => {
    const { agent } = await ownerAgent();
    const invitee = testAddress('joiner');
    await agent.post('/api/owner/team').send({ email: invitee, role: 'staff' }).expect(201);
    const token = await invitationToken(invitee);

    const preview = await request(app).post('/api/auth/invitations/preview').set(web).send({ token });
    expect(preview.status).toBe(200);
    expect(invitationPreviewSchema.parse(preview.body)).toMatchObject({ email: invitee, role: 'staff' });

    const joiner = request.agent(app).set(web);
    const accepted = await joiner.post('/api/auth/invitations/accept').send({ token, name: 'Juniper Invented', password: 'first batch of the day' });
    expect(accepted.status).toBe(201);
    expect(userResponseSchema.parse(accepted.body).user).toMatchObject({ email: invitee, name: 'Juniper Invented', role: 'staff' });
    expect((await joiner.get('/api/roastery/outbox')).status).toBe(200);

    const reused = await request(app).post('/api/auth/invitations/accept').set(web).send({ token, name: 'Someone Else', password: 'another long phrase' });
    expect(reused.status).toBe(404);
    expect(apiErrorSchema.parse(reused.body).error.code).toBe('invitation_invalid');
    expect((await request(app).post('/api/auth/invitations/preview').set(web).send({ token })).status).toBe(404);
  });

  it('a link older than 7 days, a withdrawn one, or one replaced by a newer invitation, then 404 invitation_invalid', async () => {
    const { agent } = await ownerAgent();
    const preview = (token: string) => request(app).post('/api/auth/invitations/preview').set(web).send({ token });

    const late = testAddress('late');
    await agent.post('/api/owner/team').send({ email: late }).expect(201);
    const lateToken = await invitationToken(late);
    clock.set(new Date(clock.now().getTime() + 7 * 24 * 60 * 60_000 + 60_000));
    expect((await preview(lateToken)).status).toBe(404);

    // A week on, the first owner's session is long over: a second owner carries on.
    const ownerNow = await signedInAgent(app, await createTestUser('owner'));
    const withdrawn = testAddress('withdrawn');
    const invitation = pendingInvitationSchema.parse((await ownerNow.post('/api/owner/team').send({ email: withdrawn })).body);
    const withdrawnToken = await invitationToken(withdrawn);
    expect((await ownerNow.delete(`/api/owner/team/invitations/${invitation.id}`)).status).toBe(204);
    expect((await preview(withdrawnToken)).status).toBe(404);

    const twice = testAddress('twice');
    await ownerNow.post('/api/owner/team').send({ email: twice }).expect(201);
    const firstToken = await invitationToken(twice);
    await ownerNow.post('/api/owner/team').send({ email: twice, role: 'owner' }).expect(201);
    expect((await preview(firstToken)).status).toBe(404);
    const teamNow = teamResponseSchema.parse((await ownerNow.get('/api/owner/team')).body);
    expect(teamNow.invitations.filter((pending) => pending.email === twice).map((pending) => pending.role)).toEqual(['owner']);
  });

  it('accepting with a common password, then 400 and the invitation stays open', async () => {
    const { agent } = await ownerAgent();
    const invitee = testAddress('weakjoiner');
    await agent.post('/api/owner/team').send({ email: invitee }).expect(201);
    const token = await invitationToken(invitee);
    const weak = await request(app).post('/api/auth/invitations/accept').set(web).send({ token, name: 'Weak Invented', password: 'football1' });
    expect(weak.status).toBe(400);
    expect((await request(app).post('/api/auth/invitations/preview').set(web).send({ token })).status).toBe(200);
  });
});

describe('role changes and disabling take effect on the next request', () => {
  it('staff demoted to customer mid-session: the next Roastery request is 403 and /me says customer; promoted back: 200 at once', async () => {
    const { agent: owner } = await ownerAgent();
    const staff = await createTestUser('staff');
    const staffAgent = await signedInAgent(app, staff);
    expect((await staffAgent.get('/api/roastery/outbox')).status).toBe(200);

    const demoted = await owner.patch(`/api/owner/team/${staff.id}`).send({ role: 'customer' });
    expect(demoted.status).toBe(200);
    expect(teamMemberSchema.parse(demoted.body)).toMatchObject({ id: staff.id, role: 'customer', disabled: false });
    expect((await staffAgent.get('/api/roastery/outbox')).status).toBe(403);
    expect((await staffAgent.get('/api/auth/me')).body.user.role).toBe('customer');

    await owner.patch(`/api/owner/team/${staff.id}`).send({ role: 'staff' }).expect(200);
    expect((await staffAgent.get('/api/roastery/outbox')).status).toBe(200);
  });

  it('staff made a packer: /me says packer, the Pack List and orders still open, stock, the Roast List, refunds and the team answer 403; the team lists them', async () => {
    const { agent: owner } = await ownerAgent();
    const member = await createTestUser('staff');
    const memberAgent = await signedInAgent(app, member);

    const changed = await owner.patch(`/api/owner/team/${member.id}`).send({ role: 'packer' });
    expect(changed.status).toBe(200);
    expect(teamMemberSchema.parse(changed.body)).toMatchObject({ id: member.id, role: 'packer' });
    expect(userResponseSchema.parse((await memberAgent.get('/api/auth/me')).body).user?.role).toBe('packer');

    expect((await memberAgent.get('/api/roastery/days/2026-12-08/pack-list')).status).toBe(200);
    expect((await memberAgent.get('/api/orders?pageSize=5')).status).toBe(200);
    expect((await memberAgent.get('/api/roastery/days/2026-12-08/roast-list')).status).toBe(403);
    expect((await memberAgent.post('/api/lots/ANY-LOT/stock-adjustments').send({})).status).toBe(403);
    expect((await memberAgent.post('/api/orders/00000000-0000-4000-8000-000000000000/refund').send({})).status).toBe(403);
    expect((await memberAgent.get('/api/owner/team')).status).toBe(403);
    expect((await memberAgent.put('/api/roastery/settings').send({})).status).toBe(403);

    const team = teamResponseSchema.parse((await owner.get('/api/owner/team')).body);
    expect(team.members.find((listed) => listed.id === member.id)?.role).toBe('packer');
  });

  it('POST /api/owner/team with role packer — then 201, and the invitation preview offers the packer role', async () => {
    const { agent: owner } = await ownerAgent();
    const email = `packer-${Date.now()}@example.test`;
    const invited = await owner.post('/api/owner/team').send({ email, role: 'packer' });
    expect(invited.status).toBe(201);
    expect(pendingInvitationSchema.parse(invited.body).role).toBe('packer');
    const preview = await request(app)
      .post('/api/auth/invitations/preview')
      .set(web)
      .send({ token: await invitationToken(email) });
    expect(invitationPreviewSchema.parse(preview.body).role).toBe('packer');
  });

  it('a disabled team member is signed out on the next request and cannot sign in; re-enabled, they can', async () => {
    const { agent: owner } = await ownerAgent();
    const staff = await createTestUser('staff');
    const staffAgent = await signedInAgent(app, staff);

    const disabled = await owner.patch(`/api/owner/team/${staff.id}`).send({ disabled: true });
    expect(disabled.status).toBe(200);
    expect(disabled.body.disabled).toBe(true);
    expect((await staffAgent.get('/api/auth/me')).body.user).toBeNull();
    expect((await signIn(staff.email, staff.password)).status).toBe(403);

    await owner.patch(`/api/owner/team/${staff.id}`).send({ disabled: false }).expect(200);
    expect((await signIn(staff.email, staff.password)).status).toBe(200);
  });

  it('the owner cannot change their own role or turn off their own account (422), nor change an unknown person (404)', async () => {
    const { owner, agent } = await ownerAgent();
    const own = await agent.patch(`/api/owner/team/${owner.id}`).send({ disabled: true });
    expect(own.status).toBe(422);
    expect(apiErrorSchema.parse(own.body).error.code).toBe('cannot_change_own_access');
    expect((await agent.patch(`/api/owner/team/${owner.id}`).send({ role: 'staff' })).status).toBe(422);
    expect((await agent.patch('/api/owner/team/00000000-0000-4000-8000-000000000000').send({ role: 'staff' })).status).toBe(404);
    expect((await agent.get('/api/owner/team')).status).toBe(200);
  });
});
