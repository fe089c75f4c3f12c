// @vitest-environment jsdom
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { InvitationPreview } from '../../../../shared/collab/invitation.schema';
import { CSRF_TOKEN, errorResponse, jsonResponse, NOBODY_SIGNED_IN, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { list, user } from '../../fixtures/season';

const TOKEN = 'q7Yb2mKx0PzR4sVt8wNc1dLh6jGf3eAu9oIy5rTk_Q';
const PAGE = `/invitations/${TOKEN}`;
const TEAM_ID = '7e111111-1111-4111-8111-111111111111';

const PREVIEW: InvitationPreview = {
  kind: 'team',
  name: 'Harrow Flats Sprint Club',
  email: 'maren@example.test',
  asAdmin: false,
  invitedBy: 'Ines Okafor',
  expiresAt: '2099-06-20T10:00:00.000Z',
  state: 'open',
};

setUpAppTests([
  () => import('@/app/routes/account/invitation'),
  () => import('@/app/routes/teams/team'),
  () => import('@/app/routes/sign-in'),
]);

describe('invitation page', () => {
  it('when nobody is signed in, then it says who invites whom to what, and sign-in and registration come back here', async () => {
    const fetchMock = stubFetch({
      'GET /api/auth/session': NOBODY_SIGNED_IN,
      [`GET /api/invitations/${TOKEN}`]: jsonResponse(200, PREVIEW),
    });
    renderApp(PAGE);

    expect(await screen.findByText('Ines Okafor invites maren@example.test to join Harrow Flats Sprint Club as a member.')).toBeTruthy();
    const next = encodeURIComponent(PAGE);
    expect(screen.getByRole('link', { name: 'Sign in to accept' }).getAttribute('href')).toBe(`/sign-in?next=${next}`);
    expect(screen.getByRole('link', { name: 'Create an account' }).getAttribute('href')).toBe(`/register?next=${next}`);
    expect(screen.queryByRole('button', { name: /^Join/ })).toBeNull();
    expect(requestsTo(fetchMock, `POST /api/invitations/${TOKEN}/accept`)).toHaveLength(0);
  });

  it('when the invited person is signed in and joins, then the invitation is accepted and the team page opens', async () => {
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET /api/invitations/${TOKEN}`]: jsonResponse(200, PREVIEW),
      [`POST /api/invitations/${TOKEN}/accept`]: jsonResponse(200, { kind: 'team', id: TEAM_ID, name: PREVIEW.name }),
      [`GET /api/teams/${TEAM_ID}`]: jsonResponse(200, {
        id: TEAM_ID,
        name: PREVIEW.name,
        isCaptain: false,
        members: [{ id: user().id, displayName: 'Maren Holt', isCaptain: false }],
        entries: [],
        pendingInvitations: [],
      }),
      'GET /api/cars': list([]),
    });
    const { router } = renderApp(PAGE);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Join Harrow Flats Sprint Club' }));

    await waitFor(() => expect(router.state.location.pathname).toBe(`/teams/${TEAM_ID}`));
    const [accept] = requestsTo(fetchMock, `POST /api/invitations/${TOKEN}/accept`);
    expect(accept?.headers.get('X-CSRF-Token')).toBe(CSRF_TOKEN);
    expect(await screen.findByRole('heading', { level: 1, name: PREVIEW.name })).toBeTruthy();
  });

  it('when a shop invitation is accepted, then the shop page opens', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET /api/invitations/${TOKEN}`]: jsonResponse(200, { ...PREVIEW, kind: 'shop', name: 'Apex Alignment', asAdmin: true }),
      [`POST /api/invitations/${TOKEN}/accept`]: jsonResponse(200, { kind: 'shop', id: 'a5555555-5555-4555-8555-555555555555', name: 'Apex Alignment' }),
    });
    const { router } = renderApp(PAGE);
    const u = userEvent.setup();

    expect(await screen.findByText(/to join Apex Alignment as a shop admin\./)).toBeTruthy();
    await u.click(screen.getByRole('button', { name: 'Join Apex Alignment' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/shop'));
  });

  it('when someone else is signed in, then the page says the invitation is for another address and offers no Join', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: { ...user(), email: 'tomas@example.test' } }),
      [`GET /api/invitations/${TOKEN}`]: jsonResponse(200, PREVIEW),
    });
    renderApp(PAGE);

    expect(await screen.findByText(/You are signed in as tomas@example.test, but this invitation is for maren@example.test/)).toBeTruthy();
    expect(screen.queryByRole('button', { name: /^Join/ })).toBeNull();
  });

  it('when the invitation has expired or was used, then the page says so plainly and offers no Join', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET /api/invitations/${TOKEN}`]: jsonResponse(200, { ...PREVIEW, state: 'expired', expiresAt: '2026-06-01T10:00:00.000Z' }),
    });
    renderApp(PAGE);

    expect(await screen.findByText(/This invitation expired on .+\. Invitations work for a week; ask Ines Okafor for a new one\./)).toBeTruthy();
    expect(screen.queryByRole('button', { name: /^Join/ })).toBeNull();
    cleanup();

    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET /api/invitations/${TOKEN}`]: jsonResponse(200, { ...PREVIEW, state: 'used' }),
    });
    renderApp(PAGE);
    expect(await screen.findByText(/This invitation has already been used/)).toBeTruthy();
    expect(screen.queryByRole('button', { name: /^Join/ })).toBeNull();
  });

  it('when the server refuses the join (the address does not match), then its message is shown and the page stays', async () => {
    const message = 'This invitation is for maren@example.test. Sign in with that address to accept it.';
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      [`GET /api/invitations/${TOKEN}`]: jsonResponse(200, PREVIEW),
      [`POST /api/invitations/${TOKEN}/accept`]: errorResponse(403, 'forbidden', message),
    });
    const { router } = renderApp(PAGE);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Join Harrow Flats Sprint Club' }));

    expect(await screen.findByText(message)).toBeTruthy();
    expect(router.state.location.pathname).toBe(PAGE);
  });

  it('when the link names no invitation, then the page says the link does not work', async () => {
    stubFetch({
      'GET /api/auth/session': NOBODY_SIGNED_IN,
      [`GET /api/invitations/${TOKEN}`]: errorResponse(404, 'not_found', 'That invitation was not found.'),
    });
    renderApp(PAGE);

    expect(await screen.findByText(/This invitation link does not work/)).toBeTruthy();
  });
});
