import { eq } from 'drizzle-orm';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { addressListResponseSchema, addressSchema } from '@shared/schemas/account';
import { apiErrorSchema } from '@shared/schemas/errors';
import { addresses } from '../../server/db/schema/index';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { createTestUser, testAddress } from '../factories/index';

const app = createTestApp();
const web = { 'X-Restday-Client': 'web' };
const signIn = (email: string, password: string) => request(app).post('/api/auth/sign-in').set(web).send({ email, password });

const home = { name: 'Robin Invented', line1: '4 Larkspur Lane', city: 'Wrenfield', region: 'CO', postalCode: '81640' };
const work = { name: 'Robin Invented', line1: '90 Foundry Row', line2: 'Unit 3', city: 'Port Ellory', region: 'OR', postalCode: '97301', country: 'us' };

describe('profile', () => {
  it('PATCH /api/account/profile — then 200 {user} with the new name, and /me agrees', async () => {
    const agent = await signedInAgent(app, await createTestUser('customer'));
    const response = await agent.patch('/api/account/profile').send({ name: '  Robin Alder-Invented  ' });
    expect(response.status).toBe(200);
    expect(response.body.user.name).toBe('Robin Alder-Invented');
    expect((await agent.get('/api/auth/me')).body.user.name).toBe('Robin Alder-Invented');
  });

  it('PATCH /api/account/profile — with a blank name, then 400 naming the field', async () => {
    const agent = await signedInAgent(app, await createTestUser('customer'));
    const response = await agent.patch('/api/account/profile').send({ name: '   ' });
    expect(response.status).toBe(400);
    expect(apiErrorSchema.parse(response.body).error.fields).toHaveProperty('name');
  });
});

describe('e-mail change (re-authentication with the current password)', () => {
  it('with the wrong current password, then 400 wrong_password and the address is unchanged', async () => {
    const user = await createTestUser('customer');
    const agent = await signedInAgent(app, user);
    const response = await agent.put('/api/account/email').send({ email: testAddress('moved'), currentPassword: 'not it at all' });
    expect(response.status).toBe(400);
    expect(apiErrorSchema.parse(response.body).error.fields).toEqual({ currentPassword: 'That is not your current password.' });
    expect((await agent.get('/api/auth/me')).body.user.email).toBe(user.email);
  });

  it('with the current password, then 200 with the new address: sign-in uses it, and every other session ends', async () => {
    const user = await createTestUser('customer');
    const laptop = await signedInAgent(app, user);
    const phone = await signedInAgent(app, user);
    const newEmail = testAddress('moved');
    const response = await laptop.put('/api/account/email').send({ email: newEmail.toUpperCase(), currentPassword: user.password });
    expect(response.status).toBe(200);
    expect(response.body.user.email).toBe(newEmail);
    expect((await laptop.get('/api/auth/me')).body.user).not.toBeNull();
    expect((await phone.get('/api/auth/me')).body.user).toBeNull();
    expect((await signIn(user.email, user.password)).status).toBe(401);
    expect((await signIn(newEmail, user.password)).status).toBe(200);
  });

  it('to an address another account uses, then 409 email_taken', async () => {
    const user = await createTestUser('customer');
    const other = await createTestUser('customer');
    const response = await (await signedInAgent(app, user)).put('/api/account/email').send({ email: other.email, currentPassword: user.password });
    expect(response.status).toBe(409);
    expect(apiErrorSchema.parse(response.body).error.code).toBe('email_taken');
  });
});

describe('password change', () => {
  it('with the current password, then 204: every session ends (this one too), a fresh cookie keeps this device signed in, and only the new password works', async () => {
    const user = await createTestUser('customer');
    const laptop = await signedInAgent(app, user);
    const phone = await signedInAgent(app, user);
    const oldCookie = String((await signIn(user.email, user.password)).headers['set-cookie']).split(';')[0]!;

    const response = await laptop.put('/api/account/password').send({ currentPassword: user.password, newPassword: 'slow pour over the ridge' });
    expect(response.status).toBe(204);
    expect(String(response.headers['set-cookie'])).toMatch(/^restday_session=[\w-]+\.[\w-]+\.[\w-]+;/);

    expect((await laptop.get('/api/auth/me')).body.user).not.toBeNull();
    expect((await phone.get('/api/auth/me')).body.user).toBeNull();
    expect((await request(app).get('/api/auth/me').set('Cookie', oldCookie)).body.user).toBeNull();
    expect((await signIn(user.email, user.password)).status).toBe(401);
    expect((await signIn(user.email, 'slow pour over the ridge')).status).toBe(200);
  });

  it('to a common password or one shorter than 8, then 400 naming newPassword and nothing changes', async () => {
    const user = await createTestUser('customer');
    const agent = await signedInAgent(app, user);
    for (const newPassword of ['qwertyuiop', 'short']) {
      const response = await agent.put('/api/account/password').send({ currentPassword: user.password, newPassword });
      expect(response.status, newPassword).toBe(400);
      expect(Object.keys(apiErrorSchema.parse(response.body).error.fields ?? {})).toEqual(['newPassword']);
    }
    expect((await agent.get('/api/auth/me')).body.user).not.toBeNull();
    expect((await signIn(user.email, user.password)).status).toBe(200);
  });

  it('with the wrong current password, then 400 and the sessions live on', async () => {
    const user = await createTestUser('customer');
    const agent = await signedInAgent(app, user);
    const response = await agent.put('/api/account/password').send({ currentPassword: 'wrong wrong wrong', newPassword: 'slow pour over the ridge' });
    expect(response.status).toBe(400);
    expect(apiErrorSchema.parse(response.body).error.code).toBe('wrong_password');
    expect((await agent.get('/api/auth/me')).body.user).not.toBeNull();
  });
});

describe('shipping addresses', () => {
  it('the first address becomes the default; a new default moves it; the list puts the default first', async () => {
    const agent = await signedInAgent(app, await createTestUser('customer'));
    const first = await agent.post('/api/account/addresses').send(home);
    expect(first.status).toBe(201);
    expect(addressSchema.parse(first.body)).toMatchObject({ ...home, line2: null, country: 'US', isDefault: true });

    const second = await agent.post('/api/account/addresses').send({ ...work, isDefault: true });
    expect(second.status).toBe(201);
    expect(second.body).toMatchObject({ line2: 'Unit 3', country: 'US', isDefault: true });

    const list = addressListResponseSchema.parse((await agent.get('/api/account/addresses')).body);
    expect(list.items.map((address) => [address.line1, address.isDefault])).toEqual([
      ['90 Foundry Row', true],
      ['4 Larkspur Lane', false],
    ]);
  });

  it('PUT replaces an address; DELETE of the default passes the default to the address that is left', async () => {
    const agent = await signedInAgent(app, await createTestUser('customer'));
    const first = addressSchema.parse((await agent.post('/api/account/addresses').send(home)).body);
    const second = addressSchema.parse((await agent.post('/api/account/addresses').send(work)).body);
    const replaced = await agent.put(`/api/account/addresses/${second.id}`).send({ ...work, line1: '91 Foundry Row', line2: '' });
    expect(replaced.status).toBe(200);
    expect(replaced.body).toMatchObject({ id: second.id, line1: '91 Foundry Row', line2: null, isDefault: false });

    expect((await agent.delete(`/api/account/addresses/${first.id}`)).status).toBe(204);
    const list = addressListResponseSchema.parse((await agent.get('/api/account/addresses')).body);
    expect(list.items).toEqual([{ ...replaced.body, isDefault: true }]);
  });

  it('customer B cannot read, change or delete customer A’s address: 404, and A’s address is untouched', async () => {
    const a = await signedInAgent(app, await createTestUser('customer'));
    const b = await signedInAgent(app, await createTestUser('customer'));
    const mine = addressSchema.parse((await a.post('/api/account/addresses').send(home)).body);

    expect(addressListResponseSchema.parse((await b.get('/api/account/addresses')).body).items).toEqual([]);
    expect((await b.put(`/api/account/addresses/${mine.id}`).send(work)).status).toBe(404);
    expect((await b.delete(`/api/account/addresses/${mine.id}`)).status).toBe(404);
    const [row] = await getTestDb().select().from(addresses).where(eq(addresses.id, mine.id));
    expect(row).toMatchObject({ line1: home.line1, city: home.city });
  });

  it('an address with missing fields or a bad country code, then 400 naming each field', async () => {
    const agent = await signedInAgent(app, await createTestUser('customer'));
    const response = await agent.post('/api/account/addresses').send({ name: 'X', line1: '', country: 'USA' });
    expect(response.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(response.body).error.fields ?? {}).sort()).toEqual(['city', 'country', 'line1', 'postalCode', 'region']);
    expect((await agent.put('/api/account/addresses/not-a-uuid').send(home)).status).toBe(400);
  });
});
