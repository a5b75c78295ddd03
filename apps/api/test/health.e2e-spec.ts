import type { INestApplication } from '@nestjs/common';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { createTestApp } from './helpers/test-app';

describe('health, headers, errors and the web app', () => {
  let app: INestApplication;
  let web: string;
  beforeAll(async () => {
    web = mkdtempSync(join(tmpdir(), 'cribra-web-'));
    writeFileSync(join(web, 'index.html'), '<!doctype html><title>cribra test page</title>');
    writeFileSync(join(web, 'app.js'), 'console.log(1)');
    app = await createTestApp({ webDist: web });
  });
  afterAll(async () => {
    await app.close();
    rmSync(web, { recursive: true, force: true });
  });

  it('reports the database as up', async () => {
    const res = await request(app.getHttpServer()).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', database: 'up' });
  });

  it('sends helmet headers with a CSP that allows nothing remote', async () => {
    const res = await request(app.getHttpServer()).get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    const csp = res.headers['content-security-policy'] as string;
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("worker-src 'self' blob:");
    expect(csp).not.toMatch(/https?:|upgrade-insecure-requests|unsafe-eval/);
    expect(res.headers['strict-transport-security']).toBeUndefined();
  });

  it('answers unknown API routes with 404 in the error shape', async () => {
    const res = await request(app.getHttpServer()).get('/api/no-such-route');
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ statusCode: 404, error: 'Not Found', message: expect.any(String) });
  });

  it('serves the web app files and falls back to index.html for app routes', async () => {
    const file = await request(app.getHttpServer()).get('/app.js');
    expect(file.status).toBe(200);
    expect(file.text).toBe('console.log(1)');
    const page = await request(app.getHttpServer()).get('/notebooks/123');
    expect(page.status).toBe(200);
    expect(page.text).toContain('cribra test page');
  });

  it('publishes the OpenAPI description under /api/docs', async () => {
    const res = await request(app.getHttpServer()).get('/api/docs-json');
    expect(res.status).toBe(200);
    expect(Object.keys(res.body.paths)).toEqual(expect.arrayContaining(['/api/auth/signin', '/api/admin/users', '/api/health']));
  });
});
