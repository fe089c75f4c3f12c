// @vitest-environment jsdom
import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import { errorResponse, jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { user } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/settings')]);

const CURRENT = 'cold tyres warm coffee';
const NEW = 'copper kettle under the grandstand';

async function openPasswordSection(answer: Response) {
  const fetchMock = stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user(METRIC_PREFERENCES) }),
    'GET /api/auth/me/sessions': jsonResponse(200, { items: [] }),
    'POST /api/auth/me/password': answer,
  });
  renderApp('/settings');
  const form = await screen.findByRole('form', { name: 'Change password' });
  return { fetchMock, form: within(form), u: userEvent.setup() };
}

describe('changing the password in settings', () => {
  it('when both passwords are typed and saved, then both are sent, the fields empty and the page says other devices are signed out', async () => {
    const { fetchMock, form, u } = await openPasswordSection(new Response(null, { status: 204 }));
    await u.type(form.getByLabelText('Current password'), CURRENT);
    await u.type(form.getByLabelText('New password'), NEW);
    await u.click(form.getByRole('button', { name: 'Change password' }));

    expect((await form.findByRole('status')).textContent).toMatch(/Password changed\. Every other device .* signed out/);
    expect(requestsTo(fetchMock, 'POST /api/auth/me/password')[0]?.body).toEqual({ currentPassword: CURRENT, newPassword: NEW });
    expect((form.getByLabelText('Current password') as HTMLInputElement).value).toBe('');
    expect((form.getByLabelText('New password') as HTMLInputElement).value).toBe('');
    // Password managers learn which account it was for, and which field is which.
    expect((document.querySelector('input[autocomplete="username"]') as HTMLInputElement).value).toBe(user(METRIC_PREFERENCES).email);
    expect(form.getByLabelText('Current password').getAttribute('autocomplete')).toBe('current-password');
    expect(form.getByLabelText('New password').getAttribute('autocomplete')).toBe('new-password');
  });

  it('when a new password is typed, then the meter under it says how strong it is and what makes it weak', async () => {
    const { form, u } = await openPasswordSection(new Response(null, { status: 204 }));
    await u.type(form.getByLabelText('New password'), 'aaaaaaaaaaaa');
    expect(await form.findByText('Strength: Very weak.', {}, { timeout: 5000 })).toBeTruthy();
    expect(form.getByText(/Repeated characters like "aaa" are easy to guess/)).toBeTruthy();
    await u.clear(form.getByLabelText('New password'));
    expect(form.queryByText(/Strength:/)).toBeNull();
    await u.type(form.getByLabelText('New password'), NEW);
    expect(await form.findByText('Strength: Very strong.')).toBeTruthy();
  });

  it('when the server says the current password is wrong, then that field says so and keeps focus for a retry', async () => {
    const { form, u } = await openPasswordSection(
      errorResponse(400, 'validation_failed', 'That is not your current password.', { currentPassword: ['That is not your current password'] }),
    );
    await u.type(form.getByLabelText('Current password'), 'not it at all');
    await u.type(form.getByLabelText('New password'), NEW);
    await u.click(form.getByRole('button', { name: 'Change password' }));

    expect(await form.findByText('That is not your current password')).toBeTruthy();
    expect(form.getByLabelText('Current password').getAttribute('aria-invalid')).toBe('true');
    expect(document.activeElement).toBe(form.getByLabelText('Current password'));
    expect(form.queryByRole('status')).toBeNull();
  });

  it('when the new password breaks the rules or repeats the current one, then its field says so and nothing is sent', async () => {
    const { fetchMock, form, u } = await openPasswordSection(new Response(null, { status: 204 }));
    await u.type(form.getByLabelText('Current password'), CURRENT);
    await u.type(form.getByLabelText('New password'), 'short');
    await u.click(form.getByRole('button', { name: 'Change password' }));
    expect(await form.findByText('Use at least 12 characters')).toBeTruthy();

    await u.clear(form.getByLabelText('New password'));
    await u.type(form.getByLabelText('New password'), CURRENT);
    await u.click(form.getByRole('button', { name: 'Change password' }));
    expect(await form.findByText('Choose a password other than your current one')).toBeTruthy();
    expect(requestsTo(fetchMock, 'POST /api/auth/me/password')).toHaveLength(0);
  });

  it('when too many wrong tries locked the account, then the server\'s words show above the button', async () => {
    const { form, u } = await openPasswordSection(errorResponse(429, 'rate_limited', 'Too many attempts. Try again in 15 min.'));
    await u.type(form.getByLabelText('Current password'), CURRENT);
    await u.type(form.getByLabelText('New password'), NEW);
    await u.click(form.getByRole('button', { name: 'Change password' }));
    expect(await form.findByText('Too many attempts. Try again in 15 min.')).toBeTruthy();
  });
});
