// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { SeasonResult } from '../../../../shared/analysis/analysis.schema';
import { jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { BASE_SETUP, CAR, EVENT, IDS, list, RUNS_URL, savedRun } from '../../fixtures/season';
import { comment, staffUser, suggestion } from '../../fixtures/collab';

const PAGE = `/shop/customers/${IDS.car}`;

const SEASON: SeasonResult = {
  carId: IDS.car,
  events: [
    {
      eventId: IDS.event,
      name: EVENT.name,
      date: EVENT.date,
      venue: EVENT.venue,
      drivers: [{ driver: { id: IDS.maren, displayName: 'Maren Holt' }, bestRawSec: 45.5, bestAdjustedSec: 45.5, runCount: 2, cones: 1, classPosition: null }],
    },
  ],
  setupChanges: [],
  changeLog: [],
  tyreLife: [],
};

setUpAppTests([() => import('@/app/routes/shop/customer'), () => import('@/features/comments/components/comment-thread')]);

function stubCustomer(extra: Parameters<typeof stubFetch>[0] = {}) {
  return stubFetch({
    'GET /api/auth/me': jsonResponse(200, { user: staffUser() }),
    [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
    [`GET /api/cars/${IDS.car}/setups`]: list([BASE_SETUP]),
    [`GET /api/cars/${IDS.car}/season?minDepthMm=1.6`]: jsonResponse(200, SEASON),
    [`GET /api/cars/${IDS.car}/suggestions`]: list([suggestion()]),
    [`GET ${RUNS_URL}`]: list([
      savedRun({ id: IDS.run1, runNumber: 1, rawTimeSec: 45.5, adjustedTimeSec: 45.5, commentCount: 1 }),
      savedRun({ id: IDS.run2, runNumber: 2, rawTimeSec: 46.1, cones: 1, adjustedTimeSec: 48.1, isBest: false }),
    ]),
    ...extra,
  });
}

describe('a customer’s car, for the shop', () => {
  it('shows the season read-only: setups with "Suggest a change" and no way to record, and a link to the season review', async () => {
    stubCustomer();
    renderApp(PAGE);

    const history = await screen.findByRole('list', { name: 'Setup history, newest first' });
    const suggest = within(history).getByRole('link', { name: 'Suggest a change' });
    expect(suggest.getAttribute('href')).toBe(`/shop/customers/${IDS.car}/suggestions/new?from=${IDS.setupBase}`);
    expect(within(history).queryByRole('link', { name: /Start a new setup/ })).toBeNull();
    expect(screen.queryByRole('link', { name: /New setup/ })).toBeNull();
    expect(screen.getByRole('link', { name: 'Season review' }).getAttribute('href')).toBe(`/cars/${IDS.car}/review`);
    expect(within(await screen.findByRole('list', { name: 'Suggestions' })).getByText('More front camber')).toBeTruthy();
  });

  it('when an event is opened, then its runs show with times and each run’s comments, and the day’s thread is there too', async () => {
    const fetchMock = stubCustomer({ [`GET /api/comments?type=run&id=${IDS.run1}`]: list([]) });
    renderApp(PAGE);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Runs and comments' }));

    const runs = await screen.findByRole('list', { name: `Runs at ${EVENT.name}` });
    const [first, second] = within(runs).getAllByRole('listitem');
    expect(first!.textContent).toContain('Run 1');
    expect(first!.textContent).toContain('45.500');
    expect(first!.textContent).toContain('Setup: Spring baseline');
    expect(second!.textContent).toContain('+1 cone');
    expect(second!.textContent).toContain('48.100');
    // Each time says which it is, as on the driver's list.
    expect(within(first!).getByText('Adjusted 45.500')).toBeTruthy();
    expect(within(second!).getByText('Adjusted 48.100')).toBeTruthy();
    expect(screen.getByRole('button', { name: `Comments on the day at ${EVENT.name}` })).toBeTruthy();

    await u.click(within(first!).getByRole('button', { name: 'Comments (1) on run 1' }));
    await waitFor(() => expect(requestsTo(fetchMock, `GET /api/comments?type=run&id=${IDS.run1}`).length).toBeGreaterThan(0));
  });
});

describe('the customer page opened for one thread (a notification\'s link)', () => {
  afterEach(() => {
    vi.restoreAllMocks();
  });
  const scrolls = () => vi.spyOn(Element.prototype, 'scrollIntoView').mockImplementation(() => {});
  // jsdom draws nothing, so it has no scrollIntoView of its own to spy on.
  Element.prototype.scrollIntoView ??= () => {};

  it('when it names a run at an event, then that event\'s runs are out and the run\'s thread is open, read and scrolled to', async () => {
    const scrolled = scrolls();
    stubCustomer({
      [`GET /api/comments?type=run&id=${IDS.run1}`]: list([comment({ id: IDS.run2, body: 'Fronts still going off on the outer shoulder.' })]),
    });
    renderApp(`${PAGE}?event=${IDS.event}&comments=${IDS.run1}`);

    const runs = await screen.findByRole('list', { name: `Runs at ${EVENT.name}` });
    const [first, second] = within(runs).getAllByRole('listitem');
    expect(within(first!).getByRole('button', { name: 'Comments (1) on run 1' }).getAttribute('aria-expanded')).toBe('true');
    expect(await within(first!).findByText('Fronts still going off on the outer shoulder.')).toBeTruthy();
    // Only that run's: the others and the day's stay folded.
    expect(within(second!).getByRole('button', { name: /^Comments.* on run 2$/ }).getAttribute('aria-expanded')).toBe('false');
    expect(screen.getByRole('button', { name: `Comments on the day at ${EVENT.name}` }).getAttribute('aria-expanded')).toBe('false');
    expect(scrolled).toHaveBeenCalledTimes(1);
    expect(scrolled.mock.contexts[0]).toBe(within(first!).getByRole('button', { name: 'Comments (1) on run 1' }).parentElement);
  });

  it('when it names the day at an event, then the day\'s thread is open; when it names a setup, that setup\'s thread is', async () => {
    scrolls();
    stubCustomer({
      [`GET /api/comments?type=event&id=${IDS.event}&carId=${IDS.car}`]: list([]),
      [`GET /api/comments?type=setup&id=${IDS.setupBase}`]: list([]),
    });
    const day = renderApp(`${PAGE}?event=${IDS.event}&comments=${IDS.event}`);
    const dayThread = await screen.findByRole('button', { name: `Comments on the day at ${EVENT.name}` });
    expect(dayThread.getAttribute('aria-expanded')).toBe('true');
    day.unmount();

    renderApp(`${PAGE}?comments=${IDS.setupBase}`);
    const history = await screen.findByRole('list', { name: 'Setup history, newest first' });
    expect(within(history).getByRole('button', { name: 'Comments on “Spring baseline”' }).getAttribute('aria-expanded')).toBe('true');
    // No event named: every event stays folded.
    expect(screen.getByRole('button', { name: 'Runs and comments' }).getAttribute('aria-expanded')).toBe('false');
  });
});
