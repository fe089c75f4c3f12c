// @vitest-environment jsdom
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { dropCsrfToken } from '@/lib/api-client';
import { clearToasts } from '@/lib/toast-store';
import { clearTestOutboxes, jsonResponse, renderApp, requestsTo, stubFetch } from '../../test-utils';
import { CAR, IDS, list, TYRE_SET, user } from '../../fixtures/season';

beforeAll(async () => {
  await import('@/app/routes/cars/tread');
  await import('@/features/comments/components/comment-thread');
}, 30_000);
beforeEach(() => dropCsrfToken());
afterEach(async () => {
  await clearTestOutboxes();
  cleanup();
  clearToasts();
  vi.unstubAllGlobals();
});

describe('comments on a tread reading', () => {
  it('when the latest reading’s comments are opened, then that reading’s thread is asked for', async () => {
    const reading = TYRE_SET.latestReading!;
    const url = `GET /api/comments?type=tread_reading&id=${reading.id}`;
    const fetchMock = stubFetch({
      'GET /api/auth/me': jsonResponse(200, { user: user() }),
      [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
      [`GET /api/cars/${IDS.car}/tyre-sets`]: list([TYRE_SET]),
      [url]: list([]),
    });
    renderApp(`/cars/${IDS.car}/tread`);
    const u = userEvent.setup();

    const readings = await screen.findByRole('list', { name: 'Latest reading of each set' });
    await u.click(within(readings).getByRole('button', { name: 'Comments on the Set B (2026) reading' }));

    expect(await within(readings).findByLabelText('Add a comment')).toBeTruthy();
    await waitFor(() => expect(requestsTo(fetchMock, url).length).toBeGreaterThan(0));
  });
});
