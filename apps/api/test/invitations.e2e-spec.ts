// Invitations by e-mail: the link is read from the SMTP fake and followed; single use, 7 days,
// revocable, resendable; refused when expired, reused, revoked or used by another account;
// pending and retried while the SMTP server is down.
import type { INestApplication } from '@nestjs/common';
import { createServer } from 'node:net';
import { DataSource } from 'typeorm';
import { INVITATION_PATH, INVITATION_TTL_DAYS, type InvitationView } from '@cribra/contracts';
import { InvitationsService, MAX_DELIVERY_ATTEMPTS } from '../src/invitations/invitations.service';
import { mailsTo } from './helpers/mailbox';
import { deleteNotebooks, expectStatus, linkInMail, sleep } from './helpers/review-fixtures';
import { Client, createTestApp, newMember, PASSWORD, uniqueEmail } from './helpers/test-app';

let app: INestApplication;
let db: DataSource;
let owner: Client;
let notebookId: string;
const created: string[] = [];
const linkPrefix = () => `${process.env.PUBLIC_URL}${INVITATION_PATH}/`;
const tokenOf = (link: string) => link.slice(linkPrefix().length);

async function invite(email: string, role = 'viewer'): Promise<InvitationView> {
  const res = await owner.call('post', `/api/notebooks/${notebookId}/invitations`, { email, role });
  expectStatus(res, 201);
  return res.body;
}

/** A loopback port with nothing listening (an SMTP server that is down). */
async function closedPort(): Promise<number> {
  const srv = createServer();
  await new Promise<void>((r) => srv.listen(0, '127.0.0.1', () => r()));
  const port = (srv.address() as { port: number }).port;
  await new Promise<void>((r) => srv.close(() => r()));
  return port;
}

beforeAll(async () => {
  app = await createTestApp();
  db = app.get(DataSource);
  ({ client: owner } = await newMember(app, 'owner'));
  const res = await owner.call('post', '/api/notebooks', { title: 'Prime gaps below 10^9' });
  expectStatus(res, 201);
  notebookId = res.body.id;
  created.push(notebookId);
});

afterAll(async () => {
  await deleteNotebooks(app, created);
  await app.close();
});

describe('inviting', () => {
  it('mails a single-use link valid for 7 days; an existing account signs in and joins', async () => {
    const { client: person, email, user } = await newMember(app, 'existing');
    const inv = await invite(email, 'editor');
    expect(inv).toMatchObject({ email, role: 'editor', status: 'pending', delivery: 'sent', deliveryAttempts: 1 });
    const days = (Date.parse(inv.expiresAt) - Date.parse(inv.createdAt)) / 86_400_000;
    expect(days).toBeCloseTo(INVITATION_TTL_DAYS, 2);
    const link = await linkInMail(email, linkPrefix());
    const token = tokenOf(link);
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    // Only the hash is stored.
    const [row] = await db.query(`SELECT token_hash FROM invitations WHERE id = $1`, [inv.id]);
    expect(row.token_hash).not.toContain(token);

    const anonymous = new Client(app);
    const preview = await anonymous.call('get', `/api/invitations/token/${token}`);
    expectStatus(preview, 200);
    expect(preview.body).toMatchObject({ notebookId, notebookTitle: 'Prime gaps below 10^9', role: 'editor', accountExists: true });

    expectStatus(await anonymous.call('post', '/api/invitations/accept', { token }), 401);
    const accepted = await person.call('post', '/api/invitations/accept', { token });
    expectStatus(accepted, 200);
    expect(accepted.body).toEqual({ notebookId, role: 'editor' });
    expect((await person.call('get', `/api/notebooks/${notebookId}`)).body.myRole).toBe('editor');

    // Reused: refused, whoever tries.
    const reused = await person.call('post', '/api/invitations/accept', { token });
    expectStatus(reused, 410);
    expect(reused.body.details).toEqual({ reason: 'accepted' });
    expectStatus(await anonymous.call('get', `/api/invitations/token/${token}`), 410);
    const all: InvitationView[] = (await owner.call('get', `/api/notebooks/${notebookId}/invitations?status=all`)).body;
    expect(all.find((i) => i.id === inv.id)).toMatchObject({ status: 'accepted', acceptedBy: { id: user.id } });
    const pending: InvitationView[] = (await owner.call('get', `/api/notebooks/${notebookId}/invitations`)).body;
    expect(pending.find((i) => i.id === inv.id)).toBeUndefined();
  });

  it('lets a new person create an account with the token, only with the invited address', async () => {
    const email = uniqueEmail('newcomer');
    await invite(email, 'reviewer');
    const token = tokenOf(await linkInMail(email, linkPrefix()));
    const other = uniqueEmail('other');
    const wrong = await new Client(app).call('post', '/api/auth/signup', { email: other, password: PASSWORD, displayName: 'Other', invitationToken: token });
    expectStatus(wrong, 403);
    expect(wrong.body.details).toEqual({ reason: 'wrong_account' });
    expect(await db.query(`SELECT 1 FROM users WHERE email = $1`, [other])).toHaveLength(0);
    const person = new Client(app);
    expectStatus(await person.call('post', '/api/auth/signup', { email, password: PASSWORD, displayName: 'Nora Newcomer', invitationToken: token }), 201);
    expect((await person.call('get', `/api/notebooks/${notebookId}`)).body.myRole).toBe('reviewer');
  });

  it('refuses a token used by a signed-in account with another address', async () => {
    const email = uniqueEmail('target');
    await invite(email);
    const token = tokenOf(await linkInMail(email, linkPrefix()));
    const { client: intruder } = await newMember(app, 'intruder');
    const res = await intruder.call('post', '/api/invitations/accept', { token });
    expectStatus(res, 403);
    expect(res.body.details).toEqual({ reason: 'wrong_account' });
    expectStatus(await intruder.call('get', `/api/notebooks/${notebookId}`), 403);
  });

  it('refuses expired, revoked and unknown tokens', async () => {
    const expiredEmail = uniqueEmail('expired');
    const expired = await invite(expiredEmail);
    const expiredToken = tokenOf(await linkInMail(expiredEmail, linkPrefix()));
    await db.query(`UPDATE invitations SET created_at = now() - interval '8 days', expires_at = now() - interval '1 day' WHERE id = $1`, [expired.id]);
    const e = await new Client(app).call('get', `/api/invitations/token/${expiredToken}`);
    expectStatus(e, 410);
    expect(e.body.details).toEqual({ reason: 'expired' });
    const expiredSignup = await new Client(app).call('post', '/api/auth/signup', { email: expiredEmail, password: PASSWORD, displayName: 'Late', invitationToken: expiredToken });
    expectStatus(expiredSignup, 410);

    const revokedEmail = uniqueEmail('revoked');
    const revoked = await invite(revokedEmail);
    const revokedToken = tokenOf(await linkInMail(revokedEmail, linkPrefix()));
    expectStatus(await owner.call('delete', `/api/invitations/${revoked.id}`), 204);
    const r = await new Client(app).call('get', `/api/invitations/token/${revokedToken}`);
    expectStatus(r, 410);
    expect(r.body.details).toEqual({ reason: 'revoked' });
    const all: InvitationView[] = (await owner.call('get', `/api/notebooks/${notebookId}/invitations?status=all`)).body;
    expect(all.find((i) => i.id === revoked.id)?.status).toBe('revoked');
    expect(all.find((i) => i.id === expired.id)?.status).toBe('expired');

    const u = await new Client(app).call('get', `/api/invitations/token/${'A'.repeat(43)}`);
    expectStatus(u, 404);
    expect(u.body.details).toEqual({ reason: 'unknown' });
  });

  it('resends with a new link (the old one stops working) and a fresh 7 days', async () => {
    const email = uniqueEmail('resend');
    const inv = await invite(email);
    const first = tokenOf(await linkInMail(email, linkPrefix(), 1));
    await db.query(`UPDATE invitations SET expires_at = now() + interval '1 day' WHERE id = $1`, [inv.id]);
    const res = await owner.call('post', `/api/invitations/${inv.id}/resend`);
    expectStatus(res, 200);
    expect(Date.parse(res.body.expiresAt) - Date.now()).toBeGreaterThan(6.9 * 86_400_000);
    const second = tokenOf(await linkInMail(email, linkPrefix(), 2));
    expect(second).not.toBe(first);
    expectStatus(await new Client(app).call('get', `/api/invitations/token/${first}`), 404);
    expectStatus(await new Client(app).call('get', `/api/invitations/token/${second}`), 200);
  });

  it('validates input and refuses duplicates and members', async () => {
    const bad = await owner.call('post', `/api/notebooks/${notebookId}/invitations`, { email: 'not-an-address', role: 'owner' });
    expectStatus(bad, 400);
    expect(bad.body.details.map((d: { field: string }) => d.field).sort()).toEqual(['email', 'role']);
    const email = uniqueEmail('twice');
    await invite(email);
    expectStatus(await owner.call('post', `/api/notebooks/${notebookId}/invitations`, { email: email.toUpperCase(), role: 'viewer' }), 409);
    const ownerEmail = (await owner.call('get', '/api/auth/me')).body.email;
    expectStatus(await owner.call('post', `/api/notebooks/${notebookId}/invitations`, { email: ownerEmail, role: 'viewer' }), 409);
  });

  it('records invitations and joins in the audit trail', async () => {
    const actions = (await owner.call('get', `/api/notebooks/${notebookId}/audit`)).body.map((e: { action: string }) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['invitation.create', 'invitation.accept', 'invitation.revoke', 'invitation.resend', 'member.join']));
  });
});

describe('when the SMTP server is down', () => {
  it('keeps the invitation pending with its delivery state visible, and retries it', async () => {
    const down = await createTestApp({ smtpPort: await closedPort() });
    const ownerOnDown = owner.on(down);
    const email = uniqueEmail('smtpdown');
    let inv!: InvitationView;
    try {
      const res = await ownerOnDown.call('post', `/api/notebooks/${notebookId}/invitations`, { email, role: 'viewer' });
      expectStatus(res, 201);
      inv = res.body;
      expect(inv).toMatchObject({ status: 'pending', delivery: 'retrying', deliveryAttempts: 1, sentAt: null });
      expect(inv.deliveryError).toMatch(/ECONNREFUSED|connect/i);
      const firstDelay = Date.parse(inv.nextAttemptAt!) - Date.now();
      expect(firstDelay).toBeGreaterThan(5_000);
      // Still down at the next attempt: the delay grows.
      await db.query(`UPDATE invitations SET next_attempt_at = now() WHERE id = $1`, [inv.id]);
      expect(await down.get(InvitationsService).retryDue()).toBeGreaterThanOrEqual(1);
      const again: InvitationView = (await ownerOnDown.call('get', `/api/notebooks/${notebookId}/invitations`)).body.find((i: InvitationView) => i.id === inv.id);
      expect(again).toMatchObject({ delivery: 'retrying', deliveryAttempts: 2 });
      expect(Date.parse(again.nextAttemptAt!) - Date.now()).toBeGreaterThan(firstDelay);
    } finally {
      await down.close();
    }
    expect(await mailsTo(email)).toHaveLength(0);

    // The SMTP server is back: the due retry delivers a working link.
    await db.query(`UPDATE invitations SET next_attempt_at = now() WHERE id = $1`, [inv.id]);
    await app.get(InvitationsService).retryDue();
    let view: InvitationView | undefined;
    for (let i = 0; i < 50; i++) {
      view = (await owner.call('get', `/api/notebooks/${notebookId}/invitations`)).body.find((x: InvitationView) => x.id === inv.id);
      if (view?.delivery === 'sent') break;
      await sleep(100);
    }
    expect(view).toMatchObject({ status: 'pending', delivery: 'sent', deliveryError: null });
    const token = tokenOf(await linkInMail(email, linkPrefix()));
    const person = new Client(app);
    expectStatus(await person.call('post', '/api/auth/signup', { email, password: PASSWORD, displayName: 'Patient Person', invitationToken: token }), 201);
    expect((await person.call('get', `/api/notebooks/${notebookId}`)).body.myRole).toBe('viewer');
  });

  it('gives up after the last attempt (delivery failed) until the owner resends', async () => {
    const down = await createTestApp({ smtpPort: await closedPort() });
    const email = uniqueEmail('givenup');
    let id = '';
    try {
      const res = await owner.on(down).call('post', `/api/notebooks/${notebookId}/invitations`, { email, role: 'viewer' });
      expectStatus(res, 201);
      id = res.body.id;
      await db.query(`UPDATE invitations SET delivery_attempts = $2 - 1, next_attempt_at = now() WHERE id = $1`, [id, MAX_DELIVERY_ATTEMPTS]);
      await down.get(InvitationsService).retryDue();
    } finally {
      await down.close();
    }
    const failed: InvitationView = (await owner.call('get', `/api/notebooks/${notebookId}/invitations`)).body.find((i: InvitationView) => i.id === id);
    expect(failed).toMatchObject({ status: 'pending', delivery: 'failed', deliveryAttempts: MAX_DELIVERY_ATTEMPTS, nextAttemptAt: null });
    const resent = await owner.call('post', `/api/invitations/${id}/resend`);
    expectStatus(resent, 200);
    expect(resent.body).toMatchObject({ delivery: 'sent', deliveryAttempts: 1 });
    expect(tokenOf(await linkInMail(email, linkPrefix()))).toMatch(/^[A-Za-z0-9_-]{43}$/);
  });
});

describe('invitation-only sign-up', () => {
  it('refuses sign-up without a token and accepts it with one', async () => {
    const closed = await createTestApp({ signupMode: 'invite' });
    try {
      const email = uniqueEmail('gated');
      expectStatus(await new Client(closed).call('post', '/api/auth/signup', { email, password: PASSWORD, displayName: 'Gated' }), 403);
      await invite(email);
      const token = tokenOf(await linkInMail(email, linkPrefix()));
      expectStatus(await new Client(closed).call('post', '/api/auth/signup', { email, password: PASSWORD, displayName: 'Gated', invitationToken: token }), 201);
    } finally {
      await closed.close();
    }
  });
});
