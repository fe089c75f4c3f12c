// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { SeasonResult } from '../../../../shared/analysis/analysis.schema';
import { IMPERIAL_PREFERENCES, MM_PER_INCH } from '../../../../shared/calc/units.calc';
import type { ChangeLogEntry } from '../../../../shared/season/change-log.schema';
import { jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { BASE_SETUP, CAR, EVENT, IDS, list, RUNS_URL, savedRun, TYRE_SET } from '../../fixtures/season';
import { COLLAB_IDS, comment, staffUser, suggestion } from '../../fixtures/collab';

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
    'GET /api/auth/session': jsonResponse(200, { user: staffUser() }),
    [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
    [`GET /api/cars/${IDS.car}/setups`]: list([BASE_SETUP]),
    [`GET /api/cars/${IDS.car}/season?minDepthMm=1.6`]: jsonResponse(200, SEASON),
    [`GET /api/cars/${IDS.car}/suggestions`]: list([suggestion()]),
    [`GET /api/cars/${IDS.car}/tyre-sets`]: list([]),
    [`GET /api/cars/${IDS.car}/changes`]: list([]),
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

describe('a customer’s tyres, change log and hot pressures, for the shop', () => {
  /** Staff who read in inches and psi. */
  const imperialStaff = () => ({ ...staffUser(), preferences: { units: IMPERIAL_PREFERENCES } });
  /** n/32 in in mm (1 in = 25.4 mm exactly, NIST SP 811). */
  const in32 = (n: number) => (n * MM_PER_INCH) / 32;

  it('when staff open the car, then each tyre set shows read only: whether it is on the car, its runs, and its latest tread per corner, inner, middle and outer, in their units', async () => {
    stubCustomer({
      'GET /api/auth/session': jsonResponse(200, { user: imperialStaff() }),
      [`GET /api/cars/${IDS.car}/tyre-sets`]: list([
        {
          ...TYRE_SET,
          runs: 12,
          latestReading: {
            ...TYRE_SET.latestReading!,
            // Worn on the inner edge at the front, as too much negative camber wears it.
            corners: {
              lf: { innerMm: in32(2), middleMm: in32(5), outerMm: in32(6), tyreNumber: 1 },
              rf: { innerMm: in32(3), middleMm: in32(5), outerMm: in32(6), tyreNumber: 2 },
              lr: { innerMm: in32(6), middleMm: in32(6), outerMm: in32(6), tyreNumber: 3 },
            },
          },
        },
      ]),
    });
    renderApp(PAGE);

    const tyres = await screen.findByRole('region', { name: 'Tyres' });
    const set = (await within(tyres).findByRole('heading', { name: TYRE_SET.label })).closest('li')!;
    expect(set.textContent).toContain('On the car');
    expect(set.textContent).toContain('12 runs on this set');
    const tread = within(set).getByRole('group', { name: 'Tread depth (/32 in)' });
    const corner = (name: string) => within(tread).getByRole('group', { name }).textContent;
    expect(corner('Left front')).toContain('inner 2.0/32 in, at or below the wear bars');
    expect(corner('Left front')).toContain('middle 5.0/32 in');
    expect(corner('Left front')).toContain('outer 6.0/32 in');
    expect(corner('Right front')).toContain('inner 3.0/32 in');
    expect(corner('Right front')).not.toContain('wear bars');
    expect(corner('Right rear')).toContain('Not measured');
    // Nothing to enter, rotate, fit or add: the drivers record their tyres.
    expect(within(tyres).queryAllByRole('button')).toHaveLength(0);
    expect(within(tyres).queryAllByRole('link')).toHaveLength(0);
    expect(screen.queryByRole('link', { name: /Enter tread/ })).toBeNull();
  });

  it('when staff open the car, then its change log shows newest first, a visit\'s entries marked, with no form and nothing to delete', async () => {
    const change = (partial: Partial<ChangeLogEntry> & Pick<ChangeLogEntry, 'id' | 'changedOn' | 'what'>): ChangeLogEntry => ({
      carId: IDS.car,
      location: 'car',
      notes: null,
      setupId: null,
      fromVisit: false,
      createdBy: { id: IDS.maren, displayName: 'Maren Holt' },
      createdAt: `${partial.changedOn}T18:00:00.000Z`,
      ...partial,
    });
    stubCustomer({
      [`GET /api/cars/${IDS.car}/changes`]: list([
        change({ id: 'ca111111-1111-4111-8111-111111111111', changedOn: '2026-04-02', what: 'Fitted stiffer front anti-roll bar', location: 'front' }),
        change({
          id: 'ca222222-2222-4222-8222-222222222222',
          changedOn: '2026-05-10',
          what: 'Alignment: front camber −2.2°',
          fromVisit: true,
          createdBy: { id: COLLAB_IDS.dusty, displayName: 'Dusty Okonjo' },
        }),
      ]),
    });
    renderApp(PAGE);

    const log = await screen.findByRole('region', { name: 'Change log' });
    const entries = within(await within(log).findByRole('list', { name: 'Change log, newest first' })).getAllByRole('listitem');
    expect(entries).toHaveLength(2);
    expect(entries[0]!.textContent).toContain('Alignment: front camber −2.2°');
    expect(entries[0]!.textContent).toContain('From a shop visit');
    expect(entries[1]!.textContent).toContain('Fitted stiffer front anti-roll bar');
    expect(entries[1]!.textContent).toContain('Front · Maren Holt');
    expect(within(log).queryByRole('form', { name: 'Add to the change log' })).toBeNull();
    expect(within(log).queryAllByRole('button')).toHaveLength(0);
  });

  it('when an event is opened, then a run with hot pressures has them under a toggle, in the staff\'s units, from the runs already loaded', async () => {
    // 35.0, 34.0 and 32.0 psi at 6.894 757 293 168 kPa/psi (NIST SP 811); the right rear not taken.
    const hot = { lf: 241.317, rf: 234.422, lr: 220.632 };
    const fetchMock = stubCustomer({
      'GET /api/auth/session': jsonResponse(200, { user: imperialStaff() }),
      [`GET ${RUNS_URL}`]: list([
        savedRun({ id: IDS.run1, runNumber: 1, rawTimeSec: 45.5, adjustedTimeSec: 45.5, hotPressuresKpa: hot }),
        savedRun({ id: IDS.run2, runNumber: 2, rawTimeSec: 46.1, adjustedTimeSec: 46.1, isBest: false }),
      ]),
    });
    renderApp(PAGE);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Runs and comments' }));
    const runs = await screen.findByRole('list', { name: `Runs at ${EVENT.name}` });
    const [first, second] = within(runs).getAllByRole('listitem').filter((li) => li.parentElement === runs);
    const toggle = within(first!).getByText('Hot pressures', { selector: 'summary' });
    await u.click(toggle);
    const shown = within(within(first!).getByRole('group', { name: 'Hot pressures' }));
    expect(within(shown.getByRole('group', { name: 'Left front' })).getByText('35.0 psi')).toBeTruthy();
    expect(within(shown.getByRole('group', { name: 'Right front' })).getByText('34.0 psi')).toBeTruthy();
    expect(within(shown.getByRole('group', { name: 'Left rear' })).getByText('32.0 psi')).toBeTruthy();
    expect(within(shown.getByRole('group', { name: 'Right rear' })).getByText('—')).toBeTruthy();
    // A run without them has no toggle.
    expect(within(second!).queryByText('Hot pressures')).toBeNull();
    // They came with the event's runs: nothing was asked for each run.
    const urls = fetchMock.mock.calls.map(([input]) => String(input));
    expect(urls.filter((url) => url.startsWith('/api/runs'))).toEqual(urls.filter((url) => url === RUNS_URL));
    expect(urls.filter((url) => url.includes(IDS.run1) || url.includes(IDS.run2))).toEqual([]);
  });
});
