import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import express from 'express';
import request from 'supertest';
import { apiErrorSchema } from '../../../shared/api/api-error.schema';
import { errorHandler } from '../../../server/lib/error-handler';
import { client, makeTestApp, type TestApp } from '../test-app';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('the error envelope', () => {
  it('when the JSON body is malformed, then 400 malformed_json, not 500', async () => {
    const c = client(t.app);
    const token = await c.csrf();
    const res = await c.agent
      .post('/api/auth/login')
      .set('X-CSRF-Token', token)
      .set('Content-Type', 'application/json')
      .send('{"email": "a@b.c", ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_json');
    expect(apiErrorSchema.safeParse(res.body).success).toBe(true);
  });

  it('when the body is over the size limit, then 413 in the envelope', async () => {
    const c = client(t.app);
    const res = await c.post('/api/auth/login', { email: 'a@example.com', password: 'x'.repeat(200_000) });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
  });

  it('when an /api path does not exist, then 404 in the envelope', async () => {
    const res = await request(t.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('when a handler fails unexpectedly, then 500 with a generic message and request id, never the stack', async () => {
    const app = express();
    app.use((req, _res, next) => {
      (req as unknown as { id: string }).id = 'req-123';
      next();
    });
    app.get('/boom', () => {
      throw new Error('relation "secret_table" does not exist at /srv/app/server.ts:42');
    });
    app.use(errorHandler);
    const res = await request(app).get('/boom');
    expect(res.status).toBe(500);
    expect(res.body).toEqual({ error: { code: 'internal', message: expect.any(String), requestId: 'req-123' } });
    expect(JSON.stringify(res.body)).not.toMatch(/secret_table|server\.ts|at /);
  });
});

describe('security headers', () => {
  it('when any response is sent, then it carries a same-origin CSP and nosniff', async () => {
    const res = await request(t.app).get('/api/health');
    const csp = res.headers['content-security-policy'] as string;
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).not.toMatch(/https?:\/\//);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('when an API answer is sent, then no cache may keep it (OWASP ASVS 4.0.3, 8.2.1)', async () => {
    for (const path of ['/api/health', '/api/auth/me', '/api/no-such-route']) {
      expect((await request(t.app).get(path)).headers['cache-control'], path).toBe('no-store');
    }
  });
});
