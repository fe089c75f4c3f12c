// @vitest-environment jsdom
import { cleanup, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { dropCsrfToken } from '@/lib/api-client';
import { clearToasts } from '@/lib/toast-store';
import { clearTestOutboxes, CSRF_TOKEN, errorResponse, jsonResponse, renderApp, requestsTo, stubFetch } from '../../test-utils';

const TOKEN = '9b0c1d2e-3f40-4152-8637-48596a7b8c9d';
const SIGNED_OUT = errorResponse(401, 'unauthenticated', 'Sign in to continue.');

beforeAll(async () => {
  await import('@/app/routes/account/unsubscribe');
}, 30_000);
beforeEach(() => dropCsrfToken());
afterEach(async () => {
  await clearTestOutboxes();
  cleanup();
  clearToasts();
  vi.unstubAllGlobals();
});

describe('unsubscribe page', () => {
  it('when the button is pressed, then the token is posted with the CSRF token and the page says how to turn e-mails back on', async () => {
    const fetchMock = stubFetch({ 'GET /api/auth/me': SIGNED_OUT, [`POST /api/unsubscribe/${TOKEN}`]: jsonResponse(204) });
    renderApp(`/unsubscribe/${TOKEN}`);
    const u = userEvent.setup();

    expect(requestsTo(fetchMock, `POST /api/unsubscribe/${TOKEN}`)).toHaveLength(0);
    await u.click(await screen.findByRole('button', { name: 'Stop notification e-mails' }));

    expect(await screen.findByText('Done: Scrubline sends you no more notification e-mails.')).toBeTruthy();
    expect(screen.getByText(/open Settings and switch on “E-mail me about comments and suggestions”/)).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Open Settings' }).getAttribute('href')).toBe('/settings');
    const [sent] = requestsTo(fetchMock, `POST /api/unsubscribe/${TOKEN}`);
    expect(sent?.headers.get('X-CSRF-Token')).toBe(CSRF_TOKEN);
  });

  it('when the link names nobody, then the page says the link does not work and where else to turn e-mails off', async () => {
    stubFetch({
      'GET /api/auth/me': SIGNED_OUT,
      [`POST /api/unsubscribe/${TOKEN}`]: errorResponse(404, 'not_found', 'That unsubscribe link was not found.'),
    });
    renderApp(`/unsubscribe/${TOKEN}`);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Stop notification e-mails' }));

    expect(await screen.findByText(/This link does not work/)).toBeTruthy();
    expect(screen.queryByText(/Done:/)).toBeNull();
  });
});
