import { spawnSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { existsSync, mkdirSync, mkdtempSync, rmSync, unlinkSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Attachment } from '@shared/files/attachment.schema';
import { diskStorage } from '../../../server/files/disk-storage';
import { checkStoredFiles } from '../../../server/files/file-check';
import { queueForRemoval, sweepAllStoredFiles } from '../../../server/files/file-sweep';
import { ROOT } from '../../../scripts/lib/env';
import { makeTestApp, type TestApp } from '../test-app';
import { seededDatabaseUrl } from '../support-seeded';
import { attachmentWorld, jpeg, tinyPdf, upload } from './attachment-fixtures';

/**
 * The storage check: objects no record names (left after a restore of an older database, or from before
 * deletes were queued) and records whose object is gone (after a restore of a newer one). The database is
 * shared with other test files, whose files live in other folders, so checks look at this file's keys.
 */
let t: TestApp;
let w: Awaited<ReturnType<typeof attachmentWorld>>;

beforeAll(async () => {
  t = await makeTestApp();
  w = await attachmentWorld(t);
});
afterAll(async () => {
  await t.close();
});

const HOURS_AGO = (h: number) => new Date(Date.now() - h * 3_600_000);
/** An object written straight to the upload folder, as a file no row names, `age` hours old. */
function strayObject(ageHours: number): string {
  const key = `${randomUUID()}/original`;
  const path = join(t.uploadDir!, key);
  mkdirSync(join(path, '..'), { recursive: true });
  writeFileSync(path, 'left behind');
  utimesSync(path, HOURS_AGO(ageHours), HOURS_AGO(ageHours));
  return key;
}

describe('checking the storage against the database', () => {
  it('when objects lack a record or a record lacks its object, then each is named; new and queued objects are not judged', async () => {
    const up = await upload(w.owner.c, { targetType: 'run', targetId: w.runId }, [
      { bytes: await jpeg(40, 30), name: 'kept.jpg' },
      { bytes: tinyPdf(), name: 'lost.pdf' },
    ]);
    expect(up.status).toBe(201);
    const [kept, lost] = up.body.items as [Attachment, Attachment];
    unlinkSync(join(t.uploadDir!, `${lost.id}/original`));
    const old = strayObject(3);
    const fresh = strayObject(0);
    const queued = strayObject(5);
    await queueForRemoval(t.ds, [queued]);

    const check = await checkStoredFiles(t.ds, diskStorage(t.uploadDir));
    expect(check.orphans).toEqual([old]);
    expect(check.missing).toContainEqual({ attachmentId: lost.id, key: `${lost.id}/original` });
    expect(check.missing.map((m) => m.attachmentId)).not.toContain(kept.id);
    expect(check.recent).toBe(1);
    expect(check.queued).toBe(1);
    // kept.jpg's original and thumbnail, and the three strays.
    expect(check.objects).toBe(5);

    // Removing the orphans: queued, then swept like any deleted record's files.
    await queueForRemoval(t.ds, check.orphans);
    await sweepAllStoredFiles(t.ds, diskStorage(t.uploadDir));
    expect(existsSync(join(t.uploadDir!, old))).toBe(false);
    expect(existsSync(join(t.uploadDir!, fresh))).toBe(true);
    expect(existsSync(join(t.uploadDir!, `${kept.id}/original`))).toBe(true);
    expect((await checkStoredFiles(t.ds, diskStorage(t.uploadDir))).orphans).toEqual([]);
  });

  it('when the upload folder holds a write in progress or a name the server never makes, then neither is listed', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'scrubline-list-'));
    try {
      const storage = diskStorage(dir);
      const key = `${randomUUID()}/thumbnail`;
      await storage.put(key, Buffer.from('x'), 'image/webp');
      writeFileSync(join(dir, `${key}.${randomUUID()}.part`), 'half');
      writeFileSync(join(dir, 'README.txt'), 'not ours');
      const listed: string[] = [];
      for await (const page of storage.list()) listed.push(...page.map((o) => o.key));
      expect(listed).toEqual([key]);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('npm run files:check', () => {
  let db: Awaited<ReturnType<typeof seededDatabaseUrl>>;
  const uploads = mkdtempSync(join(tmpdir(), 'scrubline-files-check-'));

  beforeAll(async () => {
    db = await seededDatabaseUrl();
  }, 120_000);
  afterAll(async () => {
    await db?.drop();
    rmSync(uploads, { recursive: true, force: true });
  });

  const run = (...args: string[]) =>
    spawnSync(process.execPath, ['--import', 'tsx', join(ROOT, 'scripts', 'files-check.ts'), ...args], {
      cwd: ROOT,
      env: { ...process.env, DATABASE_URL: db.url, UPLOAD_DIR: uploads, S3_BUCKET: '' },
      encoding: 'utf8',
      timeout: 60_000,
    });

  it('when a restored database lists a file that is not stored and the folder holds one it does not list, then it says so, and removes the stray on request', async () => {
    const c = new pg.Client({ connectionString: db.url });
    await c.connect();
    let listedId: string;
    try {
      const { rows } = await c.query(`SELECT r.id AS run_id, r.car_id, c.owner_id FROM runs r JOIN cars c ON c.id = r.car_id LIMIT 1`);
      listedId = randomUUID();
      await c.query(
        `INSERT INTO attachments (id, car_id, run_id, storage_key, file_name, content_type, size_bytes, uploaded_by)
         VALUES ($1, $2, $3, $4, 'timing sheet.pdf', 'application/pdf', 100, $5)`,
        [listedId, rows[0].car_id, rows[0].run_id, `${listedId}/original`, rows[0].owner_id],
      );
    } finally {
      await c.end();
    }
    const strayKey = `${randomUUID()}/original`;
    mkdirSync(join(uploads, strayKey, '..'), { recursive: true });
    writeFileSync(join(uploads, strayKey), 'stray');
    utimesSync(join(uploads, strayKey), HOURS_AGO(2), HOURS_AGO(2));

    const report = run();
    expect(report.stderr).toBe('');
    expect(report.stdout).toContain('1 stored object in');
    expect(report.stdout).toContain('1 file the database lists is not stored');
    expect(report.stdout).toContain(`${listedId}/original  (attachment ${listedId})`);
    expect(report.stdout).toContain('1 object has no record');
    expect(report.stdout).toContain(strayKey);
    // A missing file is worth a look: the exit status says so.
    expect(report.status).toBe(1);
    expect(existsSync(join(uploads, strayKey))).toBe(true);

    const removal = run('--remove-orphans');
    expect(removal.stdout).toContain('1 object had no record: 1 queued, 1 removed, 0 refused');
    expect(existsSync(join(uploads, strayKey))).toBe(false);

    expect(run('--everything').status).toBe(2);
  }, 120_000);
});
