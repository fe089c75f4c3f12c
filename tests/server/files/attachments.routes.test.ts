import { randomUUID } from 'node:crypto';
import { readdirSync } from 'node:fs';
import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Attachment } from '@shared/files/attachment.schema';
import { makeTestApp, type TestApp } from '../test-app';
import { anonymous, type Client } from '../season/season-fixtures';
import { answerWhileBodyOpen, credentialsOf } from '../open-body';
import { attachmentWorld, jpeg, png, tinyPdf, upload, uploadPath, windowsExecutable } from './attachment-fixtures';

let t: TestApp;
let w: Awaited<ReturnType<typeof attachmentWorld>>;

beforeAll(async () => {
  t = await makeTestApp();
  w = await attachmentWorld(t);
});
afterAll(async () => {
  await t.close();
});

const onReading = () => ({ targetType: 'tread_reading', targetId: w.readingId });
const onRun = () => ({ targetType: 'run', targetId: w.runId });
const listPath = (target: { targetType: string; targetId: string }) => `/api/attachments?targetType=${target.targetType}&targetId=${target.targetId}`;
/** Every object the test's disk storage holds. */
const storedFiles = () => (readdirSync(t.uploadDir!, { recursive: true, withFileTypes: true }) as { isFile(): boolean; name: string }[]).filter((e) => e.isFile()).map((e) => e.name);
const items = (res: { body: unknown }) => (res.body as { items: Attachment[]; count: number }).items;

describe('uploading photos and PDFs', () => {
  it('when a driver attaches a photo and a PDF to a tread reading, then both are listed oldest first with their sizes', async () => {
    const photo = await jpeg(1200, 800);
    const pdf = tinyPdf();
    const res = await upload(w.owner.c, onReading(), [
      { bytes: photo, name: 'front-left wear.jpg', type: 'image/jpeg' },
      { bytes: pdf, name: 'alignment sheet.pdf', type: 'application/pdf' },
    ]);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.count).toBe(2);
    const [img, doc] = items(res);
    expect(img).toMatchObject({
      target: { type: 'tread_reading', id: w.readingId },
      carId: w.owner.carId,
      fileName: 'front-left wear.jpg',
      contentType: 'image/jpeg',
      sizeBytes: photo.length,
      width: 1200,
      height: 800,
      hasThumbnail: true,
      uploadedBy: { id: w.owner.user.id, displayName: 'Nell Ashdown' },
      canDelete: true,
    });
    expect(doc).toMatchObject({ fileName: 'alignment sheet.pdf', contentType: 'application/pdf', sizeBytes: pdf.length, width: null, height: null, hasThumbnail: false });

    const list = await w.owner.c.get(listPath(onReading()));
    expect(list.status).toBe(200);
    expect(list.body.count).toBe(2);
    expect(items(list).map((a) => a.fileName)).toEqual(['front-left wear.jpg', 'alignment sheet.pdf']);
  });

  it('when the file is downloaded, then the bytes are the ones sent, typed from their content, inline, private and not sniffable', async () => {
    const photo = await png(40, 30);
    const name = 'Reifen vorne ü (1).png';
    const up = await upload(w.owner.c, onRun(), [{ bytes: photo, name, type: 'text/plain' }]);
    expect(up.status).toBe(201);
    const res = await w.owner.c.get(`/api/attachments/${items(up)[0]!.id}/file`);
    expect(res.status).toBe(200);
    expect(Buffer.compare(res.body as Buffer, photo)).toBe(0);
    // The browser said text/plain; the bytes say PNG.
    expect(res.headers['content-type']).toBe('image/png');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['cache-control']).toMatch(/^private, max-age=\d+$/);
    // RFC 6266 with the RFC 5987 encoding: UTF-8, percent-encoded, ( and ) escaped as well.
    expect(res.headers['content-disposition']).toBe(`inline; filename="Reifen vorne _ (1).png"; filename*=UTF-8''Reifen%20vorne%20%C3%BC%20%281%29.png`);
  });

  it('when the thumbnail is fetched, then it is a WebP no larger than 320 px on its long side, in the photo\'s proportions', async () => {
    const up = await upload(w.owner.c, onReading(), [{ bytes: await jpeg(1200, 800), name: 'wide.jpg' }]);
    const res = await w.owner.c.get(`/api/attachments/${items(up)[0]!.id}/thumbnail`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/webp');
    const meta = await sharp(res.body as Buffer).metadata();
    expect(meta.format).toBe('webp');
    // 320 is our own bound; 1200 × 800 scaled to fit 320 wide keeps 3:2, so 320 × 213.
    expect(meta.width).toBe(320);
    expect(meta.height).toBe(213);
  });

  it('when a photo carries EXIF orientation 6 (Exif 2.3, tag 0x0112: rotate 90° clockwise to view), then its size and thumbnail are upright', async () => {
    const up = await upload(w.owner.c, onReading(), [{ bytes: await jpeg(600, 300, { orientation: 6 }), name: 'sideways.jpg' }]);
    expect(items(up)[0]).toMatchObject({ width: 300, height: 600 });
    const res = await w.owner.c.get(`/api/attachments/${items(up)[0]!.id}/thumbnail`);
    const meta = await sharp(res.body as Buffer).metadata();
    expect([meta.width, meta.height]).toEqual([160, 320]);
    // Rotated into the pixels, so no orientation is left to apply (metadata stripped).
    expect(meta.orientation).toBeUndefined();
    expect(meta.exif).toBeUndefined();
  });

  it('when a small photo is attached, then its thumbnail is not enlarged', async () => {
    const up = await upload(w.owner.c, onReading(), [{ bytes: await png(40, 30), name: 'tiny.png' }]);
    const res = await w.owner.c.get(`/api/attachments/${items(up)[0]!.id}/thumbnail`);
    const meta = await sharp(res.body as Buffer).metadata();
    expect([meta.width, meta.height]).toEqual([40, 30]);
  });

  it('when a PDF\'s thumbnail is asked for, then it is 404', async () => {
    const up = await upload(w.owner.c, onReading(), [{ bytes: tinyPdf(), name: 'sheet.pdf' }]);
    const res = await w.owner.c.get(`/api/attachments/${items(up)[0]!.id}/thumbnail`);
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('when the form still carries targetType and targetId beside the files, then it is 400 pointing to the query string, and nothing is stored', async () => {
    const c = w.owner.c;
    const before = storedFiles().length;
    const res = await c.agent.post(uploadPath(onRun())).set('X-CSRF-Token', await c.csrf())
      .field('targetType', 'run').field('targetId', w.runId)
      .attach('files', await png(10, 10), 'a.png');
    expect(res.status).toBe(400);
    expect(res.body.error).toEqual({ code: 'validation_failed', message: 'The form carries only the files: send targetType and targetId in the query string.' });
    expect(storedFiles().length).toBe(before);
  });

  it('when stored, then the object keys are the server\'s own, never the uploaded file name', async () => {
    await upload(w.owner.c, onRun(), [{ bytes: await png(10, 10), name: '..%2F..%2Fevil name.png' }]);
    const names = storedFiles();
    expect(names.length).toBeGreaterThan(0);
    expect(names.every((n) => n === 'original' || n === 'thumbnail')).toBe(true);
  });
});

describe('limits and refusals', () => {
  it('when a file is over 10 MB, then it is 413 with the size named and nothing is stored', async () => {
    const before = storedFiles().length;
    // A JPEG start of image marker (FF D8 FF) and padding to 11 MiB: the size check comes first.
    const big = Buffer.alloc(11 * 1024 * 1024, 0x20);
    Buffer.from([0xff, 0xd8, 0xff, 0xe0]).copy(big);
    const res = await upload(w.owner.c, onRun(), [{ bytes: big, name: 'huge.jpg', type: 'image/jpeg' }]);
    expect(res.status).toBe(413);
    expect(res.body).toEqual({ error: { code: 'payload_too_large', message: 'Each file may be at most 10 MB.' } });
    expect(storedFiles().length).toBe(before);
  });

  it('when 11 files are sent at once, then it is 413 saying 10 is the most', async () => {
    const small = await png(8, 8);
    const files = Array.from({ length: 11 }, (_, i) => ({ bytes: small, name: `p${i}.png` }));
    const res = await upload(w.owner.c, onRun(), files);
    expect(res.status).toBe(413);
    expect(res.body.error).toEqual({ code: 'payload_too_large', message: 'Send at most 10 files at a time.' });
  });

  it('when exactly 10 files are sent, then all 10 are stored', async () => {
    const small = await png(8, 8);
    const target = { targetType: 'setup', targetId: await newSetupId() };
    const res = await upload(w.owner.c, target, Array.from({ length: 10 }, (_, i) => ({ bytes: small, name: `p${i}.png` })));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.count).toBe(10);
    expect(items(await w.owner.c.get(listPath(target))).map((a) => a.fileName)).toEqual(Array.from({ length: 10 }, (_, i) => `p${i}.png`));
  });

  it('when a Windows program is renamed photo.jpg and sent as image/jpeg, then it is 415 naming what is allowed', async () => {
    const exe = windowsExecutable();
    // Cross-check with file-type itself: these bytes are an executable.
    expect(await fileTypeFromBuffer(exe)).toEqual({ ext: 'exe', mime: 'application/x-msdownload' });
    const res = await upload(w.owner.c, onRun(), [{ bytes: exe, name: 'photo.jpg', type: 'image/jpeg' }]);
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('unsupported_media_type');
    expect(res.body.error.message).toContain('"photo.jpg"');
    for (const word of ['JPEG', 'PNG', 'WebP', 'HEIC', 'PDF']) expect(res.body.error.message).toContain(word);
  });

  it('when plain text is sent, then it is 415', async () => {
    const res = await upload(w.owner.c, onRun(), [{ bytes: Buffer.from('Front left felt loose after run 3.\n'), name: 'notes.txt', type: 'text/plain' }]);
    expect(res.status).toBe(415);
  });

  it('when one file of a batch is refused, then none of the batch is stored', async () => {
    const target = { targetType: 'setup', targetId: await newSetupId() };
    const before = storedFiles().length;
    const res = await upload(w.owner.c, target, [
      { bytes: await png(20, 20), name: 'good.png' },
      { bytes: windowsExecutable(), name: 'bad.jpg', type: 'image/jpeg' },
    ]);
    expect(res.status).toBe(415);
    expect(res.body.error.message).toContain('"bad.jpg"');
    expect(res.body.error.message).not.toContain('good.png');
    expect((await w.owner.c.get(listPath(target))).body.count).toBe(0);
    expect(storedFiles().length).toBe(before);
  });

  it('when no file is sent, then it is 400', async () => {
    const res = await upload(w.owner.c, onRun(), []);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'validation_failed', fieldErrors: { files: [expect.any(String)] } });
  });

  it('when the target type is unknown or the id is not an id, then it is 400 with field errors', async () => {
    const res = await upload(w.owner.c, { targetType: 'car', targetId: 'abc' }, [{ bytes: await png(8, 8), name: 'a.png' }]);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual(['targetId', 'targetType']);
  });

  it('when files come in another field, then it is 400', async () => {
    const c = w.owner.c;
    const res = await c.agent.post(uploadPath(onRun())).set('X-CSRF-Token', await c.csrf())
      .attach('photo', await png(8, 8), 'a.png');
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toHaveProperty('files');
  });

  it('when the list or a file is asked for without a session, then it is 401', async () => {
    const anon = anonymous(t);
    expect((await anon.get(listPath(onRun()))).status).toBe(401);
  });
});

describe('the target is checked before any file is read', () => {
  const BOUNDARY = 'scrubline-open-body';
  /** The start of a form whose one file never ends: 64 KiB of a JPEG, and then nothing more is sent. */
  const firstChunk = Buffer.concat([
    Buffer.from(`--${BOUNDARY}\r\nContent-Disposition: form-data; name="files"; filename="wear.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`),
    Buffer.from([0xff, 0xd8, 0xff, 0xe0]),
    Buffer.alloc(64 * 1024, 0x20),
  ]);
  const openUpload = async (c: Client, path: string) =>
    answerWhileBodyOpen(t.app, {
      path,
      headers: { ...(await credentialsOf(c)), 'Content-Type': `multipart/form-data; boundary=${BOUNDARY}` },
      firstChunk,
    });

  it('when someone who may not add files to the record starts an upload that never ends, then the refusal comes while the body is still open', async () => {
    const rowsBefore = Number((await t.ds.query('SELECT count(*) AS n FROM attachments'))[0].n);
    // Another driver cannot see the run: 404, as on every route.
    const hidden = await openUpload(w.otherDriver.c, uploadPath(onRun()));
    expect(hidden).toMatchObject({ status: 404, body: { error: { code: 'not_found', message: 'That run was not found.' } }, bodyStillOpen: true });
    // The granted shop reads the run but may not add to it: 403.
    const readOnly = await openUpload(w.staff.c, uploadPath(onRun()));
    expect(readOnly).toMatchObject({ status: 403, body: { error: { code: 'forbidden' } }, bodyStillOpen: true });
    // A record that does not exist, even for the car's owner: 404.
    const missing = await openUpload(w.owner.c, uploadPath({ targetType: 'tread_reading', targetId: randomUUID() }));
    expect(missing).toMatchObject({ status: 404, body: { error: { code: 'not_found' } }, bodyStillOpen: true });
    // Signed out: 401.
    const signedOut = await openUpload(anonymous(t), uploadPath(onRun()));
    expect(signedOut).toMatchObject({ status: 401, body: { error: { code: 'unauthenticated' } }, bodyStillOpen: true });
    expect(Number((await t.ds.query('SELECT count(*) AS n FROM attachments'))[0].n)).toBe(rowsBefore);
  });

  it('when the query names no target or a bad one, then it is 400 with field errors while the body is still open', async () => {
    const none = await openUpload(w.owner.c, '/api/attachments');
    expect(none).toMatchObject({ status: 400, body: { error: { code: 'validation_failed' } }, bodyStillOpen: true });
    expect(Object.keys((none.body.error as { fieldErrors: object }).fieldErrors).sort()).toEqual(['targetId', 'targetType']);
    const bad = await openUpload(w.owner.c, '/api/attachments?targetType=car&targetId=abc');
    expect(bad).toMatchObject({ status: 400, bodyStillOpen: true });
  });
});

describe('who sees and deletes files', () => {
  async function ownerFile() {
    const up = await upload(w.owner.c, onRun(), [{ bytes: await png(30, 20), name: 'owner.png' }]);
    expect(up.status).toBe(201);
    return items(up)[0]!.id;
  }

  it('when another driver asks for the list, the file, the thumbnail or a delete, then every answer is 404', async () => {
    const id = await ownerFile();
    const c = w.otherDriver.c;
    expect((await c.get(listPath(onRun()))).status).toBe(404);
    expect((await c.get(`/api/attachments/${id}/file`)).status).toBe(404);
    expect((await c.get(`/api/attachments/${id}/thumbnail`)).status).toBe(404);
    expect((await c.delete(`/api/attachments/${id}`)).status).toBe(404);
    // …and cannot add files either.
    expect((await upload(c, onRun(), [{ bytes: await png(8, 8), name: 'x.png' }])).status).toBe(404);
    // The file is still there for its owner.
    expect((await w.owner.c.get(`/api/attachments/${id}/file`)).status).toBe(200);
  });

  it('when an id that does not exist is asked for, then it is 404 like one that is not yours', async () => {
    expect((await w.owner.c.get('/api/attachments/6f0b3c1e-1d2a-4c5b-9e8f-0a1b2c3d4e5f/file')).status).toBe(404);
    expect((await w.owner.c.get('/api/attachments/not-an-id/file')).status).toBe(404);
  });

  it('when the granted shop\'s staff read, then they see the list and files; when they upload, then it is 403', async () => {
    const id = await ownerFile();
    const c = w.staff.c;
    const list = await c.get(listPath(onRun()));
    expect(list.status).toBe(200);
    expect(items(list).find((a) => a.id === id)).toMatchObject({ canDelete: false });
    expect((await c.get(`/api/attachments/${id}/file`)).status).toBe(200);
    expect((await c.get(`/api/attachments/${id}/thumbnail`)).status).toBe(200);
    const up = await upload(c, onRun(), [{ bytes: await png(8, 8), name: 'shop.png' }]);
    expect(up.status).toBe(403);
    expect(up.body.error.code).toBe('forbidden');
    expect((await c.delete(`/api/attachments/${id}`)).status).toBe(403);
  });

  it('when a co-driver adds a file, then they and the owner may delete it; the co-driver may not delete the owner\'s', async () => {
    const mine = await upload(w.coDriver.c, onRun(), [{ bytes: await png(8, 8), name: 'co.png' }]);
    expect(mine.status).toBe(201);
    expect(items(mine)[0]!.canDelete).toBe(true);
    const ownersView = items(await w.owner.c.get(listPath(onRun()))).find((a) => a.id === items(mine)[0]!.id);
    expect(ownersView?.canDelete).toBe(true);

    const owners = await ownerFile();
    const refused = await w.coDriver.c.delete(`/api/attachments/${owners}`);
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/added this file or the car's owner/);

    expect((await w.owner.c.delete(`/api/attachments/${items(mine)[0]!.id}`)).status).toBe(204);
  });

  it('when a file is deleted, then its row and stored objects are gone and it answers 404', async () => {
    const before = storedFiles().length;
    const id = await ownerFile();
    expect(storedFiles().length).toBe(before + 2);
    const res = await w.owner.c.delete(`/api/attachments/${id}`);
    expect(res.status).toBe(204);
    expect(storedFiles().length).toBe(before);
    expect((await w.owner.c.get(`/api/attachments/${id}/file`)).status).toBe(404);
    expect((await w.owner.c.delete(`/api/attachments/${id}`)).status).toBe(404);
  });

  it('when a file is on an event, then whoever sees the event reads and adds files, and others get 404', async () => {
    const target = { targetType: 'event', targetId: w.owner.eventId };
    const up = await upload(w.owner.c, target, [{ bytes: tinyPdf(), name: 'supplementary regs.pdf' }]);
    expect(up.status).toBe(201);
    expect(items(up)[0]).toMatchObject({ carId: null, target: { type: 'event', id: w.owner.eventId } });
    // The co-driver shares a car with the event's creator, so sees the event.
    expect((await w.coDriver.c.get(listPath(target))).body.count).toBe(1);
    const theirs = await upload(w.coDriver.c, target, [{ bytes: await png(8, 8), name: 'paddock.png' }]);
    expect(theirs.status).toBe(201);
    // The event's creator may delete what others added there.
    expect((await w.owner.c.delete(`/api/attachments/${items(theirs)[0]!.id}`)).status).toBe(204);
    expect((await w.otherDriver.c.get(listPath(target))).status).toBe(404);
    expect((await w.otherDriver.c.get(`/api/attachments/${items(up)[0]!.id}/file`)).status).toBe(404);
  });

  it('when the record a file hangs on is deleted, then the file\'s row goes with it', async () => {
    const setupId = await newSetupId('2025-01-01T00:00:00Z');
    const up = await upload(w.owner.c, { targetType: 'setup', targetId: setupId }, [{ bytes: await png(8, 8), name: 's.png' }]);
    expect(up.status).toBe(201);
    expect((await w.owner.c.delete(`/api/setups/${setupId}`)).status).toBe(204);
    expect((await w.owner.c.get(`/api/attachments/${items(up)[0]!.id}/file`)).status).toBe(404);
  });
});

async function newSetupId(effectiveFrom = '2026-04-01T00:00:00Z') {
  const rows: { id: string }[] = await t.ds.query(
    `INSERT INTO setup_snapshots (car_id, label, effective_from, created_by) VALUES ($1, 'Photos', $2, $3) RETURNING id`,
    [w.owner.carId, effectiveFrom, w.owner.user.id],
  );
  return rows[0]!.id;
}
