// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderApp, setUpAppTests, stubFetch } from '../../test-utils';
import { user } from '../../fixtures/season';
import type { BoardCar, ClassBoard } from '../../../../shared/collab/team.schema';
import { BOARD, INES_BOARD_CAR, MAREN_BOARD_CAR, SILVER_BOARD_CAR, TEAM_IDS } from './team-fixtures';

// A canvas draws nothing in jsdom: stand in for the board's trend lines.
vi.mock('react-chartjs-2', async () => (await import('../../chart-layout')).chartStandIn);

const BOARD_API = `/api/teams/${TEAM_IDS.team}/board`;
const BOARD_PAGE = `/teams/${TEAM_IDS.team}/board`;
const ROUND_3 = MAREN_BOARD_CAR.results[0]!;
const ROUND_4 = MAREN_BOARD_CAR.results[1]!;

setUpAppTests([() => import('@/app/routes/teams/class-board'), () => import('@/features/teams/components/class-board-event')]);

/*
 * Round 3 in class SM, as the server scored it (board.service.ts ranks once: 1 + the lines strictly faster, so
 * equal adjusted times share a rank and the next rank is skipped; a day without a time has none):
 *   Ines, Silver roadster   47.036  rank 1
 *   Maren, Grey roadster    47.600  rank 2 (+1.20 %: 47.036 × 1.012 = 47.600, to the thousandth)
 *   Wren, Silver roadster   47.600  rank 2, the same time
 *   Dara, Grey roadster     2 runs, both DNF: no rank
 */
const DARA = { id: 'a7777777-7777-4777-8777-777777777777', displayName: 'Dara Quinn' };
const WREN = { id: 'a8888888-8888-4888-8888-888888888888', displayName: 'Wren Alder' };
const noTime = { bestRawSec: null, bestRawCones: null, bestAdjustedSec: null, indexSec: null, pctOffClassFastest: null, rankInClass: null };

const GREY: BoardCar = {
  ...MAREN_BOARD_CAR,
  results: [...MAREN_BOARD_CAR.results, { ...ROUND_3, ...noTime, driver: DARA, runs: { finished: 0, dnf: 2, offCourse: 0 } }],
};
const SILVER: BoardCar = {
  ...SILVER_BOARD_CAR,
  results: [
    ...SILVER_BOARD_CAR.results,
    { ...ROUND_3, driver: WREN, runs: { finished: 2, dnf: 0, offCourse: 1 }, bestRawSec: 47.6, bestRawCones: 0, bestAdjustedSec: 47.6, pctOffClassFastest: 1.2, rankInClass: 2 },
  ],
};
const MEET: ClassBoard = {
  ...BOARD,
  classes: [
    { classCode: 'SM', factor: null, cars: [GREY, SILVER] },
    { classCode: 'STR', factor: 0.853, cars: [INES_BOARD_CAR] },
  ],
};

function stubBoard(board: ClassBoard = MEET) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user() }),
    [`GET ${BOARD_API}?season=2026`]: jsonResponse(200, board),
  });
}

/** Each line of a class's ranking as read aloud: its pieces in order, what is hidden from screen readers left out. */
const lines = (classCode: string) =>
  within(screen.getByRole('list', { name: `Class ${classCode} ranking` }))
    .getAllByRole('listitem')
    .map((item) => {
      const read = item.cloneNode(true) as HTMLElement;
      for (const hidden of read.querySelectorAll('[aria-hidden="true"]')) hidden.remove();
      return [...read.querySelectorAll('p')].map((p) => p.textContent?.replace(/\s+/g, ' ').trim()).join(' | ');
    });

describe('class board: one event', () => {
  it('when the captain taps an event on the board, then every team driver in its class there is in one list, fastest first, equal times sharing a rank and a day without a time last', async () => {
    // Only the board is stubbed: the event is read from its answer, not asked of the server on its own.
    stubBoard();
    const { router } = renderApp(`${BOARD_PAGE}?season=2026`);
    const u = userEvent.setup();

    const grey = await screen.findByRole('region', { name: 'Results of Grey roadster' });
    await u.click(within(grey).getAllByRole('link', { name: 'Harrow Flats — Round 3' })[0]!);

    expect(await screen.findByRole('heading', { level: 1, name: 'Harrow Flats — Round 3' })).toBeTruthy();
    expect(router.state.location.search).toBe(`?season=2026&event=${ROUND_3.eventId}`);
    expect(lines('SM')).toEqual([
      'Rank 1 | Ines Okafor | Silver roadster #8 | 3 runs | Adjusted 47.036 s | Fastest in class | Best raw 47.036 s',
      'Rank 2 tie | Maren Holt | Grey roadster #47 | 3 runs | Adjusted 47.600 s | +1.20 % off fastest | Best raw 45.600 s (that run +1 cone)',
      'Rank 2 tie | Wren Alder | Silver roadster #8 | 3 runs, 1 off course | Adjusted 47.600 s | +1.20 % off fastest | Best raw 47.600 s',
      'No rank | Dara Quinn | Grey roadster #47 | DNF (2 runs)',
    ]);
    // STR had no car at Round 3; and nothing needs a sideways swipe: no table, one list item per driver.
    expect(screen.queryByRole('list', { name: 'Class STR ranking' })).toBeNull();
    expect(screen.queryByRole('table')).toBeNull();
  });

  it('when a class has a factor, then its index time is stacked under the adjusted time; a class without one shows none', async () => {
    stubBoard();
    renderApp(`${BOARD_PAGE}?season=2026&event=${ROUND_4.eventId}`);

    await screen.findByRole('heading', { level: 1, name: 'Harrow Flats — Round 4' });
    // STR, factor 0.853: the server's index time 53.952 (63.250 × 0.853 = 53.952, to the thousandth); the best raw's cone in words.
    expect(lines('STR')).toEqual([
      'Rank 1 | Ines Okafor | White roadster #3 | 2 runs | Adjusted 1:03.250 s | Fastest in class | Index 53.952 s | Best raw 1:01.250 s (that run +1 cone)',
    ]);
    expect(within(screen.getByRole('region', { name: 'Class STR' })).getByText('Factor 0.853')).toBeTruthy();
    expect(lines('SM').join(' ')).not.toMatch(/Index/);
    expect(within(screen.getByRole('region', { name: 'Class SM' })).getByText('No factor entered for 2026')).toBeTruthy();
  });

  it('when a line was the only time in its class at the event, then it has no rank and says there was no other time, not "Fastest in class"', async () => {
    const alone: BoardCar = { ...INES_BOARD_CAR, results: [{ ...INES_BOARD_CAR.results[0]!, pctOffClassFastest: null, rankInClass: null, aloneInClass: true }] };
    stubBoard({ ...MEET, classes: [MEET.classes[0]!, { classCode: 'STR', factor: 0.853, cars: [alone] }] });
    renderApp(`${BOARD_PAGE}?season=2026&event=${ROUND_4.eventId}`);

    await screen.findByRole('heading', { level: 1, name: 'Harrow Flats — Round 4' });
    expect(lines('STR')).toEqual([
      'No rank | Ines Okafor | White roadster #3 | 2 runs | Adjusted 1:03.250 s | No other time in class | Index 53.952 s | Best raw 1:01.250 s (that run +1 cone)',
    ]);
  });

  it('when stepping through the season, then Previous and Next follow the events’ dates and the whole board comes back at the same season', async () => {
    stubBoard();
    const { router } = renderApp(`${BOARD_PAGE}?season=2026&event=${ROUND_3.eventId}`);
    const u = userEvent.setup();

    await screen.findByRole('heading', { level: 1, name: 'Harrow Flats — Round 3' });
    const steps = screen.getByRole('navigation', { name: 'Other events this season' });
    expect(within(steps).queryByRole('link', { name: /^Previous event/ })).toBeNull();
    await u.click(within(steps).getByRole('link', { name: 'Next event : Harrow Flats — Round 4' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Harrow Flats — Round 4' })).toBeTruthy();
    const back = screen.getByRole('navigation', { name: 'Other events this season' });
    expect(within(back).queryByRole('link', { name: /^Next event/ })).toBeNull();
    expect(within(back).getByRole('link', { name: 'Previous event : Harrow Flats — Round 3' })).toBeTruthy();

    await u.click(screen.getByRole('link', { name: 'Whole class board' }));
    expect(await screen.findByRole('heading', { level: 1, name: 'Class board' })).toBeTruthy();
    await waitFor(() => expect(router.state.location.search).toBe('?season=2026'));
  });

  it('when an event is opened from far down the board, then it starts at its top, as a new page would', async () => {
    stubBoard();
    renderApp(`${BOARD_PAGE}?season=2026`);
    const u = userEvent.setup();
    const grey = await screen.findByRole('region', { name: 'Results of Grey roadster' });
    const scrollTo = vi.fn();
    vi.stubGlobal('scrollTo', scrollTo);

    await u.click(within(grey).getAllByRole('link', { name: 'Harrow Flats — Round 4' })[0]!);

    await screen.findByRole('heading', { level: 1, name: 'Harrow Flats — Round 4' });
    expect(scrollTo).toHaveBeenCalledWith(0, 0);
  });

  it('when the event has no team result that season, then the page says so and leads back to the board', async () => {
    stubBoard();
    renderApp(`${BOARD_PAGE}?season=2026&event=e9999999-9999-4999-8999-999999999999`);

    expect(await screen.findByRole('heading', { level: 1, name: 'Event not on the board' })).toBeTruthy();
    expect(screen.getByText('No team car has a result at this event in 2026. Pick an event on the class board.')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Whole class board' }).getAttribute('href')).toBe(`${BOARD_PAGE}?season=2026`);
  });
});
