// A signed-in API client for the benchmark: the session cookie and the CSRF token a browser would hold.
import { SESSION_COOKIE } from '../../server/auth/session';

export interface BenchSession {
  base: string;
  /** `scrubline.sid=…`, as sent in the Cookie header. */
  cookie: string;
  csrfToken: string;
  get<T = unknown>(path: string): Promise<T>;
  post<T = unknown>(path: string, body: unknown): Promise<T>;
}

function sessionCookieOf(res: Response): string | undefined {
  return res.headers.getSetCookie().find((c) => c.startsWith(`${SESSION_COOKIE}=`))?.split(';')[0];
}

async function open(base: string, path: string, body: unknown): Promise<BenchSession> {
  const csrfRes = await fetch(`${base}/api/auth/csrf`);
  let cookie = sessionCookieOf(csrfRes) ?? '';
  let { token } = (await csrfRes.json()) as { token: string };
  const res = await fetch(base + path, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': token, Cookie: cookie },
    body: JSON.stringify(body),
  });
  if (!res.ok) throw new Error(`${path}: ${res.status} ${await res.text()}`);
  cookie = sessionCookieOf(res) ?? cookie;
  // Signing in regenerates the session, and with it the token.
  token = ((await (await fetch(`${base}/api/auth/csrf`, { headers: { Cookie: cookie } })).json()) as { token: string }).token;

  const call = async <T>(method: string, p: string, payload?: unknown): Promise<T> => {
    const r = await fetch(base + p, {
      method,
      headers: { Cookie: cookie, 'X-CSRF-Token': token, ...(payload === undefined ? {} : { 'Content-Type': 'application/json' }) },
      body: payload === undefined ? undefined : JSON.stringify(payload),
    });
    if (!r.ok) throw new Error(`${method} ${p}: ${r.status} ${await r.text()}`);
    return (await r.json()) as T;
  };
  return {
    base,
    cookie,
    csrfToken: token,
    get: (p) => call('GET', p),
    post: (p, payload) => call('POST', p, payload),
  };
}

export const signIn = (base: string, email: string, password: string) => open(base, '/api/auth/login', { email, password });

export const register = (base: string, email: string, password: string, displayName: string) =>
  open(base, '/api/auth/register', { email, password, displayName });
