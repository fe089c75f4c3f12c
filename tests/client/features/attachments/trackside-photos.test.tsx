// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';
import { jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { BASE_SETUP, CAR, EVENT, IDS, list, RUNS_URL, savedRun, user } from '../../fixtures/season';

const PATH = `/events/${IDS.event}?carId=${IDS.car}`;
const RUN_PHOTOS = `GET /api/attachments?targetType=run&targetId=${IDS.run1}`;

setUpAppTests(
  [
    () => import('@/app/routes/events/event-day'),
    () => import('@/app/shell-extras'),
    () => import('@/features/comments/components/comment-thread'),
    () => import('@/features/attachments/components/attachment-strip'),
  ],
  { clearLocalStorage: true },
);
beforeEach(() => localStorage.setItem(`scrubline.event-day.${IDS.event}`, JSON.stringify({ carId: IDS.car, driverId: IDS.maren })));

describe('photos of a run at the track', () => {
  it('when a run’s comments are opened, then its photos fold out in the same dialog, and are asked for only then', async () => {
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET /api/events/${IDS.event}`]: jsonResponse(200, EVENT),
      'GET /api/cars': list([CAR]),
      [`GET ${RUNS_URL}`]: list([savedRun({ id: IDS.run1, runNumber: 1 })]),
      [`GET /api/cars/${IDS.car}/setups`]: list([BASE_SETUP]),
      [`GET /api/comments?type=run&id=${IDS.run1}`]: list([]),
      [RUN_PHOTOS]: list([]),
    });
    renderApp(PATH);
    const u = userEvent.setup();

    const run1 = await screen.findByRole('listitem', { name: /^Run 1,/ });
    await u.click(within(run1).getByRole('button', { name: /^Comments.* on run 1$/ }));
    const dialog = await screen.findByRole('dialog', { name: 'Comments on run 1' });
    const toggle = await within(dialog).findByRole('button', { name: 'Photos and files on this run' });
    expect(requestsTo(fetchMock, RUN_PHOTOS)).toHaveLength(0);

    await u.click(toggle);

    expect(await within(dialog).findByText('No photos yet.')).toBeTruthy();
    expect(within(dialog).getByLabelText('Add photos to this run')).toBeTruthy();
    await waitFor(() => expect(requestsTo(fetchMock, RUN_PHOTOS).length).toBeGreaterThan(0));
  }, 20_000);
});
