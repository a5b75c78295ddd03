import type { INestApplication } from '@nestjs/common';
import { Client, createTestApp, newMember, PASSWORD } from './helpers/test-app';

describe('sign-in rate limit', () => {
  let app: INestApplication;
  beforeAll(async () => {
    app = await createTestApp({ signInLimit: 3, signInWindowMs: 60_000 });
  });
  afterAll(() => app.close());

  it('allows 3 attempts per address and client, then answers 429 even for the right password', async () => {
    const { email } = await newMember(app, 'limited');
    const c = new Client(app);
    for (let i = 0; i < 3; i++) expect((await c.signIn(email, `wrong-guess-${i}`)).status).toBe(401);
    const blocked = await c.signIn(email, PASSWORD);
    expect(blocked.status).toBe(429);
    expect(blocked.body).toEqual({ statusCode: 429, error: 'Too Many Requests', message: expect.stringMatching(/Too many attempts/) });
    expect(c.cookie('cribra.sid')).toBeUndefined();
  });

  it('counts each address separately', async () => {
    const a = await newMember(app, 'limit-a');
    const b = await newMember(app, 'limit-b');
    const c = new Client(app);
    for (let i = 0; i < 3; i++) await c.signIn(a.email, 'wrong-guess');
    expect((await c.signIn(a.email, PASSWORD)).status).toBe(429);
    expect((await c.signIn(b.email, PASSWORD)).status).toBe(200);
  });
});
