// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { jsonResponse, renderApp, setUpAppTests, stubFetch } from '../../test-utils';
import { list, user } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/events/events'), () => import('@/app/routes/teams/teams')], { clearLocalStorage: true });

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
});
