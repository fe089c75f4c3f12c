import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { makeTestApp, type TestApp } from '../test-app';

// The entry brings the app chunk; the trackside page's chunk brings two more, one of them through another.
const MANIFEST = {
  'index.html': { file: 'assets/index-a.js', isEntry: true, imports: ['_app-b.js'] },
  '_app-b.js': { file: 'assets/app-b.js' },
  'src/app/routes/events/event-day.tsx': { file: 'assets/event-day-c.js', imports: ['_trackside-d.js', '_app-b.js'] },
  '_trackside-d.js': { file: 'assets/trackside-d.js', imports: ['_ui-e.js'] },
  '_ui-e.js': { file: 'assets/ui-e.js' },
};
const APP_JS = Buffer.from(`export const app = ${JSON.stringify('scrubline '.repeat(400))};\n`);
/** The API reads a document names, with its `&amp;` read back as the browser reads it. */
const readsIn = (html: string) =>
  [...html.matchAll(/<link rel="preload" as="fetch" crossorigin href="([^"]+)">/g)].map((m) => m[1]!.replaceAll('&amp;', '&'));
const preloadsIn = (html: string) => [...html.matchAll(/<link rel="modulepreload" crossorigin href="([^"]+)">/g)].map((m) => m[1]);

let t: TestApp;
let clientDir: string;
let app: ReturnType<typeof createApp>;
beforeAll(async () => {
  t = await makeTestApp();
  clientDir = mkdtempSync(join(tmpdir(), 'scrubline-client-'));
  writeFileSync(join(clientDir, 'index.html'), '<html><head><meta name="csp-nonce" content="__CSP_NONCE__" /></head><body>app</body></html>');
  writeFileSync(join(clientDir, 'sw.js'), 'self.addEventListener("fetch", () => {});');
  // A build as vite.config.ts makes it: a manifest, and each script with its Brotli and gzip copies.
  mkdirSync(join(clientDir, 'assets'));
  mkdirSync(join(clientDir, '.vite'));
  writeFileSync(join(clientDir, '.vite', 'manifest.json'), JSON.stringify(MANIFEST));
  writeFileSync(join(clientDir, 'assets', 'app-b.js'), APP_JS);
  writeFileSync(join(clientDir, 'assets', 'app-b.js.br'), brotliCompressSync(APP_JS));
  writeFileSync(join(clientDir, 'assets', 'app-b.js.gz'), gzipSync(APP_JS));
  app = createApp({ ds: t.ds, pool: t.pool, clientDir, session: { secret: 'x'.repeat(32), idleMs: 60_000, absoluteMs: 60_000, secureCookie: false } });
});
afterAll(async () => {
  await t.close();
  rmSync(clientDir, { recursive: true, force: true });
});

const nonceIn = (csp: string) => /style-src 'self' 'nonce-([A-Za-z0-9+/=]+)'/.exec(csp)?.[1];

describe('serving the client', () => {
  it('when any page is opened, then index.html carries the same fresh style nonce as its CSP header', async () => {
    const first = await request(app).get('/events/some-day');
    expect(first.status).toBe(200);
    const nonce = nonceIn(first.headers['content-security-policy'] as string);
    expect(nonce).toBeDefined();
    expect(first.text).toContain(`content="${nonce}"`);
    expect(first.text).not.toContain('__CSP_NONCE__');
    const second = await request(app).get('/index.html');
    expect(second.text).not.toContain('__CSP_NONCE__');
    expect(nonceIn(second.headers['content-security-policy'] as string)).not.toBe(nonce);
  });

  it('when a file of the build is asked for, then it is served as it is', async () => {
    const res = await request(app).get('/sw.js');
    expect(res.status).toBe(200);
    expect(res.text).toContain('addEventListener');
  });

  it('when an unknown /api path is asked for, then it is a JSON 404, not the page', async () => {
    const res = await request(app).get('/api/nothing-here');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('when the trackside page is opened, then its document names the chunks of that page the entry does not bring, inside <head>', async () => {
    const res = await request(app).get('/events/some-day?carId=x');
    expect(preloadsIn(res.text).sort()).toEqual(['/assets/event-day-c.js', '/assets/trackside-d.js', '/assets/ui-e.js']);
    expect(res.text.indexOf('modulepreload')).toBeLessThan(res.text.indexOf('</head>'));
  });

  it('when the trackside page is opened with its car, then its document names the reads the page makes first, at the addresses the client asks for', async () => {
    const eventId = '2fbc14dd-8584-48aa-b5b5-cc414c6101e8';
    const carId = '0953b2ca-f177-4ae5-9077-4787850bcc56';
    const res = await request(app).get(`/events/${eventId}?carId=${carId}&driverId=someone`);
    expect(readsIn(res.text)).toEqual([
      '/api/auth/session',
      '/api/cars',
      `/api/events/${eventId}`,
      `/api/cars/${carId}/setups`,
      // The query as the client writes it (URLSearchParams of { carId, eventId }), or the browser would ask again.
      `/api/runs?${new URLSearchParams({ carId, eventId }).toString()}`,
    ]);
    expect(res.text.indexOf('as="fetch"')).toBeLessThan(res.text.indexOf('</head>'));
    // Without the car in the address, the car is the one the phone remembers: only the event is named.
    expect(readsIn((await request(app).get(`/events/${eventId}`)).text)).toEqual(['/api/auth/session', '/api/cars', `/api/events/${eventId}`]);
  });

  it('when the address holds something other than ids, then none of it reaches the document', async () => {
    const res = await request(app).get('/events/%22%3E%3Cscript%3E?carId=%22%3E%3Cimg%20src%3Dx%3E');
    expect(readsIn(res.text)).toEqual(['/api/auth/session']);
    expect(res.text).not.toContain('<script>');
    expect(res.text).not.toContain('<img');
    const car = await request(app).get('/events/2fbc14dd-8584-48aa-b5b5-cc414c6101e8?carId=x');
    expect(readsIn(car.text)).toEqual(['/api/auth/session', '/api/cars', '/api/events/2fbc14dd-8584-48aa-b5b5-cc414c6101e8']);
    expect(readsIn((await request(app).get('/settings')).text)).toEqual(['/api/auth/session']);
  });

  it('when a page of no listed chunk is opened, then the document names none', async () => {
    expect(preloadsIn((await request(app).get('/settings')).text)).toEqual([]);
    expect(preloadsIn((await request(app).get('/events/some-day/more')).text)).toEqual([]);
  });

  it('when a script is asked for, then the copy the browser accepts best is sent as built, with its own type and a year of caching', async () => {
    const raw = (accept: string) =>
      request(app)
        .get('/assets/app-b.js')
        .set('Accept-Encoding', accept)
        .buffer(true)
        .parse((res, done) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () => done(null, Buffer.concat(chunks)));
        });
    // The HTTP client decodes, as a browser does; the length sent is that of the copy made at build.
    const br = await raw('gzip, deflate, br, zstd');
    expect(br.headers['content-encoding']).toBe('br');
    expect(Number(br.headers['content-length'])).toBe(brotliCompressSync(APP_JS).length);
    const gz = await raw('gzip, deflate');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(Number(gz.headers['content-length'])).toBe(gzipSync(APP_JS).length);
    const plain = await raw('identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    for (const res of [br, gz, plain]) {
      expect(res.body).toEqual(APP_JS);
      expect(res.headers['content-type']).toMatch(/^text\/javascript/);
      expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
      expect(res.headers.vary).toMatch(/Accept-Encoding/);
    }
  });
});

