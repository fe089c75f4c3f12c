import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { api, ApiError, CSRF_HEADER, dropCsrfToken, NETWORK_MESSAGE } from '@/lib/api-client';
import { CSRF_TOKEN, errorResponse, jsonResponse, requestsTo, stubFetch } from '../test-utils';

beforeEach(() => {
  dropCsrfToken();
});

afterEach(() => {
  vi.unstubAllGlobals();
});

async function caught(promise: Promise<unknown>): Promise<ApiError> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof ApiError) return error;
    throw error;
  }
  throw new Error('expected the request to fail');
}

describe('api client', () => {
  it('when the server answers with the error envelope, then it throws an ApiError with status, code, message and fieldErrors', async () => {
    stubFetch({
      'POST /api/auth/register': errorResponse(400, 'validation_failed', 'Check the fields.', {
        password: ['Use at least 12 characters'],
      }),
    });

    const error = await caught(api.post('/api/auth/register', { email: 'a@b.c' }));

    expect(error).toBeInstanceOf(ApiError);
    expect(error.status).toBe(400);
    expect(error.code).toBe('validation_failed');
    expect(error.message).toBe('Check the fields.');
    expect(error.fieldErrors).toEqual({ password: ['Use at least 12 characters'] });
    expect(error.hasFieldErrors).toBe(true);
  });

  it('when a read succeeds, then it sends same-origin credentials and returns the parsed JSON', async () => {
    const fetchMock = stubFetch({ 'GET /api/things': jsonResponse(200, { count: 2 }) });

    const data = await api.get('/api/things', { schema: z.object({ count: z.number() }) });

    expect(data).toEqual({ count: 2 });
    const init = fetchMock.mock.calls[0]?.[1];
    expect(init?.credentials).toBe('same-origin');
    expect(requestsTo(fetchMock, 'GET /api/auth/csrf')).toHaveLength(0);
  });

  it('when writing, then it fetches the CSRF token once and sends it as X-CSRF-Token on every write', async () => {
    const fetchMock = stubFetch({
      'POST /api/things': jsonResponse(201, { ok: true }),
      'DELETE /api/things/1': jsonResponse(204),
    });

    await api.post('/api/things', { name: 'a' });
    await api.delete('/api/things/1');

    expect(requestsTo(fetchMock, 'GET /api/auth/csrf')).toHaveLength(1);
    const [post] = requestsTo(fetchMock, 'POST /api/things');
    expect(post?.headers.get(CSRF_HEADER)).toBe(CSRF_TOKEN);
    expect(post?.headers.get('Content-Type')).toBe('application/json');
    expect(post?.body).toEqual({ name: 'a' });
    expect(requestsTo(fetchMock, 'DELETE /api/things/1')[0]?.headers.get(CSRF_HEADER)).toBe(CSRF_TOKEN);
  });

  it('when the server answers 403 csrf_invalid, then it fetches a fresh token and retries the write once', async () => {
    const fetchMock = stubFetch({
      'GET /api/auth/csrf': [jsonResponse(200, { token: 'old' }), jsonResponse(200, { token: 'new' })],
      'POST /api/things': [errorResponse(403, 'csrf_invalid', 'The form expired.'), jsonResponse(201, { ok: true })],
    });

    await expect(api.post('/api/things', {})).resolves.toEqual({ ok: true });

    const writes = requestsTo(fetchMock, 'POST /api/things');
    expect(writes.map((w) => w.headers.get(CSRF_HEADER))).toEqual(['old', 'new']);
  });

  it('when the retry after csrf_invalid fails again, then it gives up with that error instead of looping', async () => {
    const fetchMock = stubFetch({
      'POST /api/things': errorResponse(403, 'csrf_invalid', 'The form expired or came from elsewhere.'),
    });

    const error = await caught(api.post('/api/things', {}));

    expect(error.code).toBe('csrf_invalid');
    expect(requestsTo(fetchMock, 'POST /api/things')).toHaveLength(2);
  });

  it('when the cached token is dropped (after sign-in or sign-out), then the next write fetches a new one', async () => {
    const fetchMock = stubFetch({ 'POST /api/things': jsonResponse(201, {}) });

    await api.post('/api/things', {});
    dropCsrfToken();
    await api.post('/api/things', {});

    expect(requestsTo(fetchMock, 'GET /api/auth/csrf')).toHaveLength(2);
  });

  it('when the network fails, then it throws an ApiError with code network and a plain message', async () => {
    vi.stubGlobal('fetch', vi.fn<typeof fetch>().mockRejectedValue(new TypeError('Failed to fetch')));

    const error = await caught(api.get('/api/things'));

    expect(error.status).toBe(0);
    expect(error.code).toBe('network');
    expect(error.message).toBe(NETWORK_MESSAGE);
  });

  it('when the network fails while fetching the CSRF token, then the write fails with code network', async () => {
    vi.stubGlobal('fetch', vi.fn<typeof fetch>().mockRejectedValue(new TypeError('Failed to fetch')));

    const error = await caught(api.post('/api/things', {}));

    expect(error.code).toBe('network');
  });

  it('when an answer is not our envelope (a gateway page), then it still throws an ApiError with the status', async () => {
    stubFetch({ 'GET /api/things': new Response('<html>Bad gateway</html>', { status: 502 }) });

    const error = await caught(api.get('/api/things'));

    expect(error.status).toBe(502);
    expect(error.code).toBe('unavailable');
    expect(error.message).toMatch(/saved data is safe/);
  });

  it('when a successful answer does not match the expected shape, then it throws unexpected_response', async () => {
    stubFetch({ 'GET /api/things': jsonResponse(200, { count: 'two' }) });

    const error = await caught(api.get('/api/things', { schema: z.object({ count: z.number() }) }));

    expect(error.code).toBe('unexpected_response');
  });

  it('when a request is aborted, then the abort is passed on untouched for the query library', async () => {
    const abort = new DOMException('The operation was aborted.', 'AbortError');
    vi.stubGlobal('fetch', vi.fn<typeof fetch>().mockRejectedValue(abort));

    await expect(api.get('/api/things')).rejects.toBe(abort);
  });
});
