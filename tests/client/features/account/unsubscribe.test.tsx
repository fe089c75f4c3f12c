// @vitest-environment jsdom
import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { CSRF_TOKEN, errorResponse, jsonResponse, NOBODY_SIGNED_IN, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';

const TOKEN = '9b0c1d2e-3f40-4152-8637-48596a7b8c9d';

setUpAppTests([() => import('@/app/routes/account/unsubscribe')]);

describe('unsubscribe page', () => {
  it('when the button is pressed, then the token is posted with the CSRF token and the page says how to turn e-mails back on', async () => {
    const fetchMock = stubFetch({ 'GET /api/auth/session': NOBODY_SIGNED_IN, [`POST /api/unsubscribe/${TOKEN}`]: jsonResponse(204) });
    renderApp(`/unsubscribe/${TOKEN}`);
    const u = userEvent.setup();

    expect(requestsTo(fetchMock, `POST /api/unsubscribe/${TOKEN}`)).toHaveLength(0);
    await u.click(await screen.findByRole('button', { name: 'Stop notification e-mails' }));

    expect(await screen.findByText('Done: Scrubline sends you no more notification e-mails.')).toBeTruthy();
    expect(screen.getByText(/open Settings and switch on “E-mail me about comments and suggestions”/)).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Open Settings' }).getAttribute('href')).toBe('/settings');
    const [sent] = requestsTo(fetchMock, `POST /api/unsubscribe/${TOKEN}`);
    expect(sent?.headers.get('X-CSRF-Token')).toBe(CSRF_TOKEN);
  });

  it('when the link names nobody, then the page says the link does not work and where else to turn e-mails off', async () => {
    stubFetch({
      'GET /api/auth/session': NOBODY_SIGNED_IN,
      [`POST /api/unsubscribe/${TOKEN}`]: errorResponse(404, 'not_found', 'That unsubscribe link was not found.'),
    });
    renderApp(`/unsubscribe/${TOKEN}`);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Stop notification e-mails' }));

    expect(await screen.findByText(/This link does not work/)).toBeTruthy();
    expect(screen.queryByText(/Done:/)).toBeNull();
  });
});
