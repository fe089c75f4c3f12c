// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { CLOSED_ACCOUNT_NAME } from '../../../../shared/auth/account.schema';
import { METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import type { OutboxEntry } from '../../../../src/lib/outbox';
import { blockingEntry, errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch, type StubRoutes } from '../../test-utils';
import { user } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/settings'), () => import('@/app/routes/sign-in')]);

const ME = user(METRIC_PREFERENCES);
const PASSWORD = 'cold tyres warm coffee';

/** The settings page's Close account section. */
const section = async () => within(await screen.findByRole('region', { name: 'Close account' }));

function open(answers: StubRoutes = {}, outboxEntries: OutboxEntry[] = []) {
  const fetchMock = stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: ME }),
    'GET /api/auth/me/sessions': jsonResponse(200, { items: [] }),
    'GET /api/auth/me/email': jsonResponse(200, { pending: null }),
    ...answers,
  });
  return { fetchMock, ...renderApp('/settings', { outboxEntries }), u: userEvent.setup() };
}

async function openForm(u: ReturnType<typeof userEvent.setup>) {
  await u.click(await (await section()).findByRole('button', { name: 'Close account…' }));
  return within(screen.getByRole('form', { name: 'Close account' }));
}

describe('closing the account from settings', () => {
  it('when the section is read, then it says what is deleted, what stays under which name, and that the data downloads first from just above', async () => {
    open();
    const s = await section();
    expect(s.getByText(/Your cars are deleted, with every run, setup, tyre reading/)).toBeTruthy();
    expect(s.getByText(new RegExp(`stay in their seasons under “${CLOSED_ACCOUNT_NAME}”`))).toBeTruthy();
    expect(s.getByText('To keep your seasons, download your data first (above).')).toBeTruthy();
    // The download above it is a plain link to the account's file, saved by the browser.
    const data = within(screen.getByRole('region', { name: 'Your account’s data' }));
    const link = data.getByRole('link', { name: 'Download your data' });
    expect(link.getAttribute('href')).toBe('/api/auth/me/export.json');
    expect(link.hasAttribute('download')).toBe(true);
  });

  it('when the form is sent without a password, then the field says so and nothing is sent; “Keep my account” closes it', async () => {
    const { fetchMock, u } = open();
    const form = await openForm(u);
    expect(document.activeElement).toBe(form.getByLabelText('Your password'));
    await u.click(form.getByRole('button', { name: 'Close my account' }));
    expect(await form.findByText('Enter your password')).toBeTruthy();
    await u.click(form.getByRole('button', { name: 'Keep my account' }));
    expect(screen.queryByRole('form', { name: 'Close account' })).toBeNull();
    expect(requestsTo(fetchMock, 'POST /api/auth/me/close')).toHaveLength(0);
  });

  it('when the password is wrong, then the field says so; when the account is still needed, then the reason shows; the page stays signed in', async () => {
    const { u, router } = open({
      'POST /api/auth/me/close': [
        errorResponse(400, 'validation_failed', 'That is not your password.', { password: ['That is not your password'] }),
        errorResponse(409, 'conflict', 'Your account is still open. You are the only captain of the team “Gravel Pit Irregulars”: make another member captain first.'),
      ],
    });
    const form = await openForm(u);
    await u.type(form.getByLabelText('Your password'), 'not it');
    await u.click(form.getByRole('button', { name: 'Close my account' }));
    expect(await form.findByText('That is not your password')).toBeTruthy();

    await u.clear(form.getByLabelText('Your password'));
    await u.type(form.getByLabelText('Your password'), PASSWORD);
    await u.click(form.getByRole('button', { name: 'Close my account' }));
    expect((await form.findByRole('alert')).textContent).toMatch(/only captain of the team “Gravel Pit Irregulars”/);
    expect(router.state.location.pathname).toBe('/settings');
  });

  it('when there is no signal, then it says the account is still open', async () => {
    const { u } = open({
      'POST /api/auth/me/close': () => {
        throw new TypeError('Failed to fetch');
      },
    });
    const form = await openForm(u);
    await u.type(form.getByLabelText('Your password'), PASSWORD);
    await u.click(form.getByRole('button', { name: 'Close my account' }));
    expect((await form.findByRole('alert')).textContent).toBe('No connection: your account is still open. Try again when you have signal.');
  });

  it('when entries wait on the phone, the form warns they go too; once closed, the phone keeps nothing and the sign-in page says the account is closed', async () => {
    const { fetchMock, u, router, queryClient, outbox } = open({ 'POST /api/auth/me/close': jsonResponse(204) }, [blockingEntry()]);
    const form = await openForm(u);
    expect(await form.findByText(/still on this phone only/)).toBeTruthy();
    await u.type(form.getByLabelText('Your password'), PASSWORD);
    await u.click(form.getByRole('button', { name: 'Close my account' }));

    await screen.findByRole('heading', { name: 'Sign in' });
    expect(screen.getByRole('status').textContent).toBe('Your account is closed.');
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(requestsTo(fetchMock, 'POST /api/auth/me/close').map((r) => r.body)).toEqual([{ password: PASSWORD }]);
    await waitFor(() => expect(queryClient.getQueryData(['auth', 'me'])).toBeNull());
    expect(outbox.getSnapshot()).toEqual([]);
  });
});
