// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { focusManager } from '@tanstack/react-query';
import { UNREAD_POLL_MS } from '@/features/notifications/api/get-unread-count';
import { jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { IDS, user } from '../../fixtures/season';
import { COLLAB_IDS, notification, suggestion } from '../../fixtures/collab';

setUpAppTests([() => import('@/app/routes/notifications'), () => import('@/app/routes/settings'), () => import('@/app/shell-extras')]);

const bell = () => screen.findByRole('link', { name: /notification/i });

describe('notification bell', () => {
  it('when three are unread, then the bell is named "3 unread notifications" and shows the count', async () => {
    stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      'GET /api/notifications/unread-count': jsonResponse(200, { unread: 3 }),
    });
    renderApp('/settings');

    await waitFor(async () => expect((await bell()).getAttribute('aria-label')).toBe('3 unread notifications'));
    expect((await bell()).textContent).toBe('3');
    expect((await bell()).getAttribute('href')).toBe('/notifications');
  });

  it('when nothing is unread, then no count shows and the bell is simply "Notifications"', async () => {
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      'GET /api/notifications/unread-count': jsonResponse(200, { unread: 0 }),
    });
    renderApp('/settings');

    await waitFor(() => expect(requestsTo(fetchMock, 'GET /api/notifications/unread-count').length).toBeGreaterThan(0));
    const link = await bell();
    await waitFor(() => expect(link.getAttribute('aria-label')).toBe('Notifications'));
    expect(link.textContent).toBe('');
    expect(screen.queryByText('0')).toBeNull();
  });

  it('when the bell cannot reach the server, then it stays quiet: no count and no toast', async () => {
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      'GET /api/notifications/unread-count': () => Promise.reject(new TypeError('Failed to fetch')),
    });
    renderApp('/settings');

    await waitFor(() => expect(requestsTo(fetchMock, 'GET /api/notifications/unread-count').length).toBeGreaterThan(0));
    expect((await bell()).getAttribute('aria-label')).toBe('Notifications');
    expect(screen.queryByText(/No connection/)).toBeNull();
  });

  it('when a minute passes with the app in view, then the bell asks again; while the app is hidden, it does not', async () => {
    vi.useFakeTimers({ shouldAdvanceTime: true, toFake: ['setInterval', 'clearInterval', 'setTimeout', 'clearTimeout'] });
    try {
      let unread = 1;
      const fetchMock = stubFetch({
        'GET /api/auth/session': jsonResponse(200, { user: user() }),
        'GET /api/notifications/unread-count': () => jsonResponse(200, { unread }),
      });
      renderApp('/settings');
      await waitFor(async () => expect((await bell()).getAttribute('aria-label')).toBe('1 unread notification'));
      // Let the start-up settle (the app refreshes every query once its saved cache is restored).
      await vi.advanceTimersByTimeAsync(1000);
      const asked = () => requestsTo(fetchMock, 'GET /api/notifications/unread-count').length;
      const before = asked();
      unread = 4;

      // Hidden (another app in front): the minute passes without a request.
      focusManager.setFocused(false);
      await vi.advanceTimersByTimeAsync(UNREAD_POLL_MS + 1000);
      expect(asked()).toBe(before);

      // In view again: it asks at once…
      focusManager.setFocused(true);
      await waitFor(() => expect(asked()).toBe(before + 1));
      await waitFor(async () => expect((await bell()).getAttribute('aria-label')).toBe('4 unread notifications'));
      // …and again a minute later.
      await vi.advanceTimersByTimeAsync(UNREAD_POLL_MS + 1000);
      await waitFor(() => expect(asked()).toBe(before + 2));
    } finally {
      focusManager.setFocused(undefined);
      vi.useRealTimers();
    }
  });
});

describe('notifications page', () => {
  const items = [
    notification({
      id: COLLAB_IDS.notification1,
      kind: 'suggestion',
      summary: 'Dusty Okonjo (Kettle Lane Chassis Works) suggested a setup change for Grey roadster',
      link: `/suggestions/${COLLAB_IDS.suggestion}`,
      createdAt: new Date(Date.now() - 2 * 3600_000).toISOString(),
    }),
    notification({
      id: COLLAB_IDS.notification2,
      summary: 'Dusty Okonjo commented on run 1',
      link: `/cars/${IDS.car}`,
      readAt: '2026-06-07T11:00:00.000Z',
    }),
  ];

  it('when an unread one is opened, then it is marked read on the server, the bell drops, and the app goes to its link', async () => {
    let unread = 1;
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      'GET /api/notifications': () => jsonResponse(200, { items, count: 2, unread }),
      'GET /api/notifications/unread-count': () => jsonResponse(200, { unread }),
      'POST /api/notifications/read': () => {
        unread = 0;
        return jsonResponse(200, { unread: 0, updated: 1 });
      },
      [`GET /api/suggestions/${COLLAB_IDS.suggestion}`]: jsonResponse(200, suggestion()),
      [`GET /api/cars/${IDS.car}`]: () => Promise.reject(new TypeError('Failed to fetch')),
    });
    const { router } = renderApp('/notifications');
    const u = userEvent.setup();

    const list = await screen.findByRole('list', { name: 'Notifications, newest first' });
    const first = within(list).getByRole('button', { name: /suggested a setup change/ });
    // Unread is marked in words, not by colour alone; the time is relative.
    expect(first.textContent).toContain('Unread:');
    // date-fns formatDistance wording (its documented table: 1.5 h to 23.5 h reads "about N hours").
    expect(first.textContent).toContain('about 2 hours ago');
    expect(within(list).getByRole('button', { name: /commented on run 1/ }).textContent).not.toContain('Unread');
    await waitFor(async () => expect((await bell()).getAttribute('aria-label')).toBe('1 unread notification'));

    await u.click(first);

    await waitFor(() => expect(router.state.location.pathname).toBe(`/suggestions/${COLLAB_IDS.suggestion}`));
    await waitFor(() => expect(requestsTo(fetchMock, 'POST /api/notifications/read')).toHaveLength(1));
    expect(requestsTo(fetchMock, 'POST /api/notifications/read')[0]?.body).toEqual({ ids: [COLLAB_IDS.notification1] });
    await waitFor(async () => expect((await bell()).getAttribute('aria-label')).toBe('Notifications'));
  });

  it('when "Mark all read" is pressed, then the server is asked to mark all, and the list says so', async () => {
    let unread = 1;
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      'GET /api/notifications': () =>
        jsonResponse(200, { items: unread ? items : items.map((n) => ({ ...n, readAt: '2026-06-08T12:00:00.000Z' })), count: 2, unread }),
      'GET /api/notifications/unread-count': () => jsonResponse(200, { unread }),
      'POST /api/notifications/read': () => {
        unread = 0;
        return jsonResponse(200, { unread: 0, updated: 1 });
      },
    });
    renderApp('/notifications');
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Mark all read' }));

    expect(await screen.findByText('All read.')).toBeTruthy();
    expect(requestsTo(fetchMock, 'POST /api/notifications/read')[0]?.body).toEqual({ all: true });
    expect(screen.queryByRole('button', { name: 'Mark all read' })).toBeNull();
    expect(screen.queryByText(/Unread:/)).toBeNull();
  });

  it('when a notification carries a link outside the app, then opening it marks it read but goes nowhere', async () => {
    const outside = notification({ id: COLLAB_IDS.notification1, summary: 'Odd one', link: '//elsewhere.example/steal' });
    const fetchMock = stubFetch({
      'GET /api/auth/session': jsonResponse(200, { user: user() }),
      'GET /api/notifications': jsonResponse(200, { items: [outside], count: 1, unread: 1 }),
      'POST /api/notifications/read': jsonResponse(200, { unread: 0, updated: 1 }),
    });
    const { router } = renderApp('/notifications');
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: /Odd one/ }));

    await waitFor(() => expect(requestsTo(fetchMock, 'POST /api/notifications/read')).toHaveLength(1));
    expect(router.state.location.pathname).toBe('/notifications');
  });
});
