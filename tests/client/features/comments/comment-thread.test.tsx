// @vitest-environment jsdom
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { CommentTarget } from '../../../../shared/collab/comment.schema';
import { dropCsrfToken } from '@/lib/api-client';
import { clearToasts } from '@/lib/toast-store';
import { CommentThread } from '@/features/comments/components/comment-thread';
import { errorResponse, jsonResponse, renderWithQueryClient, requestsTo, stubFetch } from '../../test-utils';
import { IDS, list, UUID } from '../../fixtures/season';
import { COLLAB_IDS, comment, SHOP_NAME } from '../../fixtures/collab';

const TARGET: CommentTarget = { type: 'run', id: IDS.run1 };
const THREAD = `GET /api/comments?type=run&id=${IDS.run1}`;

beforeEach(() => dropCsrfToken());
afterEach(() => {
  cleanup();
  clearToasts();
  vi.unstubAllGlobals();
});

const mine = comment({ id: COLLAB_IDS.commentMaren, body: 'Felt loose at the slalom exit.', mine: true, version: 2, editedAt: '2026-06-07T10:05:00.000Z' });
const dustys = comment({
  id: COLLAB_IDS.commentDusty,
  body: 'Try one click stiffer on the rear rebound.',
  author: { id: COLLAB_IDS.dusty, displayName: 'Dusty Okonjo' },
  shop: { id: COLLAB_IDS.shop, name: SHOP_NAME },
  createdAt: '2026-06-07T11:00:00.000Z',
});

const items = () => within(screen.getByRole('list', { name: 'Comments on run 1, oldest first' })).getAllByRole('listitem');

describe('comment thread', () => {
  it('when the thread loads, then comments show oldest first, staff with their shop beside the name, edits marked', async () => {
    stubFetch({ [THREAD]: list([mine, dustys]) });
    renderWithQueryClient(<CommentThread target={TARGET} label="Comments on run 1" />);

    await screen.findByText('Felt loose at the slalom exit.');
    const [first, second] = items();
    expect(first!.textContent).toContain('Maren Holt');
    expect(first!.textContent).toContain('(edited)');
    expect(second!.textContent).toContain(`Dusty Okonjo · ${SHOP_NAME}`);
    expect(second!.textContent).not.toContain('(edited)');
    // Each has its moment, exactly, for machines and as a tooltip.
    expect(second!.querySelector('time')?.getAttribute('dateTime')).toBe('2026-06-07T11:00:00.000Z');
  });

  it('when a comment is someone else’s, then it offers no edit or delete; one’s own does', async () => {
    stubFetch({ [THREAD]: list([mine, dustys]) });
    renderWithQueryClient(<CommentThread target={TARGET} label="Comments on run 1" />);

    await screen.findByText('Felt loose at the slalom exit.');
    const [own, other] = items();
    expect(within(own!).getByRole('button', { name: 'Edit your comment' })).toBeTruthy();
    expect(within(own!).getByRole('button', { name: 'Delete your comment' })).toBeTruthy();
    expect(within(other!).queryByRole('button', { name: /Edit|Delete/ })).toBeNull();
  });

  it('when a comment is sent and refused with a field error, then the message shows on the box, the text stays, and sending again reuses the same id', async () => {
    const message = 'Use at most 4000 characters';
    let attempt = 0;
    const fetchMock = stubFetch({
      [THREAD]: () => list(attempt > 1 ? [dustys, comment({ id: 'c0333333-3333-4333-8333-333333333333', body: 'Will do.', mine: true })] : [dustys]),
      'POST /api/comments': ({ body }) => {
        attempt += 1;
        if (attempt === 1) return errorResponse(400, 'validation_failed', 'Some fields are not valid.', { body: [message] });
        return jsonResponse(201, { ...(body as object) });
      },
    });
    renderWithQueryClient(<CommentThread target={TARGET} label="Comments on run 1" />);
    const u = userEvent.setup();

    const box = await screen.findByLabelText('Add a comment');
    await u.type(box, '  Will do.  ');
    await u.click(screen.getByRole('button', { name: 'Send' }));

    const shown = await screen.findByText(message);
    expect(box.getAttribute('aria-invalid')).toBe('true');
    expect(box.getAttribute('aria-describedby')).toBe(shown.id);
    expect((box as HTMLTextAreaElement).value).toBe('  Will do.  ');

    await u.click(screen.getByRole('button', { name: 'Send' }));
    await screen.findByText('Will do.');
    await waitFor(() => expect((box as HTMLTextAreaElement).value).toBe(''));

    const sent = requestsTo(fetchMock, 'POST /api/comments').map((r) => r.body as { id: string; target: unknown; body: string });
    expect(sent).toHaveLength(2);
    expect(sent[0]).toEqual({ id: expect.stringMatching(UUID), target: TARGET, body: 'Will do.' });
    expect(sent[1]!.id).toBe(sent[0]!.id);
  });

  it('when two comments are sent one after the other, then each has its own id', async () => {
    const fetchMock = stubFetch({
      [THREAD]: list([]),
      'POST /api/comments': ({ body }) => jsonResponse(201, body),
    });
    renderWithQueryClient(<CommentThread target={TARGET} label="Comments on run 1" />);
    const u = userEvent.setup();

    const box = await screen.findByLabelText('Add a comment');
    await u.type(box, 'First');
    await u.click(screen.getByRole('button', { name: 'Send' }));
    await waitFor(() => expect((box as HTMLTextAreaElement).value).toBe(''));
    await u.type(box, 'Second');
    await u.click(screen.getByRole('button', { name: 'Send' }));
    await waitFor(() => expect(requestsTo(fetchMock, 'POST /api/comments')).toHaveLength(2));

    const [a, b] = requestsTo(fetchMock, 'POST /api/comments').map((r) => (r.body as { id: string }).id);
    expect(a).not.toBe(b);
  });

  it('when the box is empty, then nothing is sent and the box says what to do', async () => {
    const fetchMock = stubFetch({ [THREAD]: list([]) });
    renderWithQueryClient(<CommentThread target={TARGET} label="Comments on run 1" />);
    const u = userEvent.setup();

    await u.type(await screen.findByLabelText('Add a comment'), '   ');
    await u.click(screen.getByRole('button', { name: 'Send' }));

    expect(await screen.findByText('Write a comment')).toBeTruthy();
    expect(requestsTo(fetchMock, 'POST /api/comments')).toHaveLength(0);
  });

  it('when the author edits a comment, then the new text goes with the version it was based on', async () => {
    const fetchMock = stubFetch({
      [THREAD]: list([mine]),
      [`PATCH /api/comments/${COLLAB_IDS.commentMaren}`]: ({ body }) => jsonResponse(200, { ...mine, ...(body as object), version: 3 }),
    });
    renderWithQueryClient(<CommentThread target={TARGET} label="Comments on run 1" />);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Edit your comment' }));
    const box = screen.getByLabelText('Your comment');
    await u.clear(box);
    await u.type(box, 'Loose at the slalom exit, fine elsewhere.');
    await u.click(screen.getByRole('button', { name: 'Save' }));

    await waitFor(() => expect(requestsTo(fetchMock, `PATCH /api/comments/${COLLAB_IDS.commentMaren}`)).toHaveLength(1));
    expect(requestsTo(fetchMock, `PATCH /api/comments/${COLLAB_IDS.commentMaren}`)[0]?.body).toEqual({
      body: 'Loose at the slalom exit, fine elsewhere.',
      version: 2,
    });
  });

  it('when the author deletes a comment, then it is asked first, and only "Delete comment" sends the request', async () => {
    let deleted = false;
    const fetchMock = stubFetch({
      [THREAD]: () => list(deleted ? [] : [mine]),
      [`DELETE /api/comments/${COLLAB_IDS.commentMaren}`]: () => {
        deleted = true;
        return jsonResponse(204);
      },
    });
    renderWithQueryClient(<CommentThread target={TARGET} label="Comments on run 1" />);
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Delete your comment' }));
    const ask = screen.getByRole('group', { name: 'Delete this comment?' });
    await u.click(within(ask).getByRole('button', { name: 'Keep' }));
    expect(requestsTo(fetchMock, `DELETE /api/comments/${COLLAB_IDS.commentMaren}`)).toHaveLength(0);

    await u.click(screen.getByRole('button', { name: 'Delete your comment' }));
    await u.click(within(screen.getByRole('group', { name: 'Delete this comment?' })).getByRole('button', { name: 'Delete comment' }));

    await screen.findByText('No comments yet.');
    expect(requestsTo(fetchMock, `DELETE /api/comments/${COLLAB_IDS.commentMaren}`)).toHaveLength(1);
  });

  it('when an event thread loads, then it asks for that car’s day only', async () => {
    const fetchMock = stubFetch({ [`GET /api/comments?type=event&id=${IDS.event}&carId=${IDS.car}`]: list([]) });
    renderWithQueryClient(<CommentThread target={{ type: 'event', id: IDS.event, carId: IDS.car }} label="Comments on the day" />);

    await screen.findByText('No comments yet.');
    expect(requestsTo(fetchMock, `GET /api/comments?type=event&id=${IDS.event}&carId=${IDS.car}`)).toHaveLength(1);
  });
});
