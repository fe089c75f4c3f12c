// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { jsonResponse, renderApp, setUpAppTests, stubFetch } from '../../test-utils';
import { EVENT, list, user } from '../../fixtures/season';

setUpAppTests(
  [() => import('@/app/routes/events/events'), () => import('@/app/routes/teams/teams'), () => import('@/app/routes/events/event-day-redirect')],
  { clearLocalStorage: true },
);

describe('events list', () => {
  it('when a user sees no events, then it says how events come to be listed and leads to the teams, whose class boards hold the team cars\' results', async () => {
    stubFetch({
      'GET /api/auth/me': jsonResponse(200, { user: { ...user(), roles: ['team_captain'] } }),
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
    stubFetch({ 'GET /api/auth/me': jsonResponse(200, { user: user() }), 'GET /api/events': list([EVENT]), 'GET /api/cars': list([]) });
    const { router } = renderApp(path);

    const row = await screen.findByRole('link', { name: new RegExp(EVENT.name) });
    expect(row.textContent).toContain(EVENT.venue!);
    if (caption) expect(row.textContent!.startsWith(caption)).toBe(true);
    await userEvent.setup().click(row);
    await waitFor(() => expect(router.state.location.pathname).toBe(`/events/${EVENT.id}`));
  });
});
