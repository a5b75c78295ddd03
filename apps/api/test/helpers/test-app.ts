import type { INestApplication } from '@nestjs/common';
import { Test } from '@nestjs/testing';
import { randomBytes } from 'node:crypto';
import request, { Response } from 'supertest';
import { DataSource } from 'typeorm';
import { CSRF_HEADER, type UserView } from '@cribra/contracts';
import { AppModule } from '../../src/app.module';
import { configureApp } from '../../src/app.setup';
import { AppConfig, appConfig, readAppConfig } from '../../src/config/app.config';

if (!process.env.DATABASE_URL) {
  throw new Error('DATABASE_URL is not set: run the API tests through `npm test -- --only=api` (it starts PostgreSQL and the SMTP fake).');
}

/**
 * The real application (same modules and the same configureApp as main.ts) on the test database,
 * without listening on a port. The launcher has run the migrations already.
 */
export async function createTestApp(overrides: Partial<AppConfig> = {}): Promise<INestApplication> {
  const cfg = { ...readAppConfig(), ...overrides };
  const moduleRef = await Test.createTestingModule({ imports: [AppModule] })
    .overrideProvider(appConfig.KEY)
    .useValue(cfg)
    .compile();
  const app = moduleRef.createNestApplication({ logger: ['error'] });
  configureApp(app);
  await app.init();
  return app;
}

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

/** A browser stand-in: keeps cookies, fetches and sends the CSRF token on state-changing requests. */
export class Client {
  jar = new Map<string, string>();
  csrf?: string;

  constructor(private readonly app: INestApplication) {}

  /** Same cookies and token against another app instance (e.g. after a restart). */
  on(app: INestApplication): Client {
    const c = new Client(app);
    c.jar = new Map(this.jar);
    c.csrf = this.csrf;
    return c;
  }

  cookie(name: string): string | undefined {
    return this.jar.get(name);
  }

  async fetchCsrf(): Promise<string> {
    const res = await this.call('get', '/api/auth/csrf');
    this.csrf = res.body.token;
    return this.csrf!;
  }

  async call(method: Method, path: string, body?: object, opts: { csrf?: boolean | string } = {}): Promise<Response> {
    let token: string | undefined;
    if (method !== 'get' && opts.csrf !== false) {
      token = typeof opts.csrf === 'string' ? opts.csrf : (this.csrf ?? (await this.fetchCsrf()));
    }
    let req = request(this.app.getHttpServer())[method](path);
    const cookies = [...this.jar].map(([k, v]) => `${k}=${v}`).join('; ');
    if (cookies) req = req.set('Cookie', cookies);
    if (token) req = req.set(CSRF_HEADER, token);
    const res = body === undefined ? await req : await req.send(body);
    this.keep(res.headers['set-cookie'] as unknown as string[] | undefined);
    return res;
  }

  private keep(setCookies: string[] | undefined): void {
    for (const line of setCookies ?? []) {
      const [pair, ...attrs] = line.split(';');
      const i = pair.indexOf('=');
      const name = pair.slice(0, i).trim();
      const value = pair.slice(i + 1).trim();
      const expired = attrs.some((a) => /^\s*expires=/i.test(a) && new Date(a.split('=')[1]).getTime() < Date.now());
      if (!value || expired) this.jar.delete(name);
      else this.jar.set(name, value);
    }
  }

  async signUp(email: string, password: string, displayName = 'Test Person'): Promise<Response> {
    return this.call('post', '/api/auth/signup', { email, password, displayName });
  }

  async signIn(email: string, password: string): Promise<Response> {
    return this.call('post', '/api/auth/signin', { email, password });
  }
}

/** An address no other test (or run) uses. */
export function uniqueEmail(tag: string): string {
  return `${tag}.${Date.now().toString(36)}${randomBytes(3).toString('hex')}@test.example`;
}

export const PASSWORD = 'correct-horse-7';

/** Signs up a fresh member and returns the signed-in client and its view. */
export async function newMember(app: INestApplication, tag = 'member'): Promise<{ client: Client; user: UserView; email: string }> {
  const client = new Client(app);
  const email = uniqueEmail(tag);
  const res = await client.signUp(email, PASSWORD);
  if (res.status !== 201) throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { client, user: res.body, email };
}

/** Signs up a fresh user and makes them a site admin directly in the database. */
export async function newAdmin(app: INestApplication): Promise<{ client: Client; user: UserView; email: string }> {
  const m = await newMember(app, 'admin');
  await app.get(DataSource).query(`UPDATE users SET site_role = 'admin' WHERE id = $1`, [m.user.id]);
  return m;
}
