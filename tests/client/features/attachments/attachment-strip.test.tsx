// @vitest-environment jsdom
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi, type Mock } from 'vitest';
import type { Attachment, AttachmentTarget } from '../../../../shared/files/attachment.schema';
import { CSRF_HEADER, dropCsrfToken } from '@/lib/api-client';
import { clearToasts } from '@/lib/toast-store';
import { AttachmentStrip } from '@/features/attachments/components/attachment-strip';
import { CSRF_TOKEN, errorResponse, jsonResponse, renderWithQueryClient, requestsTo, stubFetch } from '../../test-utils';
import { IDS, list, TYRE_SET } from '../../fixtures/season';

const READING_ID = TYRE_SET.latestReading!.id;
const TARGET: AttachmentTarget = { targetType: 'tread_reading', targetId: READING_ID };
const LIST = `GET /api/attachments?targetType=tread_reading&targetId=${READING_ID}`;
/** The target rides in the query string, so the server checks it before reading any file. */
const UPLOAD_URL = `/api/attachments?targetType=tread_reading&targetId=${READING_ID}`;
const UPLOAD = `POST ${UPLOAD_URL}`;
const WHAT = 'the Set B reading';

beforeEach(() => dropCsrfToken());
afterEach(() => {
  cleanup();
  clearToasts();
  vi.unstubAllGlobals();
});

function attachment(partial: Partial<Attachment> & Pick<Attachment, 'id' | 'fileName'>): Attachment {
  return {
    target: { type: 'tread_reading', id: READING_ID },
    carId: IDS.car,
    contentType: 'image/jpeg',
    sizeBytes: 120_000,
    width: 640,
    height: 480,
    hasThumbnail: true,
    uploadedBy: { id: IDS.maren, displayName: 'Maren Holt' },
    canDelete: true,
    createdAt: '2026-05-24T16:10:00.000Z',
    ...partial,
  };
}

const PHOTO = attachment({ id: 'f1111111-1111-4111-8111-111111111111', fileName: 'left-front-wear.jpg' });
const SHEET = attachment({
  id: 'f2222222-2222-4222-8222-222222222222',
  fileName: 'club-results.pdf',
  contentType: 'application/pdf',
  width: null,
  height: null,
  hasThumbnail: false,
});

const jpeg = (name: string) => new File([new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 1, 2, 3])], name, { type: 'image/jpeg' });

function renderStrip(props: { canAdd?: boolean } = {}) {
  return renderWithQueryClient(<AttachmentStrip target={TARGET} what={WHAT} {...props} />);
}

/** The body of each POST /api/attachments, as the strip handed it to fetch. */
function uploads(fetchMock: Mock<typeof fetch>): FormData[] {
  return fetchMock.mock.calls
    .filter(([input, init]) => String(input).startsWith('/api/attachments') && init?.method === 'POST')
    .map(([, init]) => init!.body as FormData);
}

async function choose(...files: File[]) {
  const input = await screen.findByLabelText(`Add photos to ${WHAT}`);
  await userEvent.setup().upload(input, files);
}

describe('photos and files on a record', () => {
  it('when the record has a photo and a PDF, then the photo shows its thumbnail and the PDF its name, each linking to the file', async () => {
    stubFetch({ [LIST]: list([PHOTO, SHEET]) });
    renderStrip();

    const strip = await screen.findByRole('list', { name: `Photos and files on ${WHAT}` });
    const img = within(strip).getByRole('img', { name: 'Photo: left-front-wear.jpg' });
    expect(img.getAttribute('src')).toBe(`/api/attachments/${PHOTO.id}/thumbnail`);
    expect(img.closest('a')?.getAttribute('href')).toBe(`/api/attachments/${PHOTO.id}/file`);
    expect(img.closest('a')?.getAttribute('target')).toBe('_blank');

    const pdf = within(strip).getByRole('link', { name: /club-results\.pdf/ });
    expect(pdf.getAttribute('href')).toBe(`/api/attachments/${SHEET.id}/file`);
    expect(within(pdf).queryByRole('img')).toBeNull();
  });

  it('when the record has nothing yet, then it says so and offers the picker for photos (camera) and PDFs', async () => {
    stubFetch({ [LIST]: list([]) });
    renderStrip();

    expect(await screen.findByText('No photos yet.')).toBeTruthy();
    const input = screen.getByLabelText(`Add photos to ${WHAT}`);
    expect(input.getAttribute('type')).toBe('file');
    expect(input.getAttribute('accept')).toBe('image/*,application/pdf');
    expect(input.hasAttribute('multiple')).toBe(true);
  });

  it('when photos are chosen, then one multipart POST names the target in its query and carries only the files, with the CSRF header, and the list refreshes', async () => {
    const fetchMock = stubFetch({
      [LIST]: [list([]), list([PHOTO])],
      [UPLOAD]: jsonResponse(201, { items: [PHOTO], count: 1 }),
    });
    renderStrip();
    await screen.findByText('No photos yet.');

    await choose(jpeg('left-front-wear.jpg'), jpeg('right-front-wear.jpg'));

    await waitFor(() => expect(uploads(fetchMock)).toHaveLength(1));
    const form = uploads(fetchMock)[0]!;
    expect(form).toBeInstanceOf(FormData);
    expect([...form.keys()]).toEqual(['files', 'files']);
    expect(form.getAll('files').map((f) => (f as File).name)).toEqual(['left-front-wear.jpg', 'right-front-wear.jpg']);
    const [input, init] = fetchMock.mock.calls.find(([u, i]) => String(u).startsWith('/api/attachments') && i?.method === 'POST')!;
    expect(String(input)).toBe(UPLOAD_URL);
    const headers = new Headers(init?.headers);
    expect(headers.get(CSRF_HEADER)).toBe(CSRF_TOKEN);
    // The browser writes the multipart boundary; a JSON content type would break the upload.
    expect(headers.get('Content-Type')).toBeNull();

    expect(await screen.findByRole('img', { name: 'Photo: left-front-wear.jpg' })).toBeTruthy();
    expect(screen.getByRole('status').textContent).toBe('Added 1 file.');
  });

  it('when the server refuses the type (415), then its message is shown', async () => {
    stubFetch({
      [LIST]: list([]),
      [UPLOAD]: errorResponse(415, 'unsupported_media_type', '“setup.jpg” is not a photo or a PDF, whatever its name says.'),
    });
    renderStrip();
    await screen.findByText('No photos yet.');

    await choose(jpeg('setup.jpg'));

    expect((await screen.findByRole('alert')).textContent).toContain('“setup.jpg” is not a photo or a PDF, whatever its name says.');
  });

  it('when the server says the files are too large (413), then its message is shown', async () => {
    stubFetch({
      [LIST]: list([]),
      [UPLOAD]: errorResponse(413, 'payload_too_large', '“huge.jpg” is over 10 MB; each file may be up to 10 MB.'),
    });
    renderStrip();
    await screen.findByText('No photos yet.');

    await choose(jpeg('huge.jpg'));

    expect((await screen.findByRole('alert')).textContent).toContain('“huge.jpg” is over 10 MB; each file may be up to 10 MB.');
  });

  it('when a proxy refuses a large upload without our error shape (413), then the limits are still explained', async () => {
    stubFetch({
      [LIST]: list([]),
      [UPLOAD]: new Response('<html>413 Request Entity Too Large</html>', { status: 413 }),
    });
    renderStrip();
    await screen.findByText('No photos yet.');

    await choose(jpeg('huge.jpg'));

    expect((await screen.findByRole('alert')).textContent).toContain('each file may be up to 10 MB, and up to 10 files go at once');
  });

  it('when more than ten files are chosen, then nothing is sent and the limit is explained', async () => {
    const fetchMock = stubFetch({ [LIST]: list([]) });
    renderStrip();
    await screen.findByText('No photos yet.');

    await choose(...Array.from({ length: 11 }, (_, i) => jpeg(`photo-${i + 1}.jpg`)));

    expect((await screen.findByRole('alert')).textContent).toContain('You chose 11 files; up to 10 can go at once.');
    expect(uploads(fetchMock)).toHaveLength(0);
  });

  it('when there is no connection, then it says uploads need one and are not kept for later', async () => {
    stubFetch({
      [LIST]: list([]),
      [UPLOAD]: () => {
        throw new TypeError('Failed to fetch');
      },
    });
    renderStrip();
    await screen.findByText('No photos yet.');

    await choose(jpeg('left-front-wear.jpg'));

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('needs a connection');
    expect(alert.textContent).toContain('not kept for later');
  });

  it('when delete is chosen, then it asks first, and only on yes sends DELETE and the photo goes', async () => {
    const fetchMock = stubFetch({
      [LIST]: [list([PHOTO]), list([])],
      [`DELETE /api/attachments/${PHOTO.id}`]: jsonResponse(204),
    });
    renderStrip();
    const u = userEvent.setup();

    await u.click(await screen.findByRole('button', { name: 'Delete left-front-wear.jpg' }));
    const dialog = await screen.findByRole('dialog', { name: 'Delete this file?' });
    await u.click(within(dialog).getByRole('button', { name: 'Keep it' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(requestsTo(fetchMock, `DELETE /api/attachments/${PHOTO.id}`)).toHaveLength(0);

    await u.click(screen.getByRole('button', { name: 'Delete left-front-wear.jpg' }));
    await u.click(within(await screen.findByRole('dialog', { name: 'Delete this file?' })).getByRole('button', { name: 'Delete' }));

    await waitFor(() => expect(requestsTo(fetchMock, `DELETE /api/attachments/${PHOTO.id}`)).toHaveLength(1));
    expect(requestsTo(fetchMock, `DELETE /api/attachments/${PHOTO.id}`)[0]!.headers.get(CSRF_HEADER)).toBe(CSRF_TOKEN);
    expect(await screen.findByText('No photos yet.')).toBeTruthy();
  });

  it('when the viewer may not delete a file, then no delete button is offered for it', async () => {
    stubFetch({ [LIST]: list([attachment({ ...PHOTO, canDelete: false }), SHEET]) });
    renderStrip();

    await screen.findByRole('img', { name: 'Photo: left-front-wear.jpg' });
    expect(screen.queryByRole('button', { name: 'Delete left-front-wear.jpg' })).toBeNull();
    expect(screen.getByRole('button', { name: 'Delete club-results.pdf' })).toBeTruthy();
  });
});
