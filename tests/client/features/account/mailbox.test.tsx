// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { MailboxMessage } from '../../../../shared/collab/mailbox.schema';
import { errorResponse, jsonResponse, NOBODY_SIGNED_IN, renderApp, requestsTo, setUpAppTests, stubFetch } from '../../test-utils';
import { list } from '../../fixtures/season';

const ORIGIN = window.location.origin;

const RESET: MailboxMessage = {
  id: 'm1',
  date: '2026-06-12T09:40:00.000Z',
  from: 'Scrubline <no-reply@scrubline.test>',
  to: ['maren@example.test'],
  subject: 'Choose a new Scrubline password',
  text: `Hello Maren,\n\nChoose a new password here: ${ORIGIN}/reset-password?token=abc123.\nThe link works for one hour.\n\nNot you? Read https://elsewhere.example/phish and ignore it.`,
  html: '<p>Hello Maren, <a href="/reset-password?token=abc123">choose a new password</a>.</p><script>parent.alert(1)</script>',
  listUnsubscribe: null,
};

const INVITE: MailboxMessage = {
  id: 'm2',
  date: '2026-06-12T10:15:00.000Z',
  from: 'Scrubline <no-reply@scrubline.test>',
  to: ['tomas@example.test'],
  subject: 'Ines Okafor invites you to Harrow Flats Sprint Club',
  text: 'Join the team.',
  html: '',
  listUnsubscribe: null,
};

setUpAppTests([() => import('@/app/routes/dev/mailbox')]);

describe('development mailbox', () => {
  it('when e-mails were caught, then they are listed newest first and the chosen one shows its text, with only this app’s links clickable', async () => {
    stubFetch({ 'GET /api/auth/session': NOBODY_SIGNED_IN, 'GET /api/dev/mailbox': list([RESET, INVITE]) });
    renderApp('/dev/mailbox');
    const u = userEvent.setup();

    const listed = await screen.findByRole('list', { name: 'E-mails, newest first' });
    const items = within(listed).getAllByRole('button');
    expect(items.map((b) => within(b).getByText(/^To /).textContent)).toEqual(['To tomas@example.test', 'To maren@example.test']);

    await u.click(within(listed).getByRole('button', { name: /Choose a new Scrubline password/ }));

    const message = screen.getByRole('article', { name: 'E-mail: Choose a new Scrubline password' });
    expect(within(message).getByText(/The link works for one hour\./)).toBeTruthy();
    const links = within(message).getAllByRole('link');
    expect(links.map((a) => a.getAttribute('href'))).toEqual(['/reset-password?token=abc123']);
    expect(links[0]?.textContent).toBe(`${ORIGIN}/reset-password?token=abc123`);
    expect(within(message).getByText(/https:\/\/elsewhere\.example\/phish/).tagName).not.toBe('A');

    const frame = within(message).getByTitle('HTML part of “Choose a new Scrubline password”') as HTMLIFrameElement;
    expect(frame.tagName).toBe('IFRAME');
    expect(frame.getAttribute('sandbox')).toBe('');
    expect(frame.getAttribute('srcdoc')).toBe(RESET.html);
    // The HTML never enters the page itself.
    expect(document.querySelector('main script')).toBeNull();
  });

  it('when the mailbox is emptied, then the server is asked to delete every message and the list is read again', async () => {
    let emptied = false;
    const fetchMock = stubFetch({
      'GET /api/auth/session': NOBODY_SIGNED_IN,
      'GET /api/dev/mailbox': () => list(emptied ? [] : [RESET]),
      'DELETE /api/dev/mailbox': () => {
        emptied = true;
        return jsonResponse(204);
      },
    });
    renderApp('/dev/mailbox');
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Empty the mailbox' }));

    expect(await screen.findByText(/No e-mails caught yet/)).toBeTruthy();
    expect(requestsTo(fetchMock, 'DELETE /api/dev/mailbox')).toHaveLength(1);
  });

  it('when the server has no mailbox (404), then the page says it exists only in development', async () => {
    stubFetch({ 'GET /api/auth/session': NOBODY_SIGNED_IN, 'GET /api/dev/mailbox': errorResponse(404, 'not_found', 'Not found.') });
    renderApp('/dev/mailbox');

    expect(await screen.findByText('The mailbox is only available in development.')).toBeTruthy();
    await waitFor(() => expect(screen.queryByRole('button', { name: 'Empty the mailbox' })).toBeNull());
  });
});
