// @vitest-environment jsdom
import { act, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeAll, describe, expect, it, vi } from 'vitest';
import { METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import type { OutboxEntry } from '@/lib/outbox';
import { jsonResponse, NOBODY_SIGNED_IN, renderApp, requestsTo, setUpAppTests, storedEntry, stubFetch } from '../../test-utils';
import { IDS, user } from '../../fixtures/season';

beforeAll(() => {
  Element.prototype.hasPointerCapture ??= () => false;
  Element.prototype.releasePointerCapture ??= () => undefined;
});
setUpAppTests();

const later = Date.now() + 10 * 60_000;
const waitingRun = (n: number): OutboxEntry =>
  storedEntry({
    key: `run-${n}`,
    recordId: `b000000${n}-0000-4000-8000-000000000000`,
    kind: 'run.create',
    method: 'POST',
    path: '/api/runs',
    label: `Run ${n} · 45.67${n}`,
    scope: { carId: IDS.car, eventId: IDS.event },
    body: {},
    // Tried once without signal; waits before the next try.
    attempts: 1,
    nextAttemptAt: later,
  });
const refused = storedEntry({
  key: 'refused',
  recordId: 'b0000009-0000-4000-8000-000000000000',
  kind: 'setup.quickChange',
  method: 'POST',
  path: `/api/cars/${IDS.car}/setups/quick-change`,
  label: 'Quick change: rear clicks +30',
  scope: { carId: IDS.car },
  state: 'failed',
  attempts: 1,
  error: { status: 400, code: 'validation_failed', message: 'Some fields need attention.', fieldErrors: { 'changes.0.delta': ['LR: Clicks must be at most 24'] } },
});

function stubHome(extra: Parameters<typeof stubFetch>[0] = {}) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user(METRIC_PREFERENCES) }),
    'GET /api/cars': jsonResponse(200, { items: [], count: 0 }),
    'GET /api/events': jsonResponse(200, { items: [], count: 0 }),
    'POST /api/runs': jsonResponse(201, {}),
    ...extra,
  });
}

describe('sync status', () => {
  it('when runs wait and one entry was refused, then the top bar and Home say so in counts', async () => {
    stubHome();
    renderApp('/', { outboxEntries: [waitingRun(1), waitingRun(2), refused] });

    await screen.findByRole('heading', { name: 'Hi, Maren Holt' });
    const badge = screen.getByRole('status');
    expect(badge.textContent).toContain('1 needs attention · 2 runs waiting to upload');
    const sync = screen.getByRole('region', { name: 'Sync' });
    expect(within(sync).getByText('1 needs attention · 2 runs waiting to upload')).toBeTruthy();
    expect(within(sync).getByText('Run 1 · 45.671')).toBeTruthy();
    const problem = within(sync).getByRole('list', { name: 'Needs attention' });
    expect(within(problem).getByText('Quick change: rear clicks +30')).toBeTruthy();
    expect(within(problem).getByText(/LR: Clicks must be at most 24/)).toBeTruthy();
  });

  it('when Try now is pressed, then the waiting runs are sent at once and the state reads All saved', async () => {
    const fetchMock = stubHome();
    const { outbox } = renderApp('/', { outboxEntries: [waitingRun(1), waitingRun(2)] });
    const u = userEvent.setup();

    const sync = await screen.findByRole('region', { name: 'Sync' });
    await u.click(within(sync).getByRole('button', { name: 'Try now' }));

    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(0));
    expect(requestsTo(fetchMock, 'POST /api/runs')).toHaveLength(2);
    expect(await within(sync).findByText('All saved')).toBeTruthy();
    expect(screen.getByRole('status').textContent).toContain('All saved');
  });

  it('when a refused entry is discarded, then it is removed only after saying so twice', async () => {
    stubHome();
    const { outbox } = renderApp('/', { outboxEntries: [refused] });
    const u = userEvent.setup();

    const sync = await screen.findByRole('region', { name: 'Sync' });
    await u.click(within(sync).getByRole('button', { name: 'Discard…' }));
    expect(outbox.getSnapshot()).toHaveLength(1);
    await u.click(within(sync).getByRole('button', { name: 'Yes, discard it' }));

    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(0));
  });
});

describe('signing out with work on the phone', () => {
  async function openSignOut(u: ReturnType<typeof userEvent.setup>) {
    await screen.findByRole('heading', { name: 'Hi, Maren Holt' });
    screen.getByRole('button', { name: 'Account: Maren Holt' }).focus();
    await u.keyboard('{Enter}');
    await u.click(await screen.findByRole('menuitem', { name: 'Sign out' }));
  }

  it('when runs are still waiting, then it warns first and Sign out anyway clears the outbox and the cache', async () => {
    const fetchMock = stubHome({ 'POST /api/auth/logout': jsonResponse(204) });
    const { outbox, queryClient, router } = renderApp('/', { outboxEntries: [waitingRun(1), waitingRun(2), waitingRun(3)] });
    const u = userEvent.setup();

    await openSignOut(u);

    const dialog = await screen.findByRole('dialog', { name: 'Not everything is uploaded' });
    expect(dialog.textContent).toContain('3 runs are still on this phone only');
    expect(requestsTo(fetchMock, 'POST /api/auth/logout')).toHaveLength(0);

    await u.click(within(dialog).getByRole('button', { name: 'Sign out anyway' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(outbox.getSnapshot()).toHaveLength(0);
    expect(queryClient.getQueryData(['cars', 'list'])).toBeUndefined();
    expect(queryClient.getQueryData(['auth', 'me'])).toBeNull();
  });

  it('when a read refused by the ended session marks nobody signed in before the sign-out answers, then her waiting runs are still deleted, and another account’s stay', async () => {
    const hers = [waitingRun(1), waitingRun(2)].map((e) => ({ ...e, owner: IDS.maren }));
    const someoneElses = { ...waitingRun(3), owner: 'c0000000-0000-4000-8000-000000000077' };
    let signOutRefused: () => void = () => undefined;
    stubHome({
      'POST /api/auth/logout': () => {
        // The server has ended the session; a read refused with 401 lands first.
        signOutRefused();
        return jsonResponse(204);
      },
    });
    const { queryClient, router, storage } = renderApp('/', { outboxEntries: [...hers, someoneElses] });
    signOutRefused = () => queryClient.setQueryData(['auth', 'me'], null);
    const u = userEvent.setup();

    await openSignOut(u);
    const dialog = await screen.findByRole('dialog', { name: 'Not everything is uploaded' });
    expect(dialog.textContent).toContain('2 runs are still on this phone only');
    await u.click(within(dialog).getByRole('button', { name: 'Sign out anyway' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(storage.saved.map((e) => e.key)).toEqual([someoneElses.key]);
  });

  it('when Upload now is pressed in the warning, then the runs are sent and it offers a plain sign-out', async () => {
    const fetchMock = stubHome({ 'POST /api/auth/logout': jsonResponse(204) });
    const { outbox } = renderApp('/', { outboxEntries: [waitingRun(1)] });
    const u = userEvent.setup();

    await openSignOut(u);
    const dialog = await screen.findByRole('dialog');
    expect(dialog.textContent).toContain('1 run is still on this phone only');
    await u.click(within(dialog).getByRole('button', { name: 'Upload now' }));

    await waitFor(() => expect(outbox.getSnapshot()).toHaveLength(0));
    expect(requestsTo(fetchMock, 'POST /api/runs')).toHaveLength(1);
    expect(await screen.findByRole('dialog', { name: 'Everything is uploaded' })).toBeTruthy();
    expect(requestsTo(fetchMock, 'POST /api/auth/logout')).toHaveLength(0);
  });
});

describe('the sign-in page with work on the phone', () => {
  const signedOut = (extra: Parameters<typeof stubFetch>[0] = {}) => stubFetch({ 'GET /api/auth/session': NOBODY_SIGNED_IN, ...extra });

  it('when an ended session left two runs on the phone, then the sign-in page says they are on it only and wait for their account, and sends none', async () => {
    const fetchMock = signedOut();
    renderApp('/sign-in', { outboxEntries: [waitingRun(1), waitingRun(2)].map((e) => ({ ...e, owner: IDS.maren })) });

    const note = await screen.findByText('2 runs are still on this phone only.');
    expect(note.closest('[role="status"]')?.textContent).toBe('2 runs are still on this phone only. They wait for the account that made them to sign in here again.');
    expect(requestsTo(fetchMock, 'POST /api/runs')).toHaveLength(0);
  });

  it('when one change is left, then it is told in the singular', async () => {
    signedOut();
    renderApp('/sign-in', { outboxEntries: [{ ...refused, owner: IDS.maren }] });

    const note = await screen.findByText('1 setup is still on this phone only.');
    expect(note.closest('[role="status"]')?.textContent).toContain('It waits for the account that made it to sign in here again.');
  });

  it('when nothing is left on the phone, then the sign-in page says nothing of it', async () => {
    signedOut();
    renderApp('/sign-in');

    await screen.findByRole('button', { name: 'Sign in' });
    // The device is read after the first draw; give it the same turn the note above appears in.
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(screen.queryByText(/still on this phone only/)).toBeNull();
  });

  it('when the phone has no signal, then the top bar says "offline" on screen under what waits, and stops saying it when the signal is back', async () => {
    stubHome();
    const onLine = vi.spyOn(navigator, 'onLine', 'get').mockReturnValue(false);
    renderApp('/', { outboxEntries: [waitingRun(1)] });
    await screen.findByRole('heading', { name: 'Hi, Maren Holt' });
    const badge = screen.getByRole('status');
    const shown = () => [...badge.querySelectorAll('span')].filter((s) => !s.classList.contains('sr-only')).map((s) => s.textContent).join(' | ');
    expect(shown()).toBe('1 waiting | offline');

    onLine.mockReturnValue(true);
    act(() => void window.dispatchEvent(new Event('online')));
    await waitFor(() => expect(shown()).not.toContain('offline'));
    onLine.mockRestore();
  });

  it('when a run was refused, then Home says why once and links to its event, car and driver to fix it there', async () => {
    stubHome();
    const refusedRun = storedEntry({
      key: 'refused-run',
      recordId: 'b0000002-0000-4000-8000-000000000000',
      kind: 'run.create',
      method: 'POST',
      path: '/api/runs',
      label: 'Run 2 · 46.120',
      scope: { carId: IDS.car, eventId: IDS.event },
      body: { carId: IDS.car, eventId: IDS.event, driverId: IDS.maren, runNumber: 2 },
      state: 'failed',
      attempts: 1,
      error: { status: 409, code: 'conflict', message: 'Run 2 is already logged for this driver and car at this event.', fieldErrors: { runNumber: ['Run 2 is already logged; use the next number'] } },
    });
    renderApp('/', { outboxEntries: [refusedRun] });

    const problem = await screen.findByRole('list', { name: 'Needs attention' });
    expect(within(problem).getByText(/^Refused:/).textContent).toBe('Refused: Run 2 is already logged; use the next number');
    expect(within(problem).getByRole('link', { name: 'Open it to fix' }).getAttribute('href')).toBe(
      `/events/${IDS.event}?carId=${IDS.car}&driverId=${IDS.maren}`,
    );
    expect(within(problem).queryByRole('button', { name: 'Try again' })).toBeNull();
  });
});
