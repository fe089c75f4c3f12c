// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { PendingEmailChange } from '../../../../shared/auth/account.schema';
import { METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import { errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { user } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/settings')]);

const ME = user(METRIC_PREFERENCES);
const NEW = 'maren.holt@example.test';
const WAITING: PendingEmailChange = { pending: { email: NEW, expiresAt: '2026-12-04T09:00:00Z' } };

/** The settings page's E-mail section. */
const section = async () => within(await screen.findByRole('region', { name: 'E-mail' }));

function open(path = '/settings', answers: Record<string, Response | (() => Response)> = {}) {
  const fetchMock = stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: ME }),
    'GET /api/auth/me/sessions': jsonResponse(200, { items: [] }),
    'GET /api/auth/me/email': jsonResponse(200, { pending: null }),
    ...answers,
  });
  const { router } = renderApp(path);
  return { fetchMock, router, u: userEvent.setup() };
}

describe('the sign-in address in settings', () => {
  it('when a change waits for its link, then the page says where the link went and until when', async () => {
    open('/settings', { 'GET /api/auth/me/email': jsonResponse(200, WAITING) });
    expect((await (await section()).findByText(/You sign in with/)).textContent).toBe(`You sign in with ${ME.email}.`);
    expect((await (await section()).findByText(/A link was sent to/)).textContent).toMatch(new RegExp(`sent to ${NEW}\\. Open it .* before .*2026`));
  });

  it('when the form opens, then the new address is typed on the e-mail keyboard with no capital, correction or spelling marks put on it', async () => {
    const { u } = open();
    await u.click(await (await section()).findByRole('button', { name: 'Change address' }));
    const field = within(screen.getByRole('form', { name: 'Change sign-in address' })).getByLabelText('New address');
    expect(field.getAttribute('type')).toBe('email');
    expect(field.getAttribute('inputmode')).toBe('email');
    expect(field.getAttribute('autocomplete')).toBe('email');
    expect(field.getAttribute('autocapitalize')).toBe('none');
    expect(field.getAttribute('autocorrect')).toBe('off');
    expect(field.getAttribute('spellcheck')).toBe('false');
  });

  it('when the form is sent empty, then each field says what it needs and nothing is sent', async () => {
    const { fetchMock, u } = open();
    await u.click(await (await section()).findByRole('button', { name: 'Change address' }));
    const form = within(screen.getByRole('form', { name: 'Change sign-in address' }));
    await u.click(form.getByRole('button', { name: 'Send the link' }));
    expect(await form.findByText('Enter a valid e-mail address')).toBeTruthy();
    expect(form.getByText('Enter your password')).toBeTruthy();
    expect(requestsTo(fetchMock, 'POST /api/auth/me/email')).toHaveLength(0);

    // Cancel closes it again, sending nothing.
    await u.click(form.getByRole('button', { name: 'Cancel' }));
    expect(screen.queryByRole('form', { name: 'Change sign-in address' })).toBeNull();
    expect((await section()).getByRole('button', { name: 'Change address' })).toBeTruthy();
    expect(requestsTo(fetchMock, 'POST /api/auth/me/email')).toHaveLength(0);
  });

  it('when a new address and the password are sent, then the form closes and the page says a link is waiting at the new address', async () => {
    const { fetchMock, u } = open('/settings', { 'POST /api/auth/me/email': jsonResponse(202, WAITING) });
    await u.click(await (await section()).findByRole('button', { name: 'Change address' }));
    const form = within(screen.getByRole('form', { name: 'Change sign-in address' }));
    await u.type(form.getByLabelText('New address'), NEW);
    await u.type(form.getByLabelText('Your password'), 'cold tyres warm coffee');
    await u.click(form.getByRole('button', { name: 'Send the link' }));

    expect(await (await section()).findByText(/A link was sent to/)).toBeTruthy();
    expect(screen.queryByRole('form', { name: 'Change sign-in address' })).toBeNull();
    expect(requestsTo(fetchMock, 'POST /api/auth/me/email')[0]?.body).toEqual({ newEmail: NEW, password: 'cold tyres warm coffee' });
  });

  it('when the server says another account has the address, then the new-address field says so', async () => {
    const { u } = open('/settings', {
      'POST /api/auth/me/email': errorResponse(409, 'conflict', 'An account with this e-mail already exists.', { newEmail: ['An account with this e-mail already exists'] }),
    });
    await u.click(await (await section()).findByRole('button', { name: 'Change address' }));
    const form = within(screen.getByRole('form', { name: 'Change sign-in address' }));
    await u.type(form.getByLabelText('New address'), NEW);
    await u.type(form.getByLabelText('Your password'), 'cold tyres warm coffee');
    await u.click(form.getByRole('button', { name: 'Send the link' }));
    expect(await form.findByText('An account with this e-mail already exists')).toBeTruthy();
    expect(form.getByLabelText('New address').getAttribute('aria-invalid')).toBe('true');
  });
});

describe('the link from the new address', () => {
  it('when it is opened signed in, then it is sent once, leaves the address bar, and the page shows the new address', async () => {
    const { fetchMock, router } = open('/settings?email-link=abcdefghijklmnopqrstuvwxyz0123456789ABCDEFG', {
      'POST /api/auth/me/email/confirm': jsonResponse(200, { user: { ...ME, email: NEW } }),
    });
    expect(await screen.findByText(`Done: you now sign in with ${NEW}.`)).toBeTruthy();
    expect((await section()).getByText(/You sign in with/).textContent).toBe(`You sign in with ${NEW}.`);
    expect(requestsTo(fetchMock, 'POST /api/auth/me/email/confirm').map((r) => r.body)).toEqual([{ token: 'abcdefghijklmnopqrstuvwxyz0123456789ABCDEFG' }]);
    await waitFor(() => expect(router.state.location.search).toBe(''));
  });

  it('when the server refuses it, then its words show and the address stays', async () => {
    const refusal = 'This link has expired, was already used, or was sent for another account. Ask for a new one here.';
    open('/settings?email-link=abcdefghijklmnopqrstuvwxyz0123456789ABCDEFG', {
      'POST /api/auth/me/email/confirm': errorResponse(400, 'validation_failed', refusal, { token: [refusal] }),
    });
    expect(await screen.findByText(refusal)).toBeTruthy();
    expect((await section()).getByText(/You sign in with/).textContent).toBe(`You sign in with ${ME.email}.`);
  });
});
