// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { CSRF_TOKEN, errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { list, user } from '../../fixtures/season';
import { team, TEAM_IDS } from './team-fixtures';

setUpAppTests([() => import('@/app/routes/teams/teams'), () => import('@/app/routes/teams/team')]);

const OTHER_TEAM = { id: '7e222222-2222-4222-8222-222222222222', name: 'Night Sprint Crew', isCaptain: true };

describe('teams page', () => {
  it('when the user belongs to teams, then each is listed with its captain marker and links to its page and its class board', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      'GET /api/teams/mine': list([{ id: TEAM_IDS.team, name: 'Harrow Flats Sprint Club', isCaptain: false }, OTHER_TEAM]),
    });
    renderApp('/teams');

    const teams = await screen.findByRole('list', { name: 'Your teams' });
    const items = within(teams).getAllByRole('listitem');
    expect(items).toHaveLength(2);
    expect(within(items[0]!).queryByText('Captain')).toBeNull();
    expect(within(items[1]!).getByText('Captain')).toBeTruthy();
    expect(within(items[1]!).getByRole('link', { name: /^Night Sprint Crew/ }).getAttribute('href')).toBe(`/teams/${OTHER_TEAM.id}`);
    expect(within(items[1]!).getByRole('link', { name: 'Class board of Night Sprint Crew' }).getAttribute('href')).toBe(
      `/teams/${OTHER_TEAM.id}/board`,
    );
  });

  it('when a name is refused by the server, then its message shows on the name field and no team opens', async () => {
    const message = 'You already captain a team with that name';
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      'GET /api/teams/mine': list([]),
      'POST /api/teams': errorResponse(400, 'validation_failed', 'Check the name.', { name: [message] }),
    });
    const { router } = renderApp('/teams');
    const u = userEvent.setup();

    expect(await screen.findByText(/You are not on a team yet/)).toBeTruthy();
    const name = screen.getByLabelText('Team name');
    await u.type(name, '  Harrow Flats Sprint Club ');
    await u.click(screen.getByRole('button', { name: 'Start a team' }));

    const shown = await screen.findByText(message);
    expect(name.getAttribute('aria-invalid')).toBe('true');
    expect(name.getAttribute('aria-describedby')).toContain(shown.id);
    const [sent] = requestsTo(fetchMock, 'POST /api/teams');
    expect(sent?.body).toEqual({ name: 'Harrow Flats Sprint Club' });
    expect(sent?.headers.get('X-CSRF-Token')).toBe(CSRF_TOKEN);
    expect(router.state.location.pathname).toBe('/teams');
  });

  it('when the name is left empty, then the form says so without asking the server', async () => {
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      'GET /api/teams/mine': list([]),
    });
    renderApp('/teams');
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Start a team' }));
    expect(await screen.findByText('Enter a name')).toBeTruthy();
    expect(requestsTo(fetchMock, 'POST /api/teams')).toHaveLength(0);
  });

  it('when a team is started, then its page opens', async () => {
    const created = { id: TEAM_IDS.team, name: 'Harrow Flats Sprint Club', isCaptain: true };
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      'GET /api/teams/mine': list([]),
      'POST /api/teams': jsonResponse(201, created),
      [`GET /api/teams/${TEAM_IDS.team}`]: jsonResponse(200, { ...team(true), members: [{ id: user().id, displayName: 'Maren Holt', isCaptain: true }], entries: [] }),
      'GET /api/cars': list([]),
      [`GET /api/teams/${TEAM_IDS.team}/factors?season=${new Date().getFullYear()}`]: list([]),
    });
    const { router } = renderApp('/teams');
    const u = userEvent.setup();

    await u.type(await screen.findByLabelText('Team name'), 'Harrow Flats Sprint Club');
    await u.click(screen.getByRole('button', { name: 'Start a team' }));

    await waitFor(() => expect(router.state.location.pathname).toBe(`/teams/${TEAM_IDS.team}`));
    expect(await screen.findByRole('heading', { level: 1, name: 'Harrow Flats Sprint Club' })).toBeTruthy();
  });
});
