// @vitest-environment jsdom
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { PASSWORD_RESET_REQUESTED_MESSAGE } from '../../../../shared/collab/invitation.schema';
import { dropCsrfToken } from '@/lib/api-client';
import { CSRF_TOKEN, errorResponse, jsonResponse, NOBODY_SIGNED_IN, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';

const TOKEN = 'Zr8kQ2vN5xLp0mT7yB3cW9dF1gH4jK6s_A';
const NEW_PASSWORD = 'gravel kettle orbit lantern';

setUpAppTests([
  () => import('@/app/routes/account/forgot-password'),
  () => import('@/app/routes/account/reset-password'),
  () => import('@/app/routes/sign-in'),
]);

describe('forgot password', () => {
  it('when an address is sent, then the page shows the one message whatever the server found, and sends the address it was given', async () => {
    for (const answer of [
      jsonResponse(202, { message: PASSWORD_RESET_REQUESTED_MESSAGE }),
      // A server that says more must not change what the page says.
      jsonResponse(202, { message: 'We found your account and e-mailed you.' }),
    ]) {
      const fetchMock = stubFetch({ 'GET /api/auth/session': NOBODY_SIGNED_IN, 'POST /api/auth/password-reset': answer });
      renderApp('/forgot-password');
      const u = userEvent.setup();

      await u.type(await screen.findByLabelText('E-mail'), ' Maren@Example.test ');
      await u.click(screen.getByRole('button', { name: 'Send me a link' }));

      expect(await screen.findByText(PASSWORD_RESET_REQUESTED_MESSAGE)).toBeTruthy();
      expect(screen.queryByText(/found your account/)).toBeNull();
      const [sent] = requestsTo(fetchMock, 'POST /api/auth/password-reset');
      expect(sent?.body).toEqual({ email: 'maren@example.test' });
      expect(sent?.headers.get('X-CSRF-Token')).toBe(CSRF_TOKEN);
      cleanup();
      vi.unstubAllGlobals();
      dropCsrfToken();
    }
  });

  it('when the sign-in page opens, then it links to the forgot-password page', async () => {
    stubFetch({ 'GET /api/auth/session': NOBODY_SIGNED_IN });
    renderApp('/sign-in');
    expect((await screen.findByRole('link', { name: 'Forgot your password?' })).getAttribute('href')).toBe('/forgot-password');
  });
});

describe('reset password', () => {
  it('when the link has expired, then the page says so beside a way to ask for a new link', async () => {
    const message = 'This reset link has expired or was already used. Ask for a new one.';
    const fetchMock = stubFetch({
      'GET /api/auth/session': NOBODY_SIGNED_IN,
      'POST /api/auth/password-reset/confirm': errorResponse(400, 'validation_failed', message, { token: [message] }),
    });
    renderApp(`/reset-password?token=${TOKEN}`);
    const u = userEvent.setup();

    await u.type(await screen.findByLabelText('New password'), NEW_PASSWORD);
    await u.click(screen.getByRole('button', { name: 'Save the new password' }));

    const alert = await screen.findByText(message);
    expect(alert.closest('[role="alert"]')).toBeTruthy();
    expect(screen.getAllByText(message)).toHaveLength(1);
    expect(screen.getByRole('link', { name: 'Ask for a new link' }).getAttribute('href')).toBe('/forgot-password');
    expect(requestsTo(fetchMock, 'POST /api/auth/password-reset/confirm')[0]?.body).toEqual({ token: TOKEN, password: NEW_PASSWORD });
  });

  it('when the new password breaks the registration rules, then the field says so and nothing is sent', async () => {
    const fetchMock = stubFetch({ 'GET /api/auth/session': NOBODY_SIGNED_IN });
    renderApp(`/reset-password?token=${TOKEN}`);
    const u = userEvent.setup();

    const field = await screen.findByLabelText('New password');
    await u.type(field, 'short');
    await u.click(screen.getByRole('button', { name: 'Save the new password' }));

    expect(await screen.findByText('Use at least 12 characters')).toBeTruthy();
    expect(field.getAttribute('aria-invalid')).toBe('true');
    expect(requestsTo(fetchMock, 'POST /api/auth/password-reset/confirm')).toHaveLength(0);
  });

  it('when the new password is saved, then the sign-in page opens with a note', async () => {
    stubFetch({ 'GET /api/auth/session': NOBODY_SIGNED_IN, 'POST /api/auth/password-reset/confirm': jsonResponse(204) });
    const { router } = renderApp(`/reset-password?token=${TOKEN}`);
    const u = userEvent.setup();

    await u.type(await screen.findByLabelText('New password'), NEW_PASSWORD);
    await u.click(screen.getByRole('button', { name: 'Save the new password' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(await screen.findByText('Your password is changed. Sign in with the new one.')).toBeTruthy();
  });

  it('when the address has no token, then the page says the link is incomplete and offers a new one', async () => {
    stubFetch({ 'GET /api/auth/session': NOBODY_SIGNED_IN });
    renderApp('/reset-password');

    expect(await screen.findByText(/This link is incomplete/)).toBeTruthy();
    expect(screen.queryByLabelText('New password')).toBeNull();
    expect(screen.getByRole('link', { name: 'Ask for a new link' }).getAttribute('href')).toBe('/forgot-password');
  });
});
