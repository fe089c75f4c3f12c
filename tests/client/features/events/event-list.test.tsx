// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { addDays, format } from 'date-fns';
import { describe, expect, it } from 'vitest';
import { jsonResponse, renderApp, setUpAppTests, stubFetch } from '../../test-utils';
import { IMPERIAL_PREFERENCES } from '../../../../shared/calc/units.calc';
import { EVENT, list, user } from '../../fixtures/season';

setUpAppTests(
  [() => import('@/app/routes/events/events'), () => import('@/app/routes/teams/teams'), () => import('@/app/routes/events/event-day-redirect')],
  { clearLocalStorage: true },
);

describe('events list', () => {
  it('when a user sees no events, then it says how events come to be listed and leads to the teams, whose class boards hold the team cars\' results', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: { ...user(), roles: ['team_captain'] } }),
      'GET /api/events': list([]),
      'GET /api/cars': list([]),
      'GET /api/teams/mine': list([]),
    });
    const { router } = renderApp('/events');

    const empty = (await screen.findByText(/^No events yet\./)).parentElement!;
    expect(empty.textContent).toContain('once you or a co-driver enter it, or a car you can read runs at it');
    await userEvent.setup().click(within(empty).getByRole('link', { name: 'Team results are on each class board' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/teams'));
  });

  it.each([
    ['the events list', '/events', null],
    ['Event day with nothing today', '/event-day', 'Latest event'],
    ['Home', '/', 'Latest event'],
  ])('when %s shows an earlier event, then one row names it, says when and where, and opens its event day', async (_where, path, caption) => {
    stubFetch({ 'GET /api/auth/session': jsonResponse(200, { user: user() }), 'GET /api/events': list([EVENT]), 'GET /api/cars': list([]) });
    const { router } = renderApp(path);

    const row = await screen.findByRole('link', { name: new RegExp(EVENT.name) });
    expect(row.textContent).toContain(EVENT.venue!);
    if (caption) expect(row.textContent!.startsWith(caption)).toBe(true);
    await userEvent.setup().click(row);
    await waitFor(() => expect(router.state.location.pathname).toBe(`/events/${EVENT.id}`));
  });

  it.each([
    ['Home', '/'],
    ['Event day with nothing today', '/event-day'],
  ])('when %s has a planned event ahead and one that has been, then it shows the soonest one ahead, captioned "Next event", not "Latest event"', async (_where, path) => {
    const ahead = (days: number) => format(addDays(new Date(), days), 'yyyy-MM-dd');
    const soon = { ...EVENT, id: 'e1e1e1e1-0000-4000-8000-0000000000f1', name: 'Harrow Flats — Round 5', date: ahead(9) };
    const later = { ...EVENT, id: 'e1e1e1e1-0000-4000-8000-0000000000f2', name: 'Harrow Flats — Round 6', date: ahead(40) };
    stubFetch({ 'GET /api/auth/session': jsonResponse(200, { user: user() }), 'GET /api/events': list([later, soon, EVENT]), 'GET /api/cars': list([]) });
    renderApp(path);

    const row = await screen.findByRole('link', { name: /Round 5/ });
    expect(row.textContent!.startsWith('Next event')).toBe(true);
    expect(screen.queryByText('Latest event')).toBeNull();
    expect(screen.queryByRole('link', { name: /Round 6/ })).toBeNull();
  });

  it('when an event has its conditions written down, then its row says them in the user\'s units: surface, air and track', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user(IMPERIAL_PREFERENCES) }),
      'GET /api/events': list([{ ...EVENT, surface: 'old concrete', airTempC: 22, trackTempC: 35 }]),
      'GET /api/cars': list([]),
    });
    renderApp('/events');

    const row = await screen.findByRole('link', { name: new RegExp(EVENT.name) });
    // °F = °C × 9/5 + 32 (common practice): 22 °C = 71.6 °F, shown to the whole degree as 72 °F; 35 °C = 95 °F.
    // (Each dot holds on to the words before it with a no-break space; the text is read here with spaces made plain.)
    expect(within(row).getByText('old concrete · air 72 °F · track 95 °F')).toBeTruthy();
  });
});
