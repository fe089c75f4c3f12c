// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { CAR, IDS, list, TYRE_SET, user } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/cars/tread'), () => import('@/features/comments/components/comment-thread')]);

describe('comments on a tread reading', () => {
  it('when the latest reading’s comments are opened, then that reading’s thread is asked for', async () => {
    const reading = TYRE_SET.latestReading!;
    const url = `GET /api/comments?type=tread_reading&id=${reading.id}`;
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
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
