// @vitest-environment jsdom
import { act, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';
import { blockingEntry, jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { BASE_SETUP, CAR, EVENT, IDS, list, runOnPhone, RUNS_URL, savedRun, user } from '../../fixtures/season';
import { COLLAB_IDS, comment, SHOP_NAME } from '../../fixtures/collab';

const PATH = `/events/${IDS.event}?carId=${IDS.car}`;

setUpAppTests(
  [() => import('@/app/routes/events/event-day'), () => import('@/app/shell-extras'), () => import('@/features/comments/components/comment-thread')],
  { clearLocalStorage: true },
);
beforeEach(() => localStorage.setItem(`scrubline.event-day.${IDS.event}`, JSON.stringify({ carId: IDS.car, driverId: IDS.maren })));

function stubDay(extra: Parameters<typeof stubFetch>[0] = {}) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user() }),
    [`GET /api/events/${IDS.event}`]: jsonResponse(200, EVENT),
    'GET /api/cars': list([CAR]),
    [`GET ${RUNS_URL}`]: list([savedRun({ id: IDS.run1, runNumber: 1, commentCount: 2 }), savedRun({ id: IDS.run2, runNumber: 2, isBest: false })]),
    [`GET /api/cars/${IDS.car}/setups`]: list([BASE_SETUP]),
    ...extra,
  });
}

describe('comments at the track', () => {
  it('when a run has comments, then its control says how many, and a tap opens the thread over the page', async () => {
    const fetchMock = stubDay({
      [`GET /api/comments?type=run&id=${IDS.run1}`]: list([
        comment({
          id: COLLAB_IDS.commentDusty,
          body: 'Try one click stiffer on the rear rebound.',
          author: { id: COLLAB_IDS.dusty, displayName: 'Dusty Okonjo' },
          shop: { id: COLLAB_IDS.shop, name: SHOP_NAME },
        }),
        comment({ id: COLLAB_IDS.commentMaren, body: 'Will try next heat.', mine: true }),
      ]),
    });
    renderApp(PATH);
    const u = userEvent.setup();

    const run1 = await screen.findByRole('listitem', { name: /^Run 1,/ });
    const button = within(run1).getByRole('button', { name: 'Comments (2) on run 1' });
    // Nothing is fetched for threads until one is opened.
    expect(requestsTo(fetchMock, `GET /api/comments?type=run&id=${IDS.run1}`)).toHaveLength(0);

    await u.click(button);

    const dialog = await screen.findByRole('dialog', { name: 'Comments on run 1' });
    expect(await within(dialog).findByText('Try one click stiffer on the rear rebound.')).toBeTruthy();
    expect(within(dialog).getByText(`· ${SHOP_NAME}`, { exact: false })).toBeTruthy();
    expect(within(dialog).getByLabelText('Add a comment')).toBeTruthy();
  });

  it('when the board is opened from a notification about a run, then that run’s thread opens over it, once, named by its number and driver', async () => {
    stubDay({
      [`GET /api/comments?type=run&id=${IDS.run2}`]: list([
        comment({ id: COLLAB_IDS.commentDusty, body: 'Rear looks loose on run 2.', author: { id: COLLAB_IDS.dusty, displayName: 'Dusty Okonjo' } }),
      ]),
    });
    const { router } = renderApp(`${PATH}&driverId=${IDS.maren}&comments=${IDS.run2}`);
    const u = userEvent.setup();

    // Named as the board names the run, once its runs are in: which run, and whose.
    const dialog = await screen.findByRole('dialog', { name: 'Comments on run 2, Maren Holt' });
    expect(await within(dialog).findByText('Rear looks loose on run 2.')).toBeTruthy();
    // The board stays for the same car and driver; the address no longer asks for the thread.
    expect(router.state.location.search).toBe(`?carId=${IDS.car}&driverId=${IDS.maren}`);
    await u.keyboard('{Escape}');
    expect(screen.queryByRole('dialog')).toBeNull();
    expect(await screen.findByRole('listitem', { name: /^Run 2,/ })).toBeTruthy();

    // The same notification followed again opens the thread again.
    await act(async () => void (await router.navigate(`${PATH}&driverId=${IDS.maren}&comments=${IDS.run2}`)));
    expect(await screen.findByRole('dialog', { name: 'Comments on run 2, Maren Holt' })).toBeTruthy();
  });

  it('when the board is opened from a notification about the day, then the car’s day thread opens', async () => {
    const url = `GET /api/comments?type=event&id=${IDS.event}&carId=${IDS.car}`;
    stubDay({ [url]: list([comment({ id: COLLAB_IDS.commentMaren, body: 'Cold start, grip came at heat 2.', mine: true })]) });
    renderApp(`${PATH}&comments=${IDS.event}`);

    const dialog = await screen.findByRole('dialog', { name: 'Comments on this day' });
    expect(await within(dialog).findByText('Cold start, grip came at heat 2.')).toBeTruthy();
  });

  it('when the car’s day is discussed, then the thread asks for this event and this car', async () => {
    const url = `GET /api/comments?type=event&id=${IDS.event}&carId=${IDS.car}`;
    const fetchMock = stubDay({ [url]: list([]) });
    renderApp(PATH);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: /^Comments on Grey roadster at / }));

    const dialog = await screen.findByRole('dialog', { name: /^Comments on Grey roadster at / });
    expect(await within(dialog).findByText('No comments yet.')).toBeTruthy();
    expect(requestsTo(fetchMock, url).length).toBeGreaterThan(0);
  });

  it('when a run is still on the phone, then it offers no thread (the server has no run to hang it on), while saved runs do', async () => {
    const waitingRun = runOnPhone();
    stubDay({
      [`GET ${RUNS_URL}`]: list([savedRun({ id: IDS.run1, runNumber: 1 })]),
      'POST /api/runs': () => Promise.reject(new TypeError('Failed to fetch')),
    });
    renderApp(PATH, { outboxEntries: [blockingEntry(), waitingRun] });

    const saved = await screen.findByRole('listitem', { name: /^Run 1,/ });
    const waiting = screen.getByRole('listitem', { name: /^Run 2,/ });
    expect(within(waiting).getByText('Waiting to upload')).toBeTruthy();
    expect(within(waiting).queryByRole('button', { name: /^Comments/ })).toBeNull();
    // A saved run without a count from the server still offers its thread, without a number.
    expect(within(saved).getByRole('button', { name: 'Comments on run 1' })).toBeTruthy();
  });
});
