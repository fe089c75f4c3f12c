import { METRIC_PREFERENCES } from '../../../shared/calc/units.calc';
// @vitest-environment jsdom
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createMemoryRouter } from 'react-router-dom';
import { SIGNED_IN_ROUTE_ID, sendToSignIn } from '@/app/router';
import { createQueryClient } from '@/app/query-client';
import { api, dropCsrfToken, NETWORK_MESSAGE } from '@/lib/api-client';
import { clearToasts } from '@/lib/toast-store';
import { errorResponse, jsonResponse, NOBODY_SIGNED_IN, renderApp, requestsTo, SIGNED_OUT, stubFetch } from '../test-utils';
import { EVENT } from '../fixtures/season';
import { todayIsoDate } from '@/lib/dates';

const SAM = { id: 'u1', email: 'sam@example.test', displayName: 'Sam Okafor', roles: ['driver', 'team_captain'], preferences: { units: METRIC_PREFERENCES } };

beforeEach(() => dropCsrfToken());
afterEach(() => {
  cleanup();
  clearToasts();
  vi.unstubAllGlobals();
});

async function signIn(email: string, password: string) {
  const user = userEvent.setup();
  await user.type(await screen.findByLabelText('E-mail'), email);
  await user.type(screen.getByLabelText('Password'), password);
  await user.click(screen.getByRole('button', { name: 'Sign in' }));
  return user;
}

describe('routes', () => {
  it('when the address matches no page, then the not-found page is shown', async () => {
    const fetchMock = stubFetch({});
    renderApp('/no/such/page');

    expect(await screen.findByRole('heading', { name: 'Page not found' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Go to Home' }).getAttribute('href')).toBe('/');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('when a signed-out user opens a signed-in page, then they are sent to sign in and come back after', async () => {
    const fetchMock = stubFetch({
      'GET /api/auth/session': NOBODY_SIGNED_IN,
      'POST /api/auth/login': jsonResponse(200, { user: SAM }),
    });
    const { router } = renderApp('/?view=week');

    await screen.findByRole('heading', { name: 'Sign in' });
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(router.state.location.search).toBe('?next=%2F%3Fview%3Dweek');

    await signIn('sam@example.test', 'correct horse battery');

    expect(await screen.findByRole('heading', { name: 'Hi, Sam Okafor' })).toBeTruthy();
    expect(router.state.location.pathname + router.state.location.search).toBe('/?view=week');
    expect(requestsTo(fetchMock, 'POST /api/auth/login')[0]?.body).toEqual({
      email: 'sam@example.test',
      password: 'correct horse battery',
    });
  });

  it('when someone signs in on a phone that still holds answers from an earlier session, then those answers are dropped', async () => {
    stubFetch({
      'GET /api/auth/session': NOBODY_SIGNED_IN,
      'POST /api/auth/login': jsonResponse(200, { user: SAM }),
    });
    const { queryClient } = renderApp('/sign-in');
    // A car page read by whoever used the phone before (a page Home does not read again).
    queryClient.setQueryData(['cars', 'detail', 'c-earlier'], { id: 'c-earlier', name: 'Someone else’s car' });

    await signIn('sam@example.test', 'correct horse battery');

    expect(await screen.findByRole('heading', { name: 'Hi, Sam Okafor' }, { timeout: 5000 })).toBeTruthy();
    expect(queryClient.getQueryData(['cars', 'detail', 'c-earlier'])).toBeUndefined();
  }, 15_000);

  it('when the e-mail and password do not match (401), then the sign-in form shows the server message', async () => {
    stubFetch({
      'GET /api/auth/session': NOBODY_SIGNED_IN,
      'POST /api/auth/login': errorResponse(401, 'unauthenticated', 'That e-mail and password do not match an account.'),
    });
    const { router } = renderApp('/sign-in');

    await signIn('sam@example.test', 'wrong password');

    const alert = await screen.findByText('That e-mail and password do not match an account.');
    expect(alert.closest('[role="alert"]')).toBeTruthy();
    expect(router.state.location.pathname).toBe('/sign-in');
    // Shown once, on the form: not also as a toast.
    expect(screen.getAllByText('That e-mail and password do not match an account.')).toHaveLength(1);
  });

  it('when sign-in is rate limited (429), then the form shows how long to wait', async () => {
    stubFetch({
      'GET /api/auth/session': NOBODY_SIGNED_IN,
      'POST /api/auth/login': errorResponse(429, 'rate_limited', 'Too many attempts. Try again in 15 min.'),
    });
    renderApp('/sign-in');

    await signIn('sam@example.test', 'whatever it is');

    expect(await screen.findByText('Too many attempts. Try again in 15 min.')).toBeTruthy();
  });

  it('when there is no connection while signing in, then the form says so and nothing is lost', async () => {
    stubFetch({
      'GET /api/auth/session': NOBODY_SIGNED_IN,
      'POST /api/auth/login': () => Promise.reject(new TypeError('Failed to fetch')),
    });
    renderApp('/sign-in');

    await signIn('sam@example.test', 'correct horse battery');

    expect(await screen.findByText(NETWORK_MESSAGE)).toBeTruthy();
    expect((screen.getByLabelText('Password') as HTMLInputElement).value).toBe('correct horse battery');
  });

  it('when a signed-in user with no cars opens Home, then it greets them, names their roles and says there are no cars yet', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: SAM }),
      'GET /api/cars': jsonResponse(200, { items: [], count: 0 }),
      'GET /api/events': jsonResponse(200, { items: [], count: 0 }),
    });
    renderApp('/');

    expect(await screen.findByRole('heading', { name: 'Hi, Sam Okafor' })).toBeTruthy();
    expect(screen.getByText('Your roles: driver and team captain.')).toBeTruthy();
    const cars = screen.getByRole('region', { name: 'Your cars' });
    expect(await within(cars).findByText(/No cars yet/)).toBeTruthy();
    const sync = screen.getByRole('region', { name: 'Sync' });
    expect(within(sync).getByText('All saved')).toBeTruthy();
    expect(screen.getByRole('status').textContent).toContain('All saved');
  });

  it('when two events are on today, then Home offers both, each one tap from its event day; one on another day is not among them', async () => {
    const today = todayIsoDate();
    const morning = { ...EVENT, id: 'e2222222-2222-4222-8222-222222222222', name: 'Morning points round', date: today };
    const afternoon = { ...EVENT, id: 'e3333333-3333-4333-8333-333333333333', name: 'Afternoon practice', date: today };
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: SAM }),
      'GET /api/cars': jsonResponse(200, { items: [], count: 0 }),
      'GET /api/events': jsonResponse(200, { items: [afternoon, morning, EVENT], count: 3 }),
    });
    renderApp('/');
    const day = await screen.findByRole('region', { name: 'Event day' });
    const links = await within(day).findAllByRole('link');
    expect(links.map((l) => l.getAttribute('href'))).toEqual([`/events/${afternoon.id}`, `/events/${morning.id}`]);
    expect(links.every((l) => l.textContent?.startsWith('Today'))).toBe(true);
  });

  it('when a captain opens Home, then each of their teams\' class boards is one tap away, above the event and their cars', async () => {
    const teamId = 'd1111111-1111-4111-8111-111111111111';
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: SAM }),
      'GET /api/cars': jsonResponse(200, { items: [], count: 0 }),
      'GET /api/events': jsonResponse(200, { items: [], count: 0 }),
      'GET /api/teams/mine': jsonResponse(200, { items: [{ id: teamId, name: 'Late Brakers', isCaptain: true }], count: 1 }),
    });
    renderApp('/');

    const board = await screen.findByRole('link', { name: /^Late Brakers: class board/ });
    expect(board.getAttribute('href')).toBe(`/teams/${teamId}/board`);
    const names = screen.getAllByRole('region').map((r) => within(r).getByRole('heading').textContent);
    expect(names.indexOf('Teams')).toBe(0);
    expect(names.indexOf('Teams')).toBeLessThan(names.indexOf('Your cars'));
  });

  it('when a captain with no car and no event opens Home, then no event day is offered; once a team car has an event, it is', async () => {
    const teamId = 'd1111111-1111-4111-8111-111111111111';
    const routes = {
      'GET /api/auth/session': jsonResponse(200, { user: SAM }),
      'GET /api/cars': jsonResponse(200, { items: [], count: 0 }),
      'GET /api/teams/mine': jsonResponse(200, { items: [{ id: teamId, name: 'Late Brakers', isCaptain: true }], count: 1 }),
    };
    stubFetch({ ...routes, 'GET /api/events': jsonResponse(200, { items: [], count: 0 }) });
    const { unmount } = renderApp('/');
    const regions = () => screen.getAllByRole('region').map((r) => within(r).getByRole('heading').textContent);
    const cars = await screen.findByRole('region', { name: 'Your cars' });
    expect(await within(cars).findByText(/No cars yet/)).toBeTruthy();
    expect(regions()).toEqual(['Teams', 'Sync', 'Your cars']);
    expect(screen.queryByText(/No events yet/)).toBeNull();
    unmount();

    stubFetch({ ...routes, 'GET /api/events': jsonResponse(200, { items: [EVENT], count: 1 }) });
    renderApp('/');
    const day = await screen.findByRole('region', { name: 'Event day' });
    expect((await within(day).findByRole('link', { name: new RegExp(EVENT.name) })).getAttribute('href')).toBe(`/events/${EVENT.id}`);
    expect(regions()).toEqual(['Teams', 'Event day', 'Sync', 'Your cars']);
  });

  it('when an admin opens Home, then the accounts are one tap away, above the event and their cars; a driver\'s links come after them', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: { ...SAM, roles: ['driver', 'admin'] } }),
      'GET /api/cars': jsonResponse(200, { items: [], count: 0 }),
      'GET /api/events': jsonResponse(200, { items: [], count: 0 }),
    });
    const { unmount } = renderApp('/');

    const accounts = await screen.findByRole('link', { name: /^Accounts/ });
    expect(accounts.getAttribute('href')).toBe('/accounts');
    const regions = () => screen.getAllByRole('region').map((r) => within(r).getByRole('heading').textContent);
    expect(regions()[0]).toBe('Teams and accounts');
    unmount();

    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: { ...SAM, roles: ['driver'] } }),
      'GET /api/cars': jsonResponse(200, { items: [], count: 0 }),
      'GET /api/events': jsonResponse(200, { items: [], count: 0 }),
    });
    renderApp('/');
    await screen.findByRole('heading', { name: 'Hi, Sam Okafor' });
    expect(regions()).toEqual(['Event day', 'Sync', 'Your cars', 'Teams']);
  });

  it('when a signed-in user opens the sign-in page, then they go straight to Home', async () => {
    stubFetch({ 'GET /api/auth/session': jsonResponse(200, { user: SAM }) });
    const { router } = renderApp('/sign-in');

    await screen.findByRole('heading', { name: 'Hi, Sam Okafor' });
    expect(router.state.location.pathname).toBe('/');
  });

  it('when a request on a signed-in page answers 401, then the user is sent to sign in, keeping the address', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: SAM }),
      'GET /api/cars': SIGNED_OUT,
    });
    const { router, queryClient } = renderApp('/?view=week');
    await screen.findByRole('heading', { name: 'Hi, Sam Okafor' });

    await queryClient
      .fetchQuery({ queryKey: ['cars'], queryFn: () => api.get('/api/cars') })
      .catch(() => undefined);

    await screen.findByRole('heading', { name: 'Sign in' });
    expect(router.state.location.pathname + router.state.location.search).toBe('/sign-in?next=%2F%3Fview%3Dweek');
  });

  it('when the server says nobody is signed in after the first page’s loader went by the answer kept on the phone, but before that page is in, then the page still ends at sign-in, keeping the address', async () => {
    let decide: (v: null) => void = () => undefined;
    const router = createMemoryRouter(
      [
        // The first page's sign-in check, still settling: it has gone by the kept answer ("signed in").
        { id: SIGNED_IN_ROUTE_ID, path: '/', loader: () => new Promise<null>((resolve) => (decide = resolve)), element: <p>Home</p> },
        { path: '/sign-in', element: <p>Sign in</p> },
      ],
      { initialEntries: ['/?view=week'] },
    );
    const queryClient = createQueryClient({ retry: false });
    queryClient.setQueryData(['auth', 'me'], SAM);

    // The server's answer (401) lands now; without a fix the page would stay at "One moment…" for good.
    sendToSignIn(router, queryClient);
    expect(queryClient.getQueryData(['auth', 'me'])).toBeNull();
    expect(router.state.initialized).toBe(false);
    decide(null);

    await waitFor(() => expect(router.state.location.pathname + router.state.location.search).toBe('/sign-in?next=%2F%3Fview%3Dweek'));
    router.dispose();
  });

  it('when the user signs out from the account menu, then the session ends and the sign-in page opens', async () => {
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: SAM }),
      'POST /api/auth/logout': jsonResponse(204),
    });
    const { router, queryClient } = renderApp('/');
    await screen.findByRole('heading', { name: 'Hi, Sam Okafor' });

    const user = userEvent.setup();
    screen.getByRole('button', { name: 'Account: Sam Okafor' }).focus();
    await user.keyboard('{Enter}');
    await user.click(await screen.findByRole('menuitem', { name: 'Sign out' }));

    await screen.findByRole('heading', { name: 'Sign in' });
    expect(router.state.location.pathname + router.state.location.search).toBe('/sign-in');
    expect(requestsTo(fetchMock, 'POST /api/auth/logout')).toHaveLength(1);
    await waitFor(() => expect(queryClient.getQueryData(['auth', 'me'])).toBeNull());
  });
});
