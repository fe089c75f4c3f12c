// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { SignedInDevice } from '../../../../shared/auth/account.schema';
import { METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import { errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { user } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/settings')]);

const THIS: SignedInDevice = { id: 'a'.repeat(32), device: 'Chrome on Android', signedInAt: '2026-11-20T08:00:00Z', lastActiveAt: '2026-12-03T09:55:00Z', current: true };
const IPHONE: SignedInDevice = { id: 'b'.repeat(32), device: 'Safari on iOS', signedInAt: '2026-10-02T17:30:00Z', lastActiveAt: '2026-11-28T12:00:00Z', current: false };
const LAPTOP: SignedInDevice = { id: 'c'.repeat(32), device: null, signedInAt: null, lastActiveAt: '2026-11-01T20:00:00Z', current: false };

/** The server's list before any sign-out, and after one that succeeded. */
function open(endAnswer: Response, before: SignedInDevice[] = [THIS, IPHONE, LAPTOP], after: SignedInDevice[] = [THIS, LAPTOP]) {
  let signedOut = false;
  const fetchMock = stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user(METRIC_PREFERENCES) }),
    'GET /api/auth/me/sessions': () => jsonResponse(200, { items: signedOut ? after : before }),
    'POST /api/auth/me/sessions/end': () => {
      signedOut = endAnswer.ok;
      return endAnswer.clone();
    },
  });
  renderApp('/settings');
  return { fetchMock, u: userEvent.setup() };
}

/** The settings page's devices section (the top bar has a status line of its own). */
const section = () => within(screen.getByRole('region', { name: 'Signed-in devices' }));

describe('signed-in devices in settings', () => {
  it('when the page opens, then every device is listed with when it signed in and was last active, this one marked and with no sign-out button', async () => {
    open(jsonResponse(200, { ended: 1 }));
    const list = within(await screen.findByRole('list', { name: 'Signed-in devices' }));
    const items = list.getAllByRole('listitem');
    expect(items).toHaveLength(3);
    expect(items[0]!.textContent).toMatch(/Chrome on Android\s*This device/);
    expect(within(items[0]!).queryByRole('button')).toBeNull();
    expect(items[1]!.textContent).toMatch(/Safari on iOS.*Signed in .*2026 · last active .*2026/);
    // A browser that did not say what it is, signed in before sign-in times were kept.
    expect(items[2]!.textContent).toMatch(/^A browser that did not say what it is\s*last active/);
  });

  it('when one device is signed out with the password, then only its id and the password are sent, the list is read again and the page says how many', async () => {
    const { fetchMock, u } = open(jsonResponse(200, { ended: 1 }));
    const button = await screen.findByRole('button', { name: 'Sign out Safari on iOS' });
    await u.click(button);
    const confirm = within(screen.getByRole('form', { name: 'Confirm signing out' }));
    expect(confirm.getByText(/Sign out Safari on iOS\?/)).toBeTruthy();
    // The question opens under the device it is about, not after the whole list.
    expect(within(button.closest('li')!).getByRole('form', { name: 'Confirm signing out' })).toBeTruthy();
    expect(document.activeElement).toBe(confirm.getByLabelText('Your password'));
    await u.type(confirm.getByLabelText('Your password'), 'cold tyres warm coffee');
    await u.click(confirm.getByRole('button', { name: 'Sign out' }));

    expect((await section().findByRole('status')).textContent).toBe('Signed out: 1 device.');
    expect(requestsTo(fetchMock, 'POST /api/auth/me/sessions/end')[0]?.body).toEqual({ password: 'cold tyres warm coffee', sessionId: IPHONE.id });
    expect(screen.queryByRole('form', { name: 'Confirm signing out' })).toBeNull();
    // Read again after the sign-out: the iPhone is gone from the list.
    await waitFor(() => expect(within(screen.getByRole('list', { name: 'Signed-in devices' })).getAllByRole('listitem')).toHaveLength(2));
    expect(screen.queryByText('Safari on iOS')).toBeNull();
  });

  it('when all other devices are signed out, then no device is named in the request', async () => {
    const { fetchMock, u } = open(jsonResponse(200, { ended: 2 }));
    const all = await screen.findByRole('button', { name: 'Sign out all other devices' });
    // Above the list, which can be long, with its question.
    const list = screen.getByRole('list', { name: 'Signed-in devices' });
    expect(all.compareDocumentPosition(list) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    await u.click(all);
    const confirm = within(screen.getByRole('form', { name: 'Confirm signing out' }));
    expect(confirm.getByText(/Sign out all 2 other devices\?/)).toBeTruthy();
    expect(screen.getByRole('form', { name: 'Confirm signing out' }).compareDocumentPosition(list) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    await u.type(confirm.getByLabelText('Your password'), 'cold tyres warm coffee');
    await u.click(confirm.getByRole('button', { name: 'Sign out' }));
    expect((await section().findByRole('status')).textContent).toBe('Signed out: 2 devices.');
    expect(requestsTo(fetchMock, 'POST /api/auth/me/sessions/end')[0]?.body).toEqual({ password: 'cold tyres warm coffee' });
  });

  it('when the password is wrong, then the field says so and the device stays listed', async () => {
    const { u } = open(errorResponse(400, 'validation_failed', 'That is not your password.', { password: ['That is not your password'] }));
    await u.click(await screen.findByRole('button', { name: 'Sign out Safari on iOS' }));
    const confirm = within(screen.getByRole('form', { name: 'Confirm signing out' }));
    await u.type(confirm.getByLabelText('Your password'), 'not it');
    await u.click(confirm.getByRole('button', { name: 'Sign out' }));
    expect(await confirm.findByText('That is not your password')).toBeTruthy();
    expect(confirm.getByLabelText('Your password').getAttribute('aria-invalid')).toBe('true');
    expect(section().queryByRole('status')).toBeNull();
  });

  it('when many devices are signed in, then this one and the five latest active show, and the rest on request', async () => {
    const many: SignedInDevice[] = [
      THIS,
      ...Array.from({ length: 8 }, (_, i) => ({ ...IPHONE, id: String(i).repeat(32), lastActiveAt: `2026-11-${String(28 - i).padStart(2, '0')}T12:00:00Z` })),
    ];
    const { u } = open(jsonResponse(200, { ended: 1 }), many);
    const list = within(await screen.findByRole('list', { name: 'Signed-in devices' }));
    expect(list.getAllByRole('listitem')).toHaveLength(6);
    expect(list.getAllByRole('listitem')[0]!.textContent).toMatch(/This device/);
    await u.click(section().getByRole('button', { name: 'Show all 9 devices' }));
    expect(list.getAllByRole('listitem')).toHaveLength(9);
    expect(section().queryByRole('button', { name: /Show all/ })).toBeNull();
  });

  it('when only one other device is signed in, then there is no separate button for all of them', async () => {
    open(jsonResponse(200, { ended: 1 }), [THIS, IPHONE]);
    await screen.findByRole('button', { name: 'Sign out Safari on iOS' });
    expect(screen.queryByRole('button', { name: 'Sign out all other devices' })).toBeNull();
  });
});
