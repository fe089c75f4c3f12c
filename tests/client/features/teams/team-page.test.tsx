// @vitest-environment jsdom
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { CAR, IDS, list, user } from '../../fixtures/season';
import { CO_DRIVEN, MAREN_HATCH, team, TEAM_IDS } from './team-fixtures';

const TEAM_PAGE = `/teams/${TEAM_IDS.team}`;
const TEAM_API = `/api/teams/${TEAM_IDS.team}`;
const SEASON = new Date().getFullYear();
const FACTORS_API = `${TEAM_API}/factors?season=${SEASON}`;

setUpAppTests([() => import('@/app/routes/teams/team')]);

function stubTeamPage(isCaptain: boolean, extra: Parameters<typeof stubFetch>[0] = {}) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user() }),
    [`GET ${TEAM_API}`]: jsonResponse(200, team(isCaptain)),
    // Maren's roadster (already entered), her hatch, and a coupe she only co-drives.
    'GET /api/cars': list([CAR, MAREN_HATCH, CO_DRIVEN]),
    [`GET ${FACTORS_API}`]: list([{ season: SEASON, classCode: 'STR', factor: 0.853 }]),
    ...extra,
  });
}

describe('team page: entering a car', () => {
  it('when a member enters a car, then only their own cars not yet entered are offered, the class starts as the car’s, and the sharing choice is sent', async () => {
    const fetchMock = stubTeamPage(false, { [`POST ${TEAM_API}/entries`]: jsonResponse(201, {}) });
    renderApp(TEAM_PAGE);
    const u = userEvent.setup();

    const form = await screen.findByRole('form', { name: 'Enter a car' });
    const carSelect = within(form).getByLabelText('Your car') as HTMLSelectElement;
    const offered = within(carSelect).getAllByRole('option').map((o) => o.textContent);
    expect(offered).toEqual(['Blue hatch #12 · class HS']);
    expect((within(form).getByLabelText('Class') as HTMLInputElement).value).toBe('HS');
    expect(within(form).getByText(/shows the team this car’s camber, springs, clicks and pressures/)).toBeTruthy();

    await u.click(within(form).getByRole('radio', { name: /Results and setup/ }));
    await u.click(within(form).getByRole('button', { name: 'Enter the car' }));

    await waitFor(() => expect(requestsTo(fetchMock, `POST ${TEAM_API}/entries`)).toHaveLength(1));
    expect(requestsTo(fetchMock, `POST ${TEAM_API}/entries`)[0]?.body).toEqual({
      carId: TEAM_IDS.marenHatch,
      classCode: 'HS',
      sharing: 'results_and_setup',
    });
  });

  it('when the user owns no car left to enter, then the form is replaced by a way to add one', async () => {
    stubTeamPage(false, { 'GET /api/cars': list([CAR, CO_DRIVEN]) });
    renderApp(TEAM_PAGE);

    expect(await screen.findByText(/No car of yours is left to enter/)).toBeTruthy();
    expect(screen.queryByRole('form', { name: 'Enter a car' })).toBeNull();
  });
});

describe('team page: who sees what', () => {
  it('when the user is a member, not a captain, then captain-only controls are hidden and Leave team is there', async () => {
    const fetchMock = stubTeamPage(false);
    renderApp(TEAM_PAGE);

    const members = await screen.findByRole('list', { name: 'Members' });
    expect(within(members).getAllByText('Captain')).toHaveLength(1);
    expect(screen.queryByRole('form', { name: 'Invite someone' })).toBeNull();
    expect(screen.queryByRole('button', { name: /^Make (captain|member)/ })).toBeNull();
    expect(screen.queryByRole('button', { name: /^Remove/ })).toBeNull();
    expect(screen.queryByRole('heading', { name: 'Class factors' })).toBeNull();
    expect(screen.getByRole('button', { name: 'Leave team' })).toBeTruthy();
    // Only the member's own entry can be changed.
    const entries = screen.getByRole('list', { name: 'Entered cars' });
    expect(within(entries).getAllByRole('button', { name: /^Change/ })).toHaveLength(1);
    expect(within(entries).getByRole('button', { name: 'Change Grey roadster #47' })).toBeTruthy();
    expect(requestsTo(fetchMock, `GET ${FACTORS_API}`)).toHaveLength(0);
  });

  it('when the user is a captain, then they can invite, change captains, remove others and see pending invitations', async () => {
    stubTeamPage(true);
    renderApp(TEAM_PAGE);

    expect(await screen.findByRole('form', { name: 'Invite someone' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Make member Ines Okafor' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Remove Ines Okafor' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Remove Maren Holt' })).toBeNull();
    expect(within(screen.getByRole('list', { name: 'Invitations waiting' })).getByText('dara@example.test')).toBeTruthy();
  });

  it('when the user is the team’s only captain, then their Make member is disabled with the reason beside it; with two captains it is not', async () => {
    const alone = team(true);
    alone.members = alone.members.map((m) => ({ ...m, isCaptain: m.id === IDS.maren }));
    const fetchMock = stubTeamPage(true, { [`GET ${TEAM_API}`]: jsonResponse(200, alone) });
    renderApp(TEAM_PAGE);

    const members = await screen.findByRole('list', { name: 'Members' });
    const makeMember = within(members).getByRole('button', { name: 'Make member Maren Holt' }) as HTMLButtonElement;
    expect(makeMember.disabled).toBe(true);
    const why = document.getElementById(makeMember.getAttribute('aria-describedby') ?? '');
    expect(why?.textContent).toBe('A team needs at least one captain: make another member captain first.');
    expect((within(members).getByRole('button', { name: 'Make captain Ines Okafor' }) as HTMLButtonElement).disabled).toBe(false);
    expect(requestsTo(fetchMock, `PATCH ${TEAM_API}/members/${IDS.maren}`)).toHaveLength(0);
    cleanup();

    stubTeamPage(true);
    renderApp(TEAM_PAGE);
    const both = await screen.findByRole('list', { name: 'Members' });
    expect((within(both).getByRole('button', { name: 'Make member Maren Holt' }) as HTMLButtonElement).disabled).toBe(false);
    expect(within(both).queryByText(/at least one captain/)).toBeNull();
  });

  it('when a captain invites someone as captain, then the e-mail and the role are sent', async () => {
    const fetchMock = stubTeamPage(true, {
      [`POST ${TEAM_API}/invitations`]: jsonResponse(201, { email: 'jo@example.test', asAdmin: true, expiresAt: '2026-06-20T10:00:00.000Z' }),
    });
    renderApp(TEAM_PAGE);
    const u = userEvent.setup();

    const form = await screen.findByRole('form', { name: 'Invite someone' });
    await u.type(within(form).getByLabelText('Their e-mail'), 'Jo@Example.test');
    await u.click(within(form).getByRole('radio', { name: /Captain/ }));
    await u.click(within(form).getByRole('button', { name: 'Send invitation' }));

    expect(await within(form).findByText(/Invitation sent to jo@example.test/)).toBeTruthy();
    expect(requestsTo(fetchMock, `POST ${TEAM_API}/invitations`)[0]?.body).toEqual({ email: 'jo@example.test', asAdmin: true });
  });

  it('when a captain confirms removing a member, then the server is asked to remove exactly that member', async () => {
    const fetchMock = stubTeamPage(true, { [`DELETE ${TEAM_API}/members/${TEAM_IDS.ines}`]: jsonResponse(204) });
    renderApp(TEAM_PAGE);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Remove Ines Okafor' }));
    const dialog = await screen.findByRole('dialog', { name: 'Remove Ines Okafor?' });
    expect(requestsTo(fetchMock, `DELETE ${TEAM_API}/members/${TEAM_IDS.ines}`)).toHaveLength(0);
    // The way out reads as it does when removing a co-driver or a member of the shop's staff.
    expect(within(dialog).getByRole('button', { name: 'Keep' })).toBeTruthy();
    await u.click(within(dialog).getByRole('button', { name: 'Remove from team' }));

    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(requestsTo(fetchMock, `DELETE ${TEAM_API}/members/${TEAM_IDS.ines}`)).toHaveLength(1);
  });

  it('when a member leaves, then their own membership is removed and the list of teams opens', async () => {
    const fetchMock = stubTeamPage(false, {
      [`DELETE ${TEAM_API}/members/${IDS.maren}`]: jsonResponse(204),
      'GET /api/teams/mine': list([]),
    });
    const { router } = renderApp(TEAM_PAGE);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Leave team' }));
    const dialog = await screen.findByRole('dialog', { name: 'Leave Harrow Flats Sprint Club?' });
    await u.click(within(dialog).getByRole('button', { name: 'Leave team' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/teams'));
    expect(requestsTo(fetchMock, `DELETE ${TEAM_API}/members/${IDS.maren}`)).toHaveLength(1);
  });

  it('when the user is the team’s only captain, then Leave team is disabled with the reason beside it and nothing is sent; with two captains it opens the question', async () => {
    const alone = team(true);
    alone.members = alone.members.map((m) => ({ ...m, isCaptain: m.id === IDS.maren }));
    const fetchMock = stubTeamPage(true, { [`GET ${TEAM_API}`]: jsonResponse(200, alone) });
    renderApp(TEAM_PAGE);
    const u = userEvent.setup();

    const leave = (await screen.findByRole('button', { name: 'Leave team' })) as HTMLButtonElement;
    expect(leave.disabled).toBe(true);
    const why = document.getElementById(leave.getAttribute('aria-describedby') ?? '');
    expect(why?.textContent).toBe('A team needs at least one captain: make another member captain first, then you can leave.');
    await u.click(leave);
    expect(screen.queryByRole('dialog')).toBeNull();
    expect(requestsTo(fetchMock, `DELETE ${TEAM_API}/members/${IDS.maren}`)).toHaveLength(0);
    cleanup();

    // Alone on the team, there is no one to make captain yet: the reason says to invite someone.
    const solo = team(true);
    solo.members = solo.members.filter((m) => m.id === IDS.maren);
    stubTeamPage(true, { [`GET ${TEAM_API}`]: jsonResponse(200, solo) });
    renderApp(TEAM_PAGE);
    const soloLeave = (await screen.findByRole('button', { name: 'Leave team' })) as HTMLButtonElement;
    expect(soloLeave.disabled).toBe(true);
    expect(document.getElementById(soloLeave.getAttribute('aria-describedby') ?? '')?.textContent).toBe(
      'A team needs at least one captain: invite someone, make them captain, then you can leave.',
    );
    cleanup();

    stubTeamPage(true);
    renderApp(TEAM_PAGE);
    const both = (await screen.findByRole('button', { name: 'Leave team' })) as HTMLButtonElement;
    expect(both.disabled).toBe(false);
    expect(both.getAttribute('aria-describedby')).toBeNull();
    await u.click(both);
    expect(await screen.findByRole('dialog', { name: 'Leave Harrow Flats Sprint Club?' })).toBeTruthy();
  });

  it('when a captain withdraws another member’s car, then it is asked first, only that entry is withdrawn, and a toast confirms it', async () => {
    let withdrawn = false;
    const withoutInes = () => ({ ...team(true), entries: team(true).entries.filter((e) => e.car.id !== TEAM_IDS.inesCar) });
    const fetchMock = stubTeamPage(true, {
      [`GET ${TEAM_API}`]: () => jsonResponse(200, withdrawn ? withoutInes() : team(true)),
      [`DELETE ${TEAM_API}/entries/${TEAM_IDS.inesCar}`]: () => {
        withdrawn = true;
        return jsonResponse(204);
      },
    });
    renderApp(TEAM_PAGE);
    const u = userEvent.setup();

    // A captain may withdraw every entry, their own and others'.
    const entries = await screen.findByRole('list', { name: 'Entered cars' });
    expect(within(entries).getAllByRole('button', { name: /^Withdraw/ })).toHaveLength(2);
    await u.click(within(entries).getByRole('button', { name: 'Withdraw White roadster #3' }));
    const dialog = await screen.findByRole('dialog', { name: 'Withdraw White roadster #3?' });
    expect(within(dialog).getByText(/Ines Okafor’s car comes off the team’s class board/)).toBeTruthy();
    expect(requestsTo(fetchMock, `DELETE ${TEAM_API}/entries/${TEAM_IDS.inesCar}`)).toHaveLength(0);
    await u.click(within(dialog).getByRole('button', { name: 'Withdraw the car' }));

    expect(await screen.findByText('White roadster #3 is withdrawn from Harrow Flats Sprint Club')).toBeTruthy();
    expect(screen.queryByRole('dialog')).toBeNull();
    expect(requestsTo(fetchMock, `DELETE ${TEAM_API}/entries/${TEAM_IDS.inesCar}`)).toHaveLength(1);
    expect(within(screen.getByRole('list', { name: 'Entered cars' })).queryByText('White roadster #3')).toBeNull();
  });

  it('when a member who is not a captain looks at the entries, then only their own car offers Withdraw', async () => {
    stubTeamPage(false);
    renderApp(TEAM_PAGE);

    const entries = await screen.findByRole('list', { name: 'Entered cars' });
    expect(within(entries).getAllByRole('button', { name: /^Withdraw/ })).toHaveLength(1);
    expect(within(entries).getByRole('button', { name: 'Withdraw Grey roadster #47' })).toBeTruthy();
  });

  it('when a member changes their entry to share the setup, then the class and sharing are sent for that car', async () => {
    const fetchMock = stubTeamPage(false, { [`PATCH ${TEAM_API}/entries/${IDS.car}`]: jsonResponse(200, {}) });
    renderApp(TEAM_PAGE);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Change Grey roadster #47' }));
    const form = screen.getByRole('form', { name: 'Change the entry of Grey roadster #47' });
    await u.click(within(form).getByRole('radio', { name: /Results and setup/ }));
    await u.click(within(form).getByRole('button', { name: 'Save entry' }));

    await waitFor(() => expect(requestsTo(fetchMock, `PATCH ${TEAM_API}/entries/${IDS.car}`)).toHaveLength(1));
    expect(requestsTo(fetchMock, `PATCH ${TEAM_API}/entries/${IDS.car}`)[0]?.body).toEqual({ classCode: 'SM', sharing: 'results_and_setup' });
  });
});

describe('team page: class factors', () => {
  it('when a captain types a factor and empties another, then the number is sent and the emptied one is removed with factor null', async () => {
    const fetchMock = stubTeamPage(true, { [`PUT ${TEAM_API}/factors`]: list([]) });
    renderApp(TEAM_PAGE);
    const u = userEvent.setup();

    const form = await screen.findByRole('form', { name: `Class factors for ${SEASON}` });
    expect(screen.getByText(/Enter your own class factors here: Scrubline ships with none/)).toBeTruthy();
    const sm = within(form).getByLabelText('Factor for class SM') as HTMLInputElement;
    const str = within(form).getByLabelText('Factor for class STR') as HTMLInputElement;
    expect(sm.value).toBe('');
    expect(str.value).toBe('0.853');

    // A comma works as the decimal point, as phones in many countries type it; a fourth decimal is kept, not rounded.
    await u.type(sm, '0,8125');
    await u.clear(str);
    await u.click(within(form).getByRole('button', { name: 'Save factors' }));

    expect(await within(form).findByText(`Factors for ${SEASON} saved. The class board uses them now.`)).toBeTruthy();
    expect(requestsTo(fetchMock, `PUT ${TEAM_API}/factors`).map((r) => r.body)).toEqual([
      { season: SEASON, classCode: 'SM', factor: 0.8125 },
      { season: SEASON, classCode: 'STR', factor: null },
    ]);
  });

  it('when a factor has a fifth decimal, then the row says how many it keeps, the number stays as typed, and nothing is sent', async () => {
    const fetchMock = stubTeamPage(true, { [`PUT ${TEAM_API}/factors`]: list([]) });
    renderApp(TEAM_PAGE);
    const u = userEvent.setup();

    const form = await screen.findByRole('form', { name: `Class factors for ${SEASON}` });
    const sm = within(form).getByLabelText('Factor for class SM') as HTMLInputElement;
    await u.type(sm, '0.85351');
    await u.click(within(form).getByRole('button', { name: 'Save factors' }));

    expect(await within(form).findByText('Use at most 4 decimals, as in 0.8535')).toBeTruthy();
    expect(sm.getAttribute('aria-invalid')).toBe('true');
    expect(sm.value).toBe('0.85351');
    expect(requestsTo(fetchMock, `PUT ${TEAM_API}/factors`)).toHaveLength(0);
  });

  it('when a saved factor has four decimals, then the row shows all four', async () => {
    stubTeamPage(true, { [`GET ${FACTORS_API}`]: list([{ season: SEASON, classCode: 'STR', factor: 0.8535 }]) });
    renderApp(TEAM_PAGE);

    const form = await screen.findByRole('form', { name: `Class factors for ${SEASON}` });
    expect((within(form).getByLabelText('Factor for class STR') as HTMLInputElement).value).toBe('0.8535');
  });

  it('when a factor is out of range, then the row says why and nothing is sent', async () => {
    const fetchMock = stubTeamPage(true, { [`PUT ${TEAM_API}/factors`]: list([]) });
    renderApp(TEAM_PAGE);
    const u = userEvent.setup();

    const form = await screen.findByRole('form', { name: `Class factors for ${SEASON}` });
    const sm = within(form).getByLabelText('Factor for class SM');
    await u.type(sm, '2.5');
    await u.click(within(form).getByRole('button', { name: 'Save factors' }));

    expect(await within(form).findByText('The factor must be at most 2')).toBeTruthy();
    expect(sm.getAttribute('aria-invalid')).toBe('true');
    expect(requestsTo(fetchMock, `PUT ${TEAM_API}/factors`)).toHaveLength(0);
  });
});
