import { METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
// @vitest-environment jsdom
import { cleanup, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { dropCsrfToken } from '@/lib/api-client';
import { RegisterForm } from '@/features/auth/components/register-form';
import { errorResponse, jsonResponse, renderWithQueryClient, requestsTo, stubFetch } from '../../test-utils';

const USER = { id: 'u1', email: 'sam@example.test', displayName: 'Sam', roles: ['driver'], preferences: { units: METRIC_PREFERENCES, emailNotifications: true } };

beforeEach(() => dropCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

async function fillIn(password: string) {
  const user = userEvent.setup();
  await user.type(screen.getByLabelText('Your name'), 'Sam');
  await user.type(screen.getByLabelText('E-mail'), 'sam@example.test');
  await user.type(screen.getByLabelText('Password'), password);
  await user.click(screen.getByRole('button', { name: 'Create account' }));
}

describe('RegisterForm', () => {
  it('when the server refuses the password, then its message appears on the password field', async () => {
    stubFetch({
      'POST /api/auth/register': errorResponse(400, 'validation_failed', 'Check the highlighted fields.', {
        password: ['This password appears in lists of breached passwords; choose another'],
      }),
    });
    renderWithQueryClient(<RegisterForm onSuccess={vi.fn()} />);

    await fillIn('a perfectly long password');

    const message = await screen.findByText('This password appears in lists of breached passwords; choose another');
    const password = screen.getByLabelText('Password');
    expect(password.getAttribute('aria-invalid')).toBe('true');
    expect(password.getAttribute('aria-describedby')).toContain(message.id);
  });

  it('when the e-mail is already registered (409), then the message appears on the e-mail field', async () => {
    stubFetch({
      'POST /api/auth/register': errorResponse(409, 'conflict', 'That account exists.', {
        email: ['An account with this e-mail already exists'],
      }),
    });
    renderWithQueryClient(<RegisterForm onSuccess={vi.fn()} />);

    await fillIn('a perfectly long password');

    const message = await screen.findByText('An account with this e-mail already exists');
    expect(screen.getByLabelText('E-mail').getAttribute('aria-describedby')).toContain(message.id);
    expect(document.activeElement).toBe(screen.getByLabelText('E-mail'));
  });

  it('when the password is too short, then the shared rule is shown and nothing is sent', async () => {
    const fetchMock = stubFetch({});
    renderWithQueryClient(<RegisterForm onSuccess={vi.fn()} />);

    await fillIn('short');

    await screen.findByText('Use at least 12 characters');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('when the details are accepted, then it sends the trimmed input with the CSRF token and reports the new user', async () => {
    const fetchMock = stubFetch({ 'POST /api/auth/register': jsonResponse(201, { user: USER }) });
    const onSuccess = vi.fn();
    renderWithQueryClient(<RegisterForm onSuccess={onSuccess} />);

    await fillIn('a perfectly long password');

    await vi.waitFor(() => expect(onSuccess).toHaveBeenCalled());
    expect(onSuccess.mock.calls[0]?.[0]).toEqual(USER);
    const [sent] = requestsTo(fetchMock, 'POST /api/auth/register');
    expect(sent?.body).toEqual({ displayName: 'Sam', email: 'sam@example.test', password: 'a perfectly long password' });
    expect(sent?.headers.get('X-CSRF-Token')).toBeTruthy();
  });

  it('when the form is shown, then the password rule is visible and tied to the input', () => {
    renderWithQueryClient(<RegisterForm onSuccess={vi.fn()} />);
    const password = screen.getByLabelText('Password');
    const hint = screen.getByText(/12 to 128 characters/);
    expect(password.getAttribute('aria-describedby')).toContain(hint.id);
    expect(password.getAttribute('autocomplete')).toBe('new-password');
    expect(screen.getByLabelText('E-mail').getAttribute('autocomplete')).toBe('email');
    expect(screen.getByLabelText('Your name').getAttribute('autocomplete')).toBe('name');
  });
});
