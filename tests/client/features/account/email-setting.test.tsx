// @vitest-environment jsdom
import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { user } from '../../fixtures/season';

const withEmails = (on: boolean) => ({ ...user(), preferences: { ...user().preferences, emailNotifications: on } });

setUpAppTests([() => import('@/app/routes/settings')]);

describe('e-mail setting', () => {
  it('when the switch is turned off, then only that preference is sent and the switch shows the saved answer', async () => {
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: withEmails(true) }),
      'PATCH /api/auth/me/preferences': jsonResponse(200, { user: withEmails(false) }),
    });
    renderApp('/settings');
    const u = userEvent.setup();

    const toggle = await screen.findByRole('switch', { name: /E-mail me about comments and suggestions/ });
    expect(toggle.getAttribute('aria-checked')).toBe('true');
    await u.click(toggle);

    await waitFor(() => expect(toggle.getAttribute('aria-checked')).toBe('false'));
    expect(requestsTo(fetchMock, 'PATCH /api/auth/me/preferences')[0]?.body).toEqual({ emailNotifications: false });
  });

  it('when there is no connection, then the switch stays as saved and says nothing changed', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: withEmails(false) }),
      'PATCH /api/auth/me/preferences': () => Promise.reject(new TypeError('Failed to fetch')),
    });
    renderApp('/settings');
    const u = userEvent.setup();

    const toggle = await screen.findByRole('switch', { name: /E-mail me about comments and suggestions/ });
    await u.click(toggle);

    expect(await screen.findByText(/No connection: the e-mail setting was not changed/)).toBeTruthy();
    expect(toggle.getAttribute('aria-checked')).toBe('false');
  });
});
