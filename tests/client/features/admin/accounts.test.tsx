// @vitest-environment jsdom
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { AdminAccount } from '../../../../shared/auth/admin.schema';
import { errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { user } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/admin/accounts'), () => import('@/app/routes/home')]);

const ADMIN = { ...user(), roles: ['driver', 'admin'] };
const ME: AdminAccount = {
  id: ADMIN.id, email: ADMIN.email, displayName: ADMIN.displayName, roles: ['driver', 'admin'],
  createdAt: '2026-03-01T10:00:00Z', suspendedAt: null, suspensionNote: null, signedInDevices: 1,
};
const TOMAS: AdminAccount = {
  id: '5a111111-1111-4111-8111-111111111111', email: 'tomas@example.test', displayName: 'Tomas Reed', roles: ['driver'],
  createdAt: '2026-04-12T10:00:00Z', suspendedAt: null, suspensionNote: null, signedInDevices: 2,
};
const SUSPENDED: AdminAccount = {
  ...TOMAS, suspendedAt: '2026-11-30T18:00:00Z', suspensionNote: 'Asked by the club after the November event', signedInDevices: 0,
};
const page = (items: AdminAccount[]) => jsonResponse(200, { items, count: items.length, total: items.length });

describe('the accounts page', () => {
  it('when an admin opens it, then every account shows its roles and devices, theirs without buttons, a suspended one with its note and a Restore button', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: ADMIN }),
      'GET /api/admin/users': page([{ ...SUSPENDED, id: '5a222222-2222-4222-8222-222222222222', displayName: 'Lena Park' }, ME, TOMAS]),
    });
    renderApp('/accounts');
    const items = within(await screen.findByRole('list', { name: 'Accounts' })).getAllByRole('listitem');
    expect(items.map((i) => i.querySelector('.font-bold')?.textContent)).toEqual(['Lena Park', 'Maren Holt (you)', 'Tomas Reed']);
    expect(items[0]!.textContent).toMatch(/Suspended since .*2026.*Asked by the club after the November event/);
    expect(within(items[0]!).getByRole('button', { name: 'Restore Lena Park' })).toBeTruthy();
    expect(within(items[1]!).queryByRole('button')).toBeNull();
    expect(items[1]!.textContent).toContain('signed in on 1 device');
    expect(items[2]!.textContent).toMatch(/driver · joined .*2026 · signed in on 2 devices/);
    expect(within(items[0]!).getByRole('button', { name: 'Close for good Lena Park' })).toBeTruthy();
    expect(within(items[2]!).queryByRole('button', { name: /Close for good/ })).toBeNull();
    expect(screen.getByText('3 accounts')).toBeTruthy();
  });

  it('when a search is typed, then the server is asked once typing pauses, with what was typed', async () => {
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: ADMIN }),
      'GET /api/admin/users': page([ME, TOMAS]),
      'GET /api/admin/users?q=tom': page([TOMAS]),
    });
    renderApp('/accounts');
    const u = userEvent.setup();
    await screen.findByRole('list', { name: 'Accounts' });
    await u.type(screen.getByLabelText('Find an account'), 'tom');
    await waitFor(() => expect(within(screen.getByRole('list', { name: 'Accounts' })).getAllByRole('listitem')).toHaveLength(1));
    // Not one request per letter.
    expect(fetchMock.mock.calls.filter(([url]) => String(url).startsWith('/api/admin/users?'))).toHaveLength(1);
  });

  it('when Suspend is confirmed without a reason, then nothing is sent and the reason is asked for; with one, it is sent and the list read again', async () => {
    let suspended = false;
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: ADMIN }),
      'GET /api/admin/users': () => page([suspended ? SUSPENDED : TOMAS]),
      [`POST /api/admin/users/${TOMAS.id}/suspend`]: () => {
        suspended = true;
        return jsonResponse(200, SUSPENDED);
      },
    });
    renderApp('/accounts');
    const u = userEvent.setup();
    await u.click(await screen.findByRole('button', { name: 'Suspend Tomas Reed' }));
    const dialog = within(screen.getByRole('dialog', { name: 'Suspend Tomas Reed?' }));
    await u.click(dialog.getByRole('button', { name: 'Suspend account' }));
    expect(dialog.getByText('Say why, for the next admin who reads this')).toBeTruthy();
    expect(requestsTo(fetchMock, `POST /api/admin/users/${TOMAS.id}/suspend`)).toHaveLength(0);

    await u.type(dialog.getByLabelText('Why'), 'Asked by the club after the November event');
    await u.click(dialog.getByRole('button', { name: 'Suspend account' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(requestsTo(fetchMock, `POST /api/admin/users/${TOMAS.id}/suspend`)[0]?.body).toEqual({ note: 'Asked by the club after the November event' });
    expect(await screen.findByRole('button', { name: 'Restore Tomas Reed' })).toBeTruthy();
  });

  it('when an account is suspended and then restored, then suspending is drawn as a destructive step and restoring is not, a toast says so each time, the card stays where it was, and a suspended one is not offered Make admin', async () => {
    const ANA: AdminAccount = { ...TOMAS, id: '5a333333-3333-4333-8333-333333333333', email: 'ana@example.test', displayName: 'Ana Brook' };
    const ZED: AdminAccount = { ...TOMAS, id: '5a444444-4444-4444-8444-444444444444', email: 'zed@example.test', displayName: 'Zed Moss' };
    let suspended = false;
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: ADMIN }),
      'GET /api/admin/users': () => page([ANA, suspended ? SUSPENDED : TOMAS, ZED]),
      [`POST /api/admin/users/${TOMAS.id}/suspend`]: () => {
        suspended = true;
        return jsonResponse(200, SUSPENDED);
      },
      [`POST /api/admin/users/${TOMAS.id}/restore`]: () => {
        suspended = false;
        return jsonResponse(200, TOMAS);
      },
    });
    renderApp('/accounts');
    const u = userEvent.setup();
    const names = () => within(screen.getByRole('list', { name: 'Accounts' })).getAllByRole('listitem').map((i) => i.querySelector('.font-bold')?.textContent);

    await u.click(await screen.findByRole('button', { name: 'Suspend Tomas Reed' }));
    await u.type(within(screen.getByRole('dialog')).getByLabelText('Why'), 'Asked by the club');
    // Suspending is drawn as a destructive step, in the caution colour; restoring (below) is the ordinary way on.
    const suspend = within(screen.getByRole('dialog')).getByRole('button', { name: 'Suspend account' });
    expect(suspend.className.split(' ')).toEqual(expect.arrayContaining(['text-warning', 'border-warning']));
    expect(suspend.className.split(' ')).not.toContain('bg-accent');
    await u.click(suspend);
    expect(await screen.findByText('Tomas Reed is suspended')).toBeTruthy();
    await screen.findByRole('button', { name: 'Restore Tomas Reed' });
    expect(names()).toEqual(['Ana Brook', 'Tomas Reed', 'Zed Moss']);
    expect(screen.queryByRole('button', { name: 'Make admin Tomas Reed' })).toBeNull();
    expect(screen.getByRole('button', { name: 'Make admin Ana Brook' })).toBeTruthy();

    await u.click(screen.getByRole('button', { name: 'Restore Tomas Reed' }));
    const restore = within(screen.getByRole('dialog', { name: 'Restore Tomas Reed?' })).getByRole('button', { name: 'Restore account' });
    expect(restore.className.split(' ')).toContain('bg-accent');
    expect(restore.className.split(' ')).not.toContain('text-warning');
    await u.click(restore);
    expect(await screen.findByText('Tomas Reed can sign in again')).toBeTruthy();
    // The word before it goes: the two never stand one above the other.
    await waitFor(() => expect(screen.queryByText('Tomas Reed is suspended')).toBeNull());
    expect(await screen.findByRole('button', { name: 'Make admin Tomas Reed' })).toBeTruthy();
  });

  it('when a suspended account is an admin, then its admin role can still be taken', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: ADMIN }),
      'GET /api/admin/users': page([{ ...SUSPENDED, roles: ['driver', 'admin'] }]),
    });
    renderApp('/accounts');
    expect(await screen.findByRole('button', { name: 'Take admin role Tomas Reed' })).toBeTruthy();
  });

  it('when a search is still being read as the suspension is sent, then that answer from before it is not the one shown', async () => {
    // A search sent before the suspension reached the database answers "not suspended" after the suspension is done.
    let suspended = false;
    let suspensionDone!: () => void;
    const afterSuspension = new Promise<void>((resolve) => (suspensionDone = resolve));
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: ADMIN }),
      'GET /api/admin/users': () => page([TOMAS]),
      'GET /api/admin/users?q=tom': async () => {
        const answer = page([suspended ? SUSPENDED : TOMAS]);
        await afterSuspension;
        return answer;
      },
      [`POST /api/admin/users/${TOMAS.id}/suspend`]: () => {
        suspended = true;
        setTimeout(suspensionDone, 50);
        return jsonResponse(200, SUSPENDED);
      },
    });
    renderApp('/accounts');
    const u = userEvent.setup();
    await u.click(await screen.findByRole('button', { name: 'Suspend Tomas Reed' }));
    await u.type(within(screen.getByRole('dialog')).getByLabelText('Why'), 'Asked by e-mail to be removed');
    // The search is typed behind the question (as a quick hand does), and goes out once typing pauses.
    fireEvent.change(screen.getByLabelText('Find an account', { selector: 'input' }), { target: { value: 'tom' } });
    await waitFor(() => expect(requestsTo(fetchMock, 'GET /api/admin/users?q=tom')).toHaveLength(1), { timeout: 2000 });
    await u.click(within(screen.getByRole('dialog')).getByRole('button', { name: 'Suspend account' }));

    expect(await screen.findByRole('button', { name: 'Close for good Tomas Reed' }, { timeout: 3000 })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Restore Tomas Reed' })).toBeTruthy();
  });

  it('when the server refuses the suspension, then its words show in the dialog, which stays open', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: ADMIN }),
      'GET /api/admin/users': page([TOMAS]),
      [`POST /api/admin/users/${TOMAS.id}/suspend`]: errorResponse(400, 'validation_failed', 'Some fields need attention.', { note: ['Use at most 500 characters'] }),
    });
    renderApp('/accounts');
    const u = userEvent.setup();
    await u.click(await screen.findByRole('button', { name: 'Suspend Tomas Reed' }));
    const dialog = within(screen.getByRole('dialog'));
    await u.type(dialog.getByLabelText('Why'), 'Long story');
    await u.click(dialog.getByRole('button', { name: 'Suspend account' }));
    expect(await dialog.findByText('Use at most 500 characters')).toBeTruthy();
    expect(dialog.getByLabelText('Why').getAttribute('aria-invalid')).toBe('true');
  });

  it('when a suspended account is closed for good, then its address is asked for, a wrong one is refused beside the field, and once typed it is sent and the row goes', async () => {
    let closed = false;
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: ADMIN }),
      'GET /api/admin/users': () => page(closed ? [] : [SUSPENDED]),
      [`POST /api/admin/users/${TOMAS.id}/close`]: [
        errorResponse(400, 'validation_failed', 'Type the account’s e-mail address exactly as shown.', { email: ['Type the account’s e-mail address exactly as shown'] }),
        () => {
          closed = true;
          return jsonResponse(204);
        },
      ],
    });
    renderApp('/accounts');
    const u = userEvent.setup();
    // Only a suspended row offers it.
    await u.click(await screen.findByRole('button', { name: 'Close for good Tomas Reed' }));
    const dialog = within(screen.getByRole('dialog', { name: 'Close Tomas Reed’s account for good?' }));
    expect(dialog.getByText(/stays there under “Closed account”\. This cannot be undone/)).toBeTruthy();
    await u.click(dialog.getByRole('button', { name: 'Close the account' }));
    expect(dialog.getByText('Type the account’s e-mail address')).toBeTruthy();
    expect(requestsTo(fetchMock, `POST /api/admin/users/${TOMAS.id}/close`)).toHaveLength(0);

    await u.type(dialog.getByLabelText('Their e-mail address'), 'tomas@example.com');
    await u.click(dialog.getByRole('button', { name: 'Close the account' }));
    expect(await dialog.findByText('Type the account’s e-mail address exactly as shown')).toBeTruthy();

    await u.clear(dialog.getByLabelText('Their e-mail address'));
    await u.type(dialog.getByLabelText('Their e-mail address'), TOMAS.email);
    await u.click(dialog.getByRole('button', { name: 'Close the account' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(requestsTo(fetchMock, `POST /api/admin/users/${TOMAS.id}/close`).map((r) => r.body)).toEqual([
      { email: 'tomas@example.com' },
      { email: TOMAS.email },
    ]);
    expect(await screen.findByText('No accounts yet.')).toBeTruthy();
    expect(await screen.findByText('Tomas Reed’s account is closed')).toBeTruthy();
  });

  it('when an admin makes a driver an admin, then the role is sent after asking, and the row then offers to take it back', async () => {
    let admin = false;
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: ADMIN }),
      'GET /api/admin/users': () => page([admin ? { ...TOMAS, roles: ['driver', 'admin'] } : TOMAS]),
      [`PUT /api/admin/users/${TOMAS.id}/admin`]: () => {
        admin = true;
        return jsonResponse(200, { ...TOMAS, roles: ['driver', 'admin'] });
      },
    });
    renderApp('/accounts');
    const u = userEvent.setup();
    await u.click(await screen.findByRole('button', { name: 'Make admin Tomas Reed' }));
    const dialog = within(screen.getByRole('dialog', { name: 'Make Tomas Reed an admin?' }));
    await u.click(dialog.getByRole('button', { name: 'Make admin' }));
    expect(await screen.findByRole('button', { name: 'Take admin role Tomas Reed' })).toBeTruthy();
    expect(requestsTo(fetchMock, `PUT /api/admin/users/${TOMAS.id}/admin`).map((r) => r.body)).toEqual([{ isAdmin: true }]);
  });

  it('when a driver who is not an admin opens it, then the page says so and asks the server nothing', async () => {
    const fetchMock = stubFetch({ 'GET /api/auth/session': jsonResponse(200, { user: user() }) });
    renderApp('/accounts');
    expect(await screen.findByText('Only an administrator can see the accounts.')).toBeTruthy();
    expect(requestsTo(fetchMock, 'GET /api/admin/users')).toHaveLength(0);
  });

  it.each([
    ['an admin', ADMIN, 'Teams and accounts', true],
    ['a driver', user(), 'Teams', false],
  ])('when %s is on the home page, then its links are named %j and Accounts is there: %s', async (_who, me, name, linked) => {
    stubFetch({ 'GET /api/auth/session': jsonResponse(200, { user: me }), 'GET /api/cars': jsonResponse(200, { items: [], count: 0 }) });
    renderApp('/');
    const nav = await screen.findByRole('navigation', { name });
    expect(within(nav).queryByRole('link', { name: /^Accounts/ })?.getAttribute('href') ?? null).toBe(linked ? '/accounts' : null);
  });
});
