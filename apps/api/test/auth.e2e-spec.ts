import type { INestApplication } from '@nestjs/common';
import { DataSource } from 'typeorm';
import { Client, createTestApp, newMember, PASSWORD, uniqueEmail } from './helpers/test-app';

describe('auth: sign-up, sign-in, sign-out, me, password change', () => {
  let app: INestApplication;
  beforeAll(async () => {
    app = await createTestApp({ signupMode: 'open', signInLimit: 1000 });
  });
  afterAll(() => app.close());

  it('signs up a member, signs them in and never returns the password hash', async () => {
    const c = new Client(app);
    const email = uniqueEmail('signup');
    const res = await c.signUp(`  ${email.toUpperCase()} `, PASSWORD, 'Ada Example');
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ id: expect.any(String), email, displayName: 'Ada Example', siteRole: 'member', createdAt: expect.any(String) });
    expect(JSON.stringify(res.body)).not.toContain('$argon2');
    const me = await c.call('get', '/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.email).toBe(email);
    // argon2id hash at rest, not the password
    const [row] = await app.get(DataSource).query('SELECT password_hash FROM users WHERE id = $1', [res.body.id]);
    expect(row.password_hash).toMatch(/^\$argon2id\$/);
  });

  it('refuses a second account with the same address (any case) with 409', async () => {
    const { email } = await newMember(app);
    const res = await new Client(app).signUp(email.toUpperCase(), PASSWORD);
    expect(res.status).toBe(409);
    expect(res.body).toMatchObject({ statusCode: 409, error: 'Conflict', message: expect.stringMatching(/already exists/) });
  });

  it('signs in with the right password and sets an httpOnly SameSite=Lax session cookie', async () => {
    const { email } = await newMember(app);
    const c = new Client(app);
    const res = await c.signIn(email, PASSWORD);
    expect(res.status).toBe(200);
    expect(res.body.email).toBe(email);
    const cookie = (res.headers['set-cookie'] as unknown as string[]).find((l) => l.startsWith('cribra.sid='));
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    expect((await c.call('get', '/api/auth/me')).status).toBe(200);
  });

  it('gives a new session id at sign-in; the previous id no longer signs anyone in', async () => {
    const { email } = await newMember(app);
    const c = new Client(app);
    await c.signIn(email, PASSWORD);
    const first = c.cookie('cribra.sid');
    expect(first).toBeDefined(); // else the checks below would pass on no session at all
    await c.signIn(email, PASSWORD);
    const second = c.cookie('cribra.sid');
    expect(second).toBeDefined();
    expect(second).not.toBe(first);
    const old = new Client(app);
    old.jar.set('cribra.sid', first!);
    expect((await old.call('get', '/api/auth/me')).status).toBe(401);
  });

  it('answers a wrong password with 401 and a message, and does not sign in', async () => {
    const { email } = await newMember(app);
    const c = new Client(app);
    const res = await c.signIn(email, 'not-the-password');
    expect(res.status).toBe(401);
    expect(res.body).toEqual({ statusCode: 401, error: 'Unauthorized', message: 'Wrong e-mail address or password' });
    expect(c.cookie('cribra.sid')).toBeUndefined();
    const unknown = await c.signIn(uniqueEmail('nobody'), PASSWORD);
    expect(unknown.status).toBe(401);
    expect(unknown.body.message).toBe('Wrong e-mail address or password');
  });

  it('answers /me with 401 when signed out, and signs out with 204', async () => {
    const { client } = await newMember(app);
    expect((await client.call('get', '/api/auth/me')).status).toBe(200);
    expect((await client.call('post', '/api/auth/signout')).status).toBe(204);
    const me = await client.call('get', '/api/auth/me');
    expect(me.status).toBe(401);
    expect(me.body).toMatchObject({ statusCode: 401, error: 'Unauthorized', message: expect.any(String) });
  });

  it('changes the display name of the signed-in user; an empty name is a 400', async () => {
    const { client } = await newMember(app);
    const ok = await client.call('patch', '/api/auth/me', { displayName: '  Ida Renamed  ' });
    expect(ok.status).toBe(200);
    expect(ok.body.displayName).toBe('Ida Renamed');
    expect((await client.call('get', '/api/auth/me')).body.displayName).toBe('Ida Renamed');
    const empty = await client.call('patch', '/api/auth/me', { displayName: '   ' });
    expect(empty.status).toBe(400);
    expect(empty.body.details[0].field).toBe('displayName');
    expect((await new Client(app).call('patch', '/api/auth/me', { displayName: 'Nobody' })).status).toBe(401);
  });

  it('changes the password only with the current one', async () => {
    const { client, email } = await newMember(app);
    const wrong = await client.call('post', '/api/auth/password', { currentPassword: 'nope-nope-nope', newPassword: 'another-pass-9' });
    expect(wrong.status).toBe(401);
    const ok = await client.call('post', '/api/auth/password', { currentPassword: PASSWORD, newPassword: 'another-pass-9' });
    expect(ok.status).toBe(204);
    expect((await new Client(app).signIn(email, PASSWORD)).status).toBe(401);
    expect((await new Client(app).signIn(email, 'another-pass-9')).status).toBe(200);
    expect((await new Client(app).call('post', '/api/auth/password', { currentPassword: PASSWORD, newPassword: 'x-long-enough' })).status).toBe(401);
  });
});

describe('auth: validation and CSRF', () => {
  let app: INestApplication;
  beforeAll(async () => {
    app = await createTestApp({ signupMode: 'open', signInLimit: 1000 });
  });
  afterAll(() => app.close());

  it('answers a bad sign-up body with 400 and the fields in details', async () => {
    const res = await new Client(app).call('post', '/api/auth/signup', { email: 'not-an-address', password: 'short', displayName: '' });
    expect(res.status).toBe(400);
    expect(res.body.statusCode).toBe(400);
    expect(res.body.error).toBe('Bad Request');
    const fields = (res.body.details as { field: string; messages: string[] }[]).map((d) => d.field).sort();
    expect(fields).toEqual(['displayName', 'email', 'password']);
    expect(res.body.message).toMatch(/e-mail/);
  });

  it('refuses unknown fields and wrong types', async () => {
    const res = await new Client(app).call('post', '/api/auth/signup', { email: uniqueEmail('x'), password: PASSWORD, displayName: 'X', siteRole: 'admin' });
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([{ field: 'siteRole', messages: [expect.stringMatching(/should not exist/)] }]);
    const typed = await new Client(app).call('post', '/api/auth/signin', { email: 42, password: ['x'] });
    expect(typed.status).toBe(400);
    expect(typed.body.details.map((d: { field: string }) => d.field).sort()).toEqual(['email', 'password']);
  });

  it('answers malformed JSON with 400 in the same shape', async () => {
    const c = new Client(app);
    const token = await c.fetchCsrf();
    const { default: request } = await import('supertest');
    const res = await request(app.getHttpServer())
      .post('/api/auth/signin')
      .set('Cookie', `cribra.csrf=${c.cookie('cribra.csrf')}`)
      .set('x-csrf-token', token)
      .set('content-type', 'application/json')
      .send('{"email": ');
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({ statusCode: 400, error: 'Bad Request', message: expect.any(String) });
  });

  it('refuses state-changing requests without the CSRF header, or with a forged one (403)', async () => {
    const { email } = await newMember(app);
    const c = new Client(app);
    const none = await c.call('post', '/api/auth/signin', { email, password: PASSWORD }, { csrf: false });
    expect(none.status).toBe(403);
    expect(none.body).toMatchObject({ statusCode: 403, error: 'Forbidden', message: expect.stringMatching(/CSRF/) });
    await c.fetchCsrf();
    const forged = await c.call('post', '/api/auth/signin', { email, password: PASSWORD }, { csrf: 'abc.def' });
    expect(forged.status).toBe(403);
    // a token that is well-formed but does not match the cookie
    const other = await new Client(app).fetchCsrf();
    expect((await c.call('post', '/api/auth/signin', { email, password: PASSWORD }, { csrf: other })).status).toBe(403);
    expect(c.cookie('cribra.sid')).toBeUndefined();
    expect((await c.call('post', '/api/auth/signin', { email, password: PASSWORD })).status).toBe(200);
  });

  it('keeps the CSRF token across sign-in (the same token works afterwards)', async () => {
    const { email } = await newMember(app);
    const c = new Client(app);
    const token = await c.fetchCsrf();
    await c.signIn(email, PASSWORD);
    expect(await c.fetchCsrf()).toBe(token);
    expect((await c.call('post', '/api/auth/signout')).status).toBe(204);
  });
});

describe('auth: invitation-only sign-up', () => {
  let app: INestApplication;
  beforeAll(async () => {
    app = await createTestApp({ signupMode: 'invite', signInLimit: 1000 });
  });
  afterAll(() => app.close());

  it('refuses a sign-up without invitation token (403) and one with an unknown token', async () => {
    const c = new Client(app);
    const res = await c.signUp(uniqueEmail('invite'), PASSWORD);
    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(/invitation/);
    const email = uniqueEmail('invite');
    const withToken = await c.call('post', '/api/auth/signup', { email, password: PASSWORD, displayName: 'X', invitationToken: 'made-up' });
    // refused by the invitation gate (403 by default; the invitations feature answers 404 for unknown tokens)
    expect([403, 404]).toContain(withToken.status);
    expect((await new Client(app).signIn(email, PASSWORD)).status).toBe(401);
  });
});
