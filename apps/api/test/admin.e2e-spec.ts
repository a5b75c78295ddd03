import type { INestApplication } from '@nestjs/common';
import { Client, createTestApp, newAdmin, newMember } from './helpers/test-app';

describe('admin routes', () => {
  let app: INestApplication;
  beforeAll(async () => {
    app = await createTestApp({ signInLimit: 1000 });
  });
  afterAll(() => app.close());

  it('refuses a member (403) and a signed-out visitor (401)', async () => {
    const { client } = await newMember(app);
    const res = await client.call('get', '/api/admin/users');
    expect(res.status).toBe(403);
    expect(res.body).toEqual({ statusCode: 403, error: 'Forbidden', message: 'Only site admins may do this' });
    expect((await new Client(app).call('get', '/api/admin/users')).status).toBe(401);
    const { user } = await newMember(app);
    expect((await client.call('patch', `/api/admin/users/${user.id}`, { siteRole: 'admin' })).status).toBe(403);
  });

  it('lets an admin list users and change a role, which applies at once', async () => {
    const admin = await newAdmin(app);
    const member = await newMember(app);
    const list = await admin.client.call('get', '/api/admin/users');
    expect(list.status).toBe(200);
    expect(list.body.map((u: { email: string }) => u.email)).toEqual(expect.arrayContaining([admin.email, member.email]));
    // only the public view of each user (display names may contain anything, so check keys and hashes)
    for (const u of list.body) expect(Object.keys(u).sort()).toEqual(['createdAt', 'displayName', 'email', 'id', 'siteRole']);
    expect(JSON.stringify(list.body)).not.toContain('$argon2');

    const promoted = await admin.client.call('patch', `/api/admin/users/${member.user.id}`, { siteRole: 'admin' });
    expect(promoted.status).toBe(200);
    expect(promoted.body.siteRole).toBe('admin');
    // the member's existing session sees the new role without signing in again
    expect((await member.client.call('get', '/api/admin/users')).status).toBe(200);

    const demoted = await admin.client.call('patch', `/api/admin/users/${member.user.id}`, { siteRole: 'member' });
    expect(demoted.body.siteRole).toBe('member');
    expect((await member.client.call('get', '/api/admin/users')).status).toBe(403);
  });

  it('validates the role and the id', async () => {
    const admin = await newAdmin(app);
    const bad = await admin.client.call('patch', `/api/admin/users/${admin.user.id}`, { siteRole: 'owner' });
    expect(bad.status).toBe(400);
    expect(bad.body.details).toEqual([{ field: 'siteRole', messages: ['siteRole must be "admin" or "member"'] }]);
    expect((await admin.client.call('patch', '/api/admin/users/not-a-uuid', { siteRole: 'member' })).status).toBe(400);
    expect((await admin.client.call('patch', '/api/admin/users/00000000-0000-4000-8000-000000000000', { siteRole: 'member' })).status).toBe(404);
  });
});
