import { createTestApp, newMember } from './helpers/test-app';

describe('sessions live in PostgreSQL', () => {
  it('keeps a user signed in across an API restart (same cookie, new app instance)', async () => {
    const first = await createTestApp();
    const { client, email } = await newMember(first, 'restart');
    expect((await client.call('get', '/api/auth/me')).status).toBe(200);
    await first.close();

    const second = await createTestApp();
    try {
      const same = client.on(second);
      const me = await same.call('get', '/api/auth/me');
      expect(me.status).toBe(200);
      expect(me.body.email).toBe(email);
      // and a cookie that was never issued does not sign anyone in
      const forged = client.on(second);
      forged.jar.set('cribra.sid', 's%3Aforged.signature');
      expect((await forged.call('get', '/api/auth/me')).status).toBe(401);
    } finally {
      await second.close();
    }
  });
});
