import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { sentCookie, type client, type TestApp } from './test-app';

export interface OpenBodyAnswer {
  status: number;
  body: { error?: { code?: string; message?: string } };
  /** The request body had not been ended when the whole answer arrived. */
  bodyStillOpen: boolean;
}

/**
 * POSTs the headers and a first chunk of a body that never ends (chunked, no Content-Length, so no
 * parser can refuse it by its declared size), then waits. A server that decides before reading the
 * body answers at once; one that reads the body first never answers, and this rejects after
 * `timeoutMs`. Supertest cannot do this: it always ends the request.
 */
export async function answerWhileBodyOpen(
  app: TestApp['app'],
  opts: { path: string; headers: Record<string, string>; firstChunk: string | Buffer; timeoutMs?: number },
): Promise<OpenBodyAnswer> {
  const server = http.createServer(app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  const timeoutMs = opts.timeoutMs ?? 5_000;
  try {
    return await new Promise<OpenBodyAnswer>((resolve, reject) => {
      const req = http.request({ host: '127.0.0.1', port, method: 'POST', path: opts.path, headers: opts.headers });
      const timer = setTimeout(() => {
        req.destroy();
        reject(new Error(`No answer within ${timeoutMs} ms while the body was still open: the server waited for the body`));
      }, timeoutMs);
      req.on('response', (res) => {
        let text = '';
        res.setEncoding('utf8');
        res.on('data', (chunk: string) => (text += chunk));
        res.on('end', () => {
          clearTimeout(timer);
          const bodyStillOpen = !req.writableEnded;
          req.destroy();
          try {
            resolve({ status: res.statusCode ?? 0, body: JSON.parse(text) as OpenBodyAnswer['body'], bodyStillOpen });
          } catch (err) {
            reject(err instanceof Error ? err : new Error(String(err)));
          }
        });
      });
      req.on('error', (err) => {
        clearTimeout(timer);
        reject(err);
      });
      req.write(opts.firstChunk);
    });
  } finally {
    server.closeAllConnections();
    await new Promise<void>((resolve) => server.close(() => resolve()));
  }
}

/** A test client's session cookie and CSRF token, for a request made outside supertest. */
export async function credentialsOf(c: ReturnType<typeof client>): Promise<{ Cookie: string; 'X-CSRF-Token': string }> {
  await c.csrf(); // a client that has not asked yet gets its session cookie here
  const res = await c.agent.get('/api/auth/csrf').expect(200);
  return { Cookie: sentCookie(res), 'X-CSRF-Token': (res.body as { token: string }).token };
}
