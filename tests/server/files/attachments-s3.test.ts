import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { GetObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import S3rver from 's3rver';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Attachment } from '@shared/files/attachment.schema';
import { s3Storage } from '../../../server/files/s3-storage';
import { makeTestApp, type TestApp } from '../test-app';
import { attachmentWorld, jpeg, upload } from './attachment-fixtures';

/** s3rver accepts this key pair (its documented default credentials). */
const CREDENTIALS = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' };
const BUCKET = 'scrubline-test-uploads';

let s3dir: string;
let fake: S3rver;
let endpoint: string;
let s3: S3Client;
let t: TestApp;
let w: Awaited<ReturnType<typeof attachmentWorld>>;

beforeAll(async () => {
  s3dir = mkdtempSync(join(tmpdir(), 'scrubline-s3rver-'));
  fake = new S3rver({ port: 0, address: '127.0.0.1', silent: true, directory: s3dir, configureBuckets: [{ name: BUCKET }] });
  const { port } = await fake.run();
  endpoint = `http://127.0.0.1:${port}`;
  s3 = new S3Client({ endpoint, region: 'us-east-1', forcePathStyle: true, credentials: CREDENTIALS });
  t = await makeTestApp({ storage: s3Storage({ bucket: BUCKET, region: 'us-east-1', endpoint, ...CREDENTIALS }) });
  w = await attachmentWorld(t);
});
afterAll(async () => {
  await t?.close();
  s3?.destroy();
  await fake?.close();
  rmSync(s3dir, { recursive: true, force: true });
});

const bucketKeys = async () => ((await s3.send(new ListObjectsV2Command({ Bucket: BUCKET }))).Contents ?? []).map((o) => o.Key!).sort();

describe('attachments in an S3-compatible bucket (a local fake S3 server)', () => {
  it('when a photo is uploaded, then the photo and its thumbnail are objects in the bucket; the download equals it; deleting removes both', async () => {
    const photo = await jpeg(800, 600);
    const up = await upload(w.owner.c, { targetType: 'tread_reading', targetId: w.readingId }, [{ bytes: photo, name: 'wear.jpg' }]);
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const id = (up.body as { items: Attachment[] }).items[0]!.id;

    expect(await bucketKeys()).toEqual([`${id}/original`, `${id}/thumbnail`]);
    const object = await s3.send(new GetObjectCommand({ Bucket: BUCKET, Key: `${id}/original` }));
    expect(object.ContentType).toBe('image/jpeg');
    expect(Buffer.compare(Buffer.from(await object.Body!.transformToByteArray()), photo)).toBe(0);

    const file = await w.owner.c.get(`/api/attachments/${id}/file`);
    expect(file.status).toBe(200);
    expect(Buffer.compare(file.body as Buffer, photo)).toBe(0);
    const thumb = await w.owner.c.get(`/api/attachments/${id}/thumbnail`);
    expect(thumb.status).toBe(200);
    const meta = await sharp(thumb.body as Buffer).metadata();
    expect(Math.max(meta.width, meta.height)).toBeLessThanOrEqual(320);

    // Another driver cannot reach it through the app, and the bucket has no public address to guess.
    expect((await w.otherDriver.c.get(`/api/attachments/${id}/file`)).status).toBe(404);

    expect((await w.owner.c.delete(`/api/attachments/${id}`)).status).toBe(204);
    expect(await bucketKeys()).toEqual([]);
  });

  it('when the stored object has gone missing from the bucket, then the download is 404, not a crash', async () => {
    const up = await upload(w.owner.c, { targetType: 'run', targetId: w.runId }, [{ bytes: await jpeg(20, 20), name: 'lost.jpg' }]);
    const id = (up.body as { items: Attachment[] }).items[0]!.id;
    await s3Storage({ bucket: BUCKET, region: 'us-east-1', endpoint, ...CREDENTIALS }).delete(`${id}/original`);
    const res = await w.owner.c.get(`/api/attachments/${id}/file`);
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('when the bucket is listed for the storage check, then every object comes back with its time, and keys the server never makes are left out', async () => {
    const storage = s3Storage({ bucket: BUCKET, region: 'us-east-1', endpoint, ...CREDENTIALS });
    await s3.send(new PutObjectCommand({ Bucket: BUCKET, Key: 'Not Ours/readme.txt', Body: 'x' }));
    const before = Date.now();
    const up = await upload(w.owner.c, { targetType: 'run', targetId: w.runId }, [{ bytes: await jpeg(20, 20), name: 'listed.jpg' }]);
    const id = (up.body as { items: Attachment[] }).items[0]!.id;
    const listed: { key: string; modifiedAt: Date }[] = [];
    for await (const page of storage.list()) listed.push(...page);
    const ours = (await bucketKeys()).filter((k) => k !== 'Not Ours/readme.txt');
    expect(listed.map((o) => o.key).sort()).toEqual(ours);
    expect(ours).toContain(`${id}/thumbnail`);
    const mine = listed.find((o) => o.key === `${id}/original`)!;
    // S3 keeps times to the second.
    expect(mine.modifiedAt.getTime()).toBeGreaterThanOrEqual(Math.floor(before / 1000) * 1000);
  });
});
