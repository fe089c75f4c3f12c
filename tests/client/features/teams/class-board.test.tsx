// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import { intlFormat, parseISO } from 'date-fns';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { IMPERIAL_PREFERENCES } from '../../../../shared/calc/units.calc';
import { jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { user } from '../../fixtures/season';
import type { BoardCar } from '../../../../shared/collab/team.schema';
import { chartGiven, layOutChart, tickLabels } from '../../chart-layout';
import { formatDay, formatShortDay } from '@/lib/dates';
import { BOARD, INES_BOARD_CAR, MAREN_BOARD_CAR, SILVER_BOARD_CAR, TEAM_IDS } from './team-fixtures';

// A canvas draws nothing in jsdom: stand in for the trend line, keeping what it was given.
vi.mock('react-chartjs-2', async () => (await import('../../chart-layout')).chartStandIn);

const BOARD_API = `/api/teams/${TEAM_IDS.team}/board`;

setUpAppTests([() => import('@/app/routes/teams/class-board')]);

const classSection = (code: string) => screen.getByRole('region', { name: `Class ${code}` });
const rowsOf = (carName: string) => within(screen.getByRole('region', { name: `Results of ${carName}` })).getAllByRole('row').slice(1);
const cells = (row: HTMLElement) => within(row).getAllByRole('cell').map((c) => c.textContent);
const rowHeader = (row: HTMLElement) => within(row).getByRole('rowheader').textContent;
/** A car's events as a phone lists them, one item each: the item's lines in order, joined by " | ". */
const phoneItems = (carName: string) => within(screen.getByRole('list', { name: `Results of ${carName}` })).getAllByRole('listitem');
const phoneLines = (carName: string) => phoneItems(carName).map((item) => [...item.children].map((line) => line.textContent).join(' | '));

describe('class board', () => {
  it('when a season is asked for, then times show to the thousandth, index times use the class factor, and "—" shows where there is none', async () => {
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${BOARD_API}?season=2026`]: jsonResponse(200, BOARD),
    });
    renderApp(`/teams/${TEAM_IDS.team}/board?season=2026`);

    await screen.findByRole('heading', { level: 1, name: 'Class board' });
    // The season in the address is the one asked for (any other address would fail the stub).
    expect(requestsTo(fetchMock, `GET ${BOARD_API}?season=2026`).length).toBeGreaterThan(0);

    // SM has no factor: raw and adjusted times to three decimals, the index time "—".
    expect(within(classSection('SM')).getByText('No factor entered for 2026')).toBeTruthy();
    const [round3, round4] = rowsOf('Grey roadster');
    expect(rowHeader(round3!)).toMatch(/^Harrow Flats — Round 3.+ · Maren Holt$/);
    // Adjusted, off the class's fastest and rank first (what the class is compared on), then raw and index.
    expect(cells(round3!)).toEqual(['47.600', '+1.20 %', '2', '45.600 +1 cone', '—']);
    const r4 = cells(round4!);
    expect([r4[0], r4[3], r4[4]]).toEqual(['44.900', '44.900', '—']);

    // STR has a factor of 0.853: the server's index time is shown; past 60 s times read as minutes.
    expect(within(classSection('STR')).getByText('Factor 0.853')).toBeTruthy();
    const [ines] = rowsOf('White roadster');
    expect(cells(ines!)).toEqual(['1:03.250', '0.00 %', '1', '1:01.250 +1 cone', '53.952']);
  });

  it('when the board is read on a phone, then each event is one list item: its link, date and driver, then the adjusted time, how far off the class’s fastest, rank, raw and index, in seconds', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${BOARD_API}?season=2026`]: jsonResponse(200, BOARD),
    });
    renderApp(`/teams/${TEAM_IDS.team}/board?season=2026`);

    await screen.findByRole('region', { name: 'Class SM' });
    // Below the sm width these lists are displayed instead of the tables (tests/e2e/collaboration.spec.ts checks that
    // a phone shows only the list, and a wide screen only the table): nothing is left a swipe away.
    expect(phoneLines('Grey roadster')).toEqual([
      `Harrow Flats — Round 3 | ${formatDay('2026-05-17')} · Maren Holt | Adjusted 47.600 s, +1.20 % off fastest | Rank 2, Best raw 45.600 s (that run +1 cone)`,
      `Harrow Flats — Round 4 | ${formatDay('2026-06-07')} · Maren Holt | Adjusted 44.900 s, +0.80 % off fastest | Rank 2, Best raw 44.900 s`,
    ]);
    // The gap is in the same item as the event it belongs to, and the event's name alone names its link.
    const [round3] = phoneItems('Grey roadster');
    expect(within(round3!).getByRole('link', { name: 'Harrow Flats — Round 3' }).getAttribute('href')).toBe(
      `/teams/${TEAM_IDS.team}/board?season=2026&event=${MAREN_BOARD_CAR.results[0]!.eventId}`,
    );
    expect(phoneLines('Silver roadster')[0]).toBe(
      `Harrow Flats — Round 3 | ${formatDay('2026-05-17')} · Ines Okafor | Adjusted 47.036 s, Fastest in class | Rank 1, Best raw 47.036 s`,
    );
    // STR has a factor: the index time joins the line; past 60 s times read as minutes.
    expect(phoneLines('White roadster')).toEqual([
      `Harrow Flats — Round 4 | ${formatDay('2026-06-07')} · Ines Okafor | Adjusted 1:03.250 s, Fastest in class | Rank 1, Best raw 1:01.250 s (that run +1 cone), Index 53.952 s`,
    ]);
    expect(screen.queryByText(/Swipe the table sideways/)).toBeNull();
  });

  it('when a day’s runs were all DNF or off course, then the line says so with the number of runs, not only dashes', async () => {
    const noTime = { bestRawSec: null, bestRawCones: null, bestAdjustedSec: null, indexSec: null, pctOffClassFastest: null, rankInClass: null };
    const [round3, round4] = MAREN_BOARD_CAR.results;
    const wet = { ...round4!, eventId: 'e5555555-5555-4555-8555-555555555555', eventName: 'Harrow Flats — Round 5', date: '2026-06-21' };
    const car: BoardCar = {
      ...MAREN_BOARD_CAR,
      results: [
        { ...round3!, ...noTime, runs: { finished: 0, dnf: 2, offCourse: 0 } },
        { ...round4!, ...noTime, runs: { finished: 0, dnf: 1, offCourse: 2 } },
        { ...wet, ...noTime, runs: { finished: 0, dnf: 0, offCourse: 1 } },
      ],
      trendPctPerEvent: null,
    };
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${BOARD_API}?season=2026`]: jsonResponse(200, { ...BOARD, classes: [{ classCode: 'SM', factor: null, cars: [car] }] }),
    });
    renderApp(`/teams/${TEAM_IDS.team}/board?season=2026`);

    await screen.findByRole('region', { name: 'Class SM' });
    expect(rowsOf('Grey roadster').map(cells)).toEqual([
      ['DNF (2 runs)', '—', '—', '—', '—'],
      ['No time: 1 DNF, 2 off course', '—', '—', '—', '—'],
      ['Off course (1 run)', '—', '—', '—', '—'],
    ]);
    // On a phone the same words, and no line of dashes under them.
    expect(phoneLines('Grey roadster')).toEqual([
      `Harrow Flats — Round 3 | ${formatDay('2026-05-17')} · Maren Holt | DNF (2 runs)`,
      `Harrow Flats — Round 4 | ${formatDay('2026-06-07')} · Maren Holt | No time: 1 DNF, 2 off course`,
      `Harrow Flats — Round 5 | ${formatDay('2026-06-21')} · Maren Holt | Off course (1 run)`,
    ]);
  });

  it('when a best raw time came from a run with cones, then the cones show beside it; a clean one shows none', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${BOARD_API}?season=2026`]: jsonResponse(200, BOARD),
    });
    renderApp(`/teams/${TEAM_IDS.team}/board?season=2026`);

    await screen.findByRole('region', { name: 'Class SM' });
    // Round 3: the best raw 45.600 had a cone; Round 4's best raw 44.900 was clean.
    expect(rowsOf('Grey roadster').map((row) => cells(row)[3])).toEqual(['45.600 +1 cone', '44.900']);
    expect(screen.getAllByText('cones not added').length).toBeGreaterThan(0);
  });

  it('when a class factor has four decimals, then the board shows all four', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${BOARD_API}?season=2026`]: jsonResponse(200, { ...BOARD, classes: [{ classCode: 'STR', factor: 0.8535, cars: [INES_BOARD_CAR] }] }),
    });
    renderApp(`/teams/${TEAM_IDS.team}/board?season=2026`);

    expect(await within(await screen.findByRole('region', { name: 'Class STR' })).findByText('Factor 0.8535')).toBeTruthy();
  });

  it('when a car shares results only, then its setup is hidden; when it shares its setup, then the values show in the user’s units', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user(IMPERIAL_PREFERENCES) }),
      [`GET ${BOARD_API}?season=2026`]: jsonResponse(200, BOARD),
    });
    renderApp(`/teams/${TEAM_IDS.team}/board?season=2026`);

    const sm = await screen.findByRole('region', { name: 'Class SM' });
    expect(within(sm).getByText('Results only — setup and tread not shared.')).toBeTruthy();
    expect(within(sm).queryByRole('table', { name: /^Setup of/ })).toBeNull();

    const setup = within(classSection('STR')).getByRole('table', { name: 'Setup of White roadster' });
    const row = (label: string) => within(setup).getByRole('rowheader', { name: label }).parentElement!;
    expect(cells(row('Camber'))).toEqual(['\u22122.10°', '\u22121.50°']);
    // 200 kPa = 29.0 psi and 190 kPa = 27.6 psi (1 psi = 6.894757 kPa, NIST SP 811 appendix B, from memory).
    expect(cells(row('Cold pressure'))).toEqual(['29.0 psi', '27.6 psi']);
    // 70 N/mm = 400 lb/in (1 lbf/in = 0.1751268 N/mm, from 1 lbf = 4.448222 N and 1 in = 25.4 mm, NIST SP 811 appendix B, from memory).
    expect(cells(row('Springs'))).toEqual(['400 lb/in', '300 lb/in']);
    expect(cells(row('Clicks'))).toEqual(['8 clicks', '6 clicks']);
    expect(screen.getByRole('complementary', { name: 'Setups are starting points' })).toBeTruthy();
  });

  it('when a car shares its setup, then each axle\'s latest tread shows in mm with its date and which edge is lower; a car sharing results only shows none', async () => {
    // Even were tread sent for a car that shares results only, its card would not show it.
    const leaked = {
      ...BOARD,
      classes: BOARD.classes.map((c) => ({
        ...c,
        cars: c.cars.map((car) => (car.car.id === MAREN_BOARD_CAR.car.id ? { ...car, wear: INES_BOARD_CAR.wear } : car)),
      })),
    };
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${BOARD_API}?season=2026`]: jsonResponse(200, leaked),
    });
    renderApp(`/teams/${TEAM_IDS.team}/board?season=2026`);

    const tread = await within(await screen.findByRole('region', { name: 'Class STR' })).findByRole('list', { name: 'Tread of White roadster' });
    // 5.08 mm to one decimal is 5.1 mm; inner − outer = −0.4 mm, so the inner edge is the lower one. The rear's +0.2 mm puts the outer lower.
    expect(within(tread).getAllByRole('listitem').map((li) => li.textContent)).toEqual([
      `Front tread 5.1 mm, inner 0.4 mm lower than outer · ${formatShortDay('2026-06-07T16:00:00.000Z')}`,
      `Rear tread 6.3 mm, outer 0.2 mm lower than inner · ${formatShortDay('2026-05-31T16:00:00.000Z')}`,
    ]);

    // Maren shares results only: no tread at all on her card. Silver shares its setup but has no readings.
    const sm = classSection('SM');
    const maren = within(sm).getByRole('article', { name: /^Grey roadster/ });
    expect(within(maren).queryByRole('list', { name: /^Tread of/ })).toBeNull();
    expect(maren.textContent).not.toMatch(/tread \d|tread readings/i);
    expect(within(within(sm).getByRole('article', { name: /^Silver roadster/ })).getByText('No tread readings this season yet.')).toBeTruthy();
  });

  it('when the user reads tread in 1/32 in, then the board\'s tread shows in 1/32 in', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user(IMPERIAL_PREFERENCES) }),
      [`GET ${BOARD_API}?season=2026`]: jsonResponse(200, BOARD),
    });
    renderApp(`/teams/${TEAM_IDS.team}/board?season=2026`);

    const tread = await screen.findByRole('list', { name: 'Tread of White roadster' });
    // 1/32 in = 0.79375 mm (1 in = 25.4 mm exactly, NIST Handbook 44 appendix C): 5.08 mm = 6.4/32 in, 0.4 mm = 0.504 → 0.5/32 in;
    // 6.33 mm = 7.975 → 8.0/32 in, 0.2 mm = 0.252 → 0.3/32 in.
    expect(within(tread).getAllByRole('listitem').map((li) => li.textContent)).toEqual([
      `Front tread 6.4/32 in, inner 0.5/32 in lower than outer · ${formatShortDay('2026-06-07T16:00:00.000Z')}`,
      `Rear tread 8.0/32 in, outer 0.3/32 in lower than inner · ${formatShortDay('2026-05-31T16:00:00.000Z')}`,
    ]);
  });

  it('when a car has a trend, then it is drawn from the % off the class’s fastest over the events’ dates and said to the board’s two decimals', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${BOARD_API}?season=2026`]: jsonResponse(200, BOARD),
    });
    renderApp(`/teams/${TEAM_IDS.team}/board?season=2026`);

    const sm = await screen.findByRole('region', { name: 'Class SM' });
    // −0.4 % per event reads as the table's "+1.20 %" and "+0.80 %" do: to the hundredth.
    expect(within(sm).getByText('Closing in by 0.40 % per event over 2 events.')).toBeTruthy();
    await within(sm).findByRole('img', { name: /^Grey roadster: percent off the class’s fastest over 2 events/ });
    const given = chartGiven('Grey roadster');
    expect(given.data.datasets[0]!.data).toEqual([{ x: 1, y: 1.2 }, { x: 2, y: 0.8 }]);
    // The axis names each event by its day (date-fns, an independent library, is the reference), not "1" and "2".
    const chart = layOutChart(given, { width: 384, height: 128 });
    expect(tickLabels(chart, 'x')).toEqual([intlFormat(parseISO('2026-05-17'), { day: 'numeric', month: 'short' }), intlFormat(parseISO('2026-06-07'), { day: 'numeric', month: 'short' })]);
    chart.destroy();
  });

  it('when a line was the only time in its class at an event, then its % off and rank are dashes, and it says why', async () => {
    const alone: BoardCar = {
      ...INES_BOARD_CAR,
      results: [{ ...INES_BOARD_CAR.results[0]!, pctOffClassFastest: null, rankInClass: null, aloneInClass: true }],
    };
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${BOARD_API}?season=2026`]: jsonResponse(200, { ...BOARD, classes: [{ classCode: 'STR', factor: 0.853, cars: [alone] }] }),
    });
    renderApp(`/teams/${TEAM_IDS.team}/board?season=2026`);
    await screen.findByRole('region', { name: 'Class STR' });
    const [line] = rowsOf('White roadster');
    expect(cells(line!).slice(0, 3)).toEqual(['1:03.250', '—no other time', '—']);
    expect(phoneLines('White roadster')).toEqual([
      `Harrow Flats — Round 4 | ${formatDay('2026-06-07')} · Ines Okafor | Adjusted 1:03.250 s, No other time in class | Best raw 1:01.250 s (that run +1 cone), Index 53.952 s`,
    ]);
  });

  it('when a car is the only one in its class with times, then it says so instead of a trend against itself, and no line is drawn', async () => {
    const ALONE_EVENTS = ['2026-04-12', '2026-05-17', '2026-06-07'];
    const alone: BoardCar = {
      ...INES_BOARD_CAR,
      results: ALONE_EVENTS.map((date, i) => ({
        ...INES_BOARD_CAR.results[0]!, eventId: `e${i}${i}${i}${i}${i}${i}${i}${i}-5555-4555-8555-555555555555`, eventName: `Round ${i + 1}`, date,
      })),
      // Alone, the car is its own class's fastest every time: 0 % off, a flat line of no meaning.
      trendPctPerEvent: 0,
    };
    // A classmate entered but without a time this season leaves it just as alone.
    const idle: BoardCar = { ...SILVER_BOARD_CAR, results: [], trendPctPerEvent: null };
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${BOARD_API}?season=2026`]: jsonResponse(200, { ...BOARD, classes: [{ classCode: 'STR', factor: 0.853, cars: [alone, idle] }] }),
    });
    renderApp(`/teams/${TEAM_IDS.team}/board?season=2026`);

    const str = await screen.findByRole('region', { name: 'Class STR' });
    expect(within(str).getByText('The only car in class STR with times this season: there is no one in the class to compare it with yet.')).toBeTruthy();
    expect(within(str).queryByText(/Holding steady/)).toBeNull();
    expect(within(str).queryByRole('img')).toBeNull();
  });

  it('when the next season is picked, then the board for that season is asked for and the address keeps it', async () => {
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${BOARD_API}?season=2026`]: jsonResponse(200, BOARD),
      [`GET ${BOARD_API}?season=2027`]: jsonResponse(200, { ...BOARD, season: 2027, classes: [] }),
    });
    const { router } = renderApp(`/teams/${TEAM_IDS.team}/board?season=2026`);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Season 2027' }));

    expect(await screen.findByText(/No cars are entered in Harrow Flats Sprint Club yet/)).toBeTruthy();
    expect(requestsTo(fetchMock, `GET ${BOARD_API}?season=2027`)).toHaveLength(1);
    await waitFor(() => expect(router.state.location.search).toBe('?season=2027'));
  });
});

describe('a class board that does not come', () => {
  it('when it fails to load, then "Try again" asks for it again and the board shows once it comes; a factor missing says what to do in words', async () => {
    let down = true;
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${BOARD_API}?season=2026`]: () =>
        down ? jsonResponse(503, { error: { code: 'unavailable', message: 'Scrubline cannot reach its database just now.' } }) : jsonResponse(200, BOARD),
    });
    renderApp(`/teams/${TEAM_IDS.team}/board?season=2026`);
    const u = userEvent.setup();

    expect(await screen.findByRole('heading', { name: 'The class board did not load' })).toBeTruthy();
    const before = requestsTo(fetchMock, `GET ${BOARD_API}?season=2026`).length;
    down = false;
    await u.click(screen.getByRole('button', { name: 'Try again' }));
    await screen.findByRole('heading', { level: 1, name: 'Class board' });
    expect(requestsTo(fetchMock, `GET ${BOARD_API}?season=2026`).length).toBeGreaterThan(before);
    const noFactor = within(classSection('SM')).getByText(/^No index times for this class yet/);
    expect(noFactor.textContent).toBe('No index times for this class yet: a captain enters its 2026 factor on the team page.');
    expect(within(noFactor).getByRole('link', { name: 'the team page' }).getAttribute('href')).toBe(`/teams/${TEAM_IDS.team}`);
  });

  it('when the team is not one of the user\'s, then no "Try again" is offered, only the way back', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET ${BOARD_API}?season=2026`]: jsonResponse(404, { error: { code: 'not_found', message: 'That team was not found.' } }),
    });
    renderApp(`/teams/${TEAM_IDS.team}/board?season=2026`);

    expect(await screen.findByRole('heading', { name: 'Team not found' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Try again' })).toBeNull();
    expect(screen.getByRole('link', { name: 'Your teams' })).toBeTruthy();
  });
});
