import type { INestApplication } from '@nestjs/common';
import { createHash } from 'node:crypto';
import { DataSource } from 'typeorm';
import { RESET_PASSWORD_PATH } from '@cribra/contracts';
import { Client, createTestApp, newMember, PASSWORD, uniqueEmail } from './helpers/test-app';
import { mailsTo, waitForMail } from './helpers/mailbox';

const NEW_PASSWORD = 'brand-new-secret-5';

function tokenFrom(text: string): string {
  const m = text.match(new RegExp(`${RESET_PASSWORD_PATH}\\?token=([A-Za-z0-9_-]+)`));
  if (!m) throw new Error(`no reset link in mail:\n${text}`);
  return m[1];
}

describe('password reset by e-mail link', () => {
  let app: INestApplication;
  beforeAll(async () => {
    app = await createTestApp({ signInLimit: 1000 });
  });
  afterAll(() => app.close());

  it('mails a single-use link through the SMTP fake; the token resets the password once', async () => {
    const { email, client: oldSession, user } = await newMember(app, 'reset');
    const c = new Client(app);
    const req = await c.call('post', '/api/auth/reset/request', { email: email.toUpperCase() });
    expect(req.status).toBe(202);

    const mail = await waitForMail(email);
    expect(mail.subject).toMatch(/Reset your Cribra password/);
    const token = tokenFrom(mail.text ?? '');
    expect(mail.text).toContain(`http://127.0.0.1:`);

    // stored hashed, never in clear
    const rows = await app.get(DataSource).query('SELECT token_hash, expires_at FROM password_resets WHERE user_id = $1', [user.id]);
    expect(rows).toHaveLength(1);
    expect(rows[0].token_hash).toBe(createHash('sha256').update(token).digest('hex'));
    const ttl = new Date(rows[0].expires_at).getTime() - Date.now();
    expect(ttl).toBeGreaterThan(55 * 60_000);
    expect(ttl).toBeLessThanOrEqual(60 * 60_000);

    const ok = await c.call('post', '/api/auth/reset/confirm', { token, newPassword: NEW_PASSWORD });
    expect(ok.status).toBe(204);
    expect((await new Client(app).signIn(email, PASSWORD)).status).toBe(401);
    expect((await new Client(app).signIn(email, NEW_PASSWORD)).status).toBe(200);
    // sessions opened with the old password are gone
    expect((await oldSession.call('get', '/api/auth/me')).status).toBe(401);

    const again = await c.call('post', '/api/auth/reset/confirm', { token, newPassword: 'third-password-1' });
    expect(again.status).toBe(400);
    expect(again.body.message).toMatch(/invalid, already used or expired/);
  });

  it('refuses an expired token', async () => {
    const { email, user } = await newMember(app, 'expired');
    const c = new Client(app);
    await c.call('post', '/api/auth/reset/request', { email });
    const token = tokenFrom((await waitForMail(email)).text ?? '');
    await app.get(DataSource).query(`UPDATE password_resets SET expires_at = now() - interval '1 second' WHERE user_id = $1`, [user.id]);
    const res = await c.call('post', '/api/auth/reset/confirm', { token, newPassword: NEW_PASSWORD });
    expect(res.status).toBe(400);
    expect((await new Client(app).signIn(email, PASSWORD)).status).toBe(200);
  });

  it('answers 202 for an unknown address and sends nothing', async () => {
    const email = uniqueEmail('ghost');
    const res = await new Client(app).call('post', '/api/auth/reset/request', { email });
    expect(res.status).toBe(202);
    await new Promise((r) => setTimeout(r, 500));
    expect(await mailsTo(email)).toHaveLength(0);
  });

  it('refuses a made-up token and validates the new password', async () => {
    const c = new Client(app);
    expect((await c.call('post', '/api/auth/reset/confirm', { token: 'made-up-token', newPassword: NEW_PASSWORD })).status).toBe(400);
    const short = await c.call('post', '/api/auth/reset/confirm', { token: 'made-up-token', newPassword: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.details).toEqual([{ field: 'newPassword', messages: [expect.stringMatching(/at least 8/)] }]);
  });
});

describe('reset links and sessions (hardening, round two)', () => {
  let app: INestApplication;
  beforeAll(async () => {
    app = await createTestApp({ signInLimit: 1000 });
  });
  afterAll(() => app.close());

  /** The reset tokens mailed to `email`, oldest first, once `count` have arrived. */
  async function tokens(email: string, count: number): Promise<string[]> {
    await waitForMail(email, count);
    return (await mailsTo(email)).map((m) => tokenFrom(m.text ?? ''));
  }

  it('issuing a newer link voids the older one; using a link voids every other', async () => {
    const { email } = await newMember(app, 'twolinks');
    const c = new Client(app);
    expect((await c.call('post', '/api/auth/reset/request', { email })).status).toBe(202);
    expect((await c.call('post', '/api/auth/reset/request', { email })).status).toBe(202);
    const [older, newer] = await tokens(email, 2);
    expect(older).not.toBe(newer);
    const stale = await c.call('post', '/api/auth/reset/confirm', { token: older, newPassword: NEW_PASSWORD });
    expect(stale.status).toBe(400);
    expect((await c.call('post', '/api/auth/reset/confirm', { token: newer, newPassword: NEW_PASSWORD })).status).toBe(204);
    // A link issued, then the password reset with another one issued later: the first is void too.
    expect((await c.call('post', '/api/auth/reset/request', { email })).status).toBe(202);
    const [, , third] = await tokens(email, 3);
    const client = new Client(app);
    expect((await client.signIn(email, NEW_PASSWORD)).status).toBe(200);
    expect((await client.call('post', '/api/auth/password', { currentPassword: NEW_PASSWORD, newPassword: 'after-change-77' })).status).toBe(204);
    expect((await c.call('post', '/api/auth/reset/confirm', { token: third, newPassword: 'late-reset-88' })).status).toBe(400);
  });

  it('a password change ends the account\'s other sessions and keeps the one that changed it', async () => {
    const { email, client: here } = await newMember(app, 'pwchange');
    const elsewhere = new Client(app);
    expect((await elsewhere.signIn(email, PASSWORD)).status).toBe(200);
    expect((await elsewhere.call('get', '/api/auth/me')).status).toBe(200);
    expect((await here.call('post', '/api/auth/password', { currentPassword: PASSWORD, newPassword: 'changed-pass-42' })).status).toBe(204);
    expect((await elsewhere.call('get', '/api/auth/me')).status).toBe(401);
    expect((await here.call('get', '/api/auth/me')).status).toBe(200);
  });
});
