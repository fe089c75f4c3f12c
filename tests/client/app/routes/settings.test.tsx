// @vitest-environment jsdom
import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { IMPERIAL_PREFERENCES, METRIC_PREFERENCES } from '../../../../shared/calc/units.calc';
import { jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { user } from '../../fixtures/season';

setUpAppTests([() => import('@/app/routes/settings')]);

describe('unit settings', () => {
  it('when Imperial is chosen and saved, then every choosable unit is sent and the app reads the new units', async () => {
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user(METRIC_PREFERENCES) }),
      'GET /api/auth/me/sessions': jsonResponse(200, { items: [] }),
      'PATCH /api/auth/me/preferences': jsonResponse(200, { user: user(IMPERIAL_PREFERENCES) }),
    });
    const { queryClient } = renderApp('/settings');
    const u = userEvent.setup();

    expect(await screen.findByRole('button', { name: 'Imperial' })).toBeTruthy();
    expect(screen.queryByText(/Not saved yet/)).toBeNull();
    await u.click(screen.getByRole('button', { name: 'Imperial' }));
    expect(screen.getByText('For example: 31.9 psi')).toBeTruthy();
    // Chosen is not saved: the form says so beside the button, until it is.
    expect(screen.getByText('Not saved yet: the app keeps showing your old units until you save.')).toBeTruthy();
    await u.click(screen.getByRole('button', { name: 'Save units' }));

    expect(await screen.findByText(/Units saved/)).toBeTruthy();
    expect(screen.queryByText(/Not saved yet/)).toBeNull();
    expect(requestsTo(fetchMock, 'PATCH /api/auth/me/preferences')[0]?.body).toEqual({
      units: { pressure: 'psi', length: 'in', treadDepth: 'in32', springRate: 'lbf/in', mass: 'lb', temperature: 'degF' },
    });
    expect(queryClient.getQueryData<ReturnType<typeof user>>(['auth', 'me'])?.preferences.units.pressure).toBe('psi');
  });

  it('when one quantity is changed on its own, then only that choice differs from what was saved', async () => {
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user(METRIC_PREFERENCES) }),
      'GET /api/auth/me/sessions': jsonResponse(200, { items: [] }),
      'PATCH /api/auth/me/preferences': jsonResponse(200, { user: user({ ...METRIC_PREFERENCES, pressure: 'bar' }) }),
    });
    renderApp('/settings');
    const u = userEvent.setup();

    const pressure = await screen.findByRole('group', { name: 'Tyre pressure' });
    await u.click(screen.getAllByRole('radio', { name: /bar/ })[0]!);
    expect(pressure.textContent).toContain('bar');
    await u.click(screen.getByRole('button', { name: 'Save units' }));

    await screen.findByText(/Units saved/);
    expect(requestsTo(fetchMock, 'PATCH /api/auth/me/preferences')[0]?.body).toEqual({
      units: { pressure: 'bar', length: 'mm', treadDepth: 'mm', springRate: 'N/mm', mass: 'kg', temperature: 'degC' },
    });
  });

  it('when there is no connection, then the form says the units were not saved and keeps the choice', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user(METRIC_PREFERENCES) }),
      'GET /api/auth/me/sessions': jsonResponse(200, { items: [] }),
      'PATCH /api/auth/me/preferences': () => Promise.reject(new TypeError('Failed to fetch')),
    });
    renderApp('/settings');
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Imperial' }));
    await u.click(screen.getByRole('button', { name: 'Save units' }));

    expect(await screen.findByText(/No connection: your units were not saved/)).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Imperial' }).getAttribute('aria-pressed')).toBe('true');
    expect((screen.getByRole('radio', { name: 'psi' }) as HTMLInputElement).checked).toBe(true);
  });
});
