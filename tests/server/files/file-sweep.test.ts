import { existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Attachment } from '@shared/files/attachment.schema';
import { diskStorage } from '../../../server/files/disk-storage';
import { startFileSweeper, sweepAllStoredFiles, sweepStoredFiles } from '../../../server/files/file-sweep';
import type { FileStorage } from '../../../server/files/storage';
import { makeTestApp, type TestApp } from '../test-app';
import { postRun, postSetup } from '../season/season-fixtures';
import { attachmentWorld, jpeg, tinyPdf, upload } from './attachment-fixtures';

/**
 * Deleting a record deletes its attachment rows (ON DELETE CASCADE); the database queues their
 * stored objects in the same transaction, and the sweep removes them. Other test files may queue
 * keys of their own in the same database, so every check here looks at this file's keys only.
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

const storage = () => diskStorage(t.uploadDir!);
const keysOf = (a: Attachment) => [`${a.id}/original`, ...(a.hasThumbnail ? [`${a.id}/thumbnail`] : [])];
const onDisk = (key: string) => existsSync(join(t.uploadDir!, key));
async function queued(keys: string[]): Promise<string[]> {
  const rows: { storage_key: string }[] = await t.ds.query('SELECT storage_key FROM stored_file_removals WHERE storage_key = ANY($1::text[]) ORDER BY 1', [keys]);
  return rows.map((r) => r.storage_key);
}
/** A photo (original and thumbnail) and a PDF (original only) on the target; their keys. */
async function filesOn(target: { targetType: string; targetId: string }): Promise<string[]> {
  const res = await upload(w.owner.c, target, [
    { bytes: await jpeg(64, 48), name: 'wear.jpg' },
    { bytes: tinyPdf(), name: 'sheet.pdf' },
  ]);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return (res.body.items as Attachment[]).flatMap(keysOf);
}

describe('the stored files of a deleted record', () => {
  it('when a run with files is deleted, then its objects are queued with the delete and removed by the sweep, folders and all', async () => {
    const run = await postRun(w.owner.c, w.owner.carId, w.owner.eventId, { runNumber: 7 });
    const keys = await filesOn({ targetType: 'run', targetId: run.id });
    expect(keys).toHaveLength(3);
    expect(keys.every(onDisk)).toBe(true);

    expect((await w.owner.c.delete(`/api/runs/${run.id}`)).status).toBe(204);
    // Queued by the delete itself; still stored until the sweep.
    expect(await queued(keys)).toEqual([...keys].sort());
    expect(keys.every(onDisk)).toBe(true);

    const result = await sweepAllStoredFiles(t.ds, storage());
    expect(result.removed).toBeGreaterThanOrEqual(3);
    expect(keys.some(onDisk)).toBe(false);
    expect(await queued(keys)).toEqual([]);
    // The attachment's folder went with its last object.
    for (const key of keys) expect(existsSync(join(t.uploadDir!, key.split('/')[0]!))).toBe(false);
  });

  it('when a whole car is deleted, then the files of its runs, setups and tread readings are all swept', async () => {
    const { owner } = w;
    const car = await owner.c.post('/api/cars', { name: 'Spare hatch', classCode: 'SS', carNumber: '8', tyreSize: '195/50R15' });
    expect(car.status, JSON.stringify(car.body)).toBe(201);
    const carId = car.body.id as string;
    const run = await postRun(owner.c, carId, owner.eventId);
    const setup = await postSetup(owner.c, carId);
    const [tyreSet] = await t.ds.query(`INSERT INTO tyre_sets (car_id, label) VALUES ($1, 'Set B') RETURNING id`, [carId]);
    const [reading] = await t.ds.query(
      `INSERT INTO tread_readings (tyre_set_id, taken_at, created_by) VALUES ($1, '2026-05-01T12:00:00Z', $2) RETURNING id`,
      [tyreSet.id, owner.user.id],
    );
    const keys = [
      ...(await filesOn({ targetType: 'run', targetId: run.id })),
      ...(await filesOn({ targetType: 'setup', targetId: setup.id })),
      ...(await filesOn({ targetType: 'tread_reading', targetId: reading.id })),
    ];
    // A file of someone else's record stays.
    const kept = await filesOn({ targetType: 'run', targetId: w.runId });

    expect((await owner.c.delete(`/api/cars/${carId}`)).status).toBe(204);
    expect(await queued(keys)).toHaveLength(9);
    await sweepAllStoredFiles(t.ds, storage());
    expect(keys.filter(onDisk)).toEqual([]);
    expect(kept.every(onDisk)).toBe(true);
    expect(await queued(kept)).toEqual([]);
  });

  it('when an event is deleted, then the files on it are queued and swept', async () => {
    const event = await w.owner.c.post('/api/events', { name: 'Winter test day', date: '2026-01-10', venue: 'Harrow Flats airfield', conePenaltySec: 2 });
    expect(event.status).toBe(201);
    const keys = await filesOn({ targetType: 'event', targetId: event.body.id });
    await t.ds.query('DELETE FROM events WHERE id = $1', [event.body.id]);
    expect(await queued(keys)).toEqual([...keys].sort());
    await sweepAllStoredFiles(t.ds, storage());
    expect(keys.filter(onDisk)).toEqual([]);
  });

  it('when the deleting transaction rolls back, then nothing is queued and the files stay', async () => {
    const keys = await filesOn({ targetType: 'run', targetId: w.runId });
    const runner = t.ds.createQueryRunner();
    try {
      await runner.startTransaction();
      await runner.query('DELETE FROM runs WHERE id = $1', [w.runId]);
      await runner.rollbackTransaction();
    } finally {
      await runner.release();
    }
    expect(await queued(keys)).toEqual([]);
    await sweepAllStoredFiles(t.ds, storage());
    expect(keys.every(onDisk)).toBe(true);
    expect((await w.owner.c.get(`/api/attachments?targetType=run&targetId=${w.runId}`)).body.count).toBeGreaterThanOrEqual(2);
  });
});

describe('sweeping when the storage refuses', () => {
  it('when a removal fails, then that key stays queued with its error and a later time, the others go, and a later sweep removes it', async () => {
    const setup = await postSetup(w.owner.c, w.owner.carId, { label: 'Refused sweep' });
    const keys = await filesOn({ targetType: 'setup', targetId: setup.id });
    const [stuck, ...rest] = keys as [string, ...string[]];
    const disk = storage();
    const refusing: FileStorage = {
      ...disk,
      async delete(key) {
        if (key === stuck) throw new Error('AccessDenied: the bucket policy refuses deletes');
        await disk.delete(key);
      },
    };
    expect((await w.owner.c.delete(`/api/setups/${setup.id}`)).status).toBe(204);

    await sweepAllStoredFiles(t.ds, refusing);
    expect(rest.filter(onDisk)).toEqual([]);
    expect(onDisk(stuck)).toBe(true);
    const [row] = await t.ds.query(
      `SELECT attempts, last_error, not_before - now() > interval '55 seconds' AS later FROM stored_file_removals WHERE storage_key = $1`,
      [stuck],
    );
    expect(row).toEqual({ attempts: 1, last_error: 'AccessDenied: the bucket policy refuses deletes', later: true });

    // Not due yet: a sweep now leaves it alone, even with a storage that would take it.
    await sweepAllStoredFiles(t.ds, disk);
    expect(onDisk(stuck)).toBe(true);
    // Once due, the next sweep removes it; a second failure would wait twice as long.
    await t.ds.query(`UPDATE stored_file_removals SET not_before = now() WHERE storage_key = $1`, [stuck]);
    await sweepAllStoredFiles(t.ds, disk);
    expect(onDisk(stuck)).toBe(false);
    expect(await queued(keys)).toEqual([]);
  });

  it('when a failure repeats, then each retry waits twice as long as the one before, an hour at most', async () => {
    const key = '7f0c1a52-2d1f-4c1e-9a7a-6f1d2a3b4c5d/original';
    await t.ds.query('INSERT INTO stored_file_removals (storage_key) VALUES ($1)', [key]);
    const failing: FileStorage = { ...storage(), delete: () => Promise.reject(new Error('timeout')) };
    const waits: number[] = [];
    for (let i = 0; i < 8; i++) {
      await t.ds.query(`UPDATE stored_file_removals SET not_before = now() WHERE storage_key = $1`, [key]);
      await sweepStoredFiles(t.ds, failing, { keys: [key] });
      const [row] = await t.ds.query(`SELECT round(extract(epoch FROM not_before - now()) / 60) AS minutes FROM stored_file_removals WHERE storage_key = $1`, [key]);
      waits.push(Number(row.minutes));
    }
    expect(waits).toEqual([1, 2, 4, 8, 16, 32, 60, 60]);
    await sweepStoredFiles(t.ds, storage(), { keys: [key] });
    expect(await queued([key])).toEqual([]);
  });

  it('when a file is deleted and the storage refuses, then the answer is still 204 and its objects stay queued', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'scrubline-refusing-'));
    const disk = diskStorage(dir);
    const refusing = await makeTestApp({ storage: { ...disk, delete: () => Promise.reject(new Error('SlowDown')) } });
    try {
      const world = await attachmentWorld(refusing);
      const up = await upload(world.owner.c, { targetType: 'run', targetId: world.runId }, [{ bytes: await jpeg(32, 32), name: 'a.jpg' }]);
      expect(up.status).toBe(201);
      const keys = keysOf(up.body.items[0]);
      expect((await world.owner.c.delete(`/api/attachments/${up.body.items[0].id}`)).status).toBe(204);
      expect(await queued(keys)).toEqual([...keys].sort());
      // The storage answers again: the sweep takes them.
      await t.ds.query(`UPDATE stored_file_removals SET not_before = now() WHERE storage_key = ANY($1::text[])`, [keys]);
      await sweepAllStoredFiles(t.ds, disk);
      expect(readdirSync(dir)).toEqual([]);
      expect(await queued(keys)).toEqual([]);
    } finally {
      await refusing.close();
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('sweeping from more than one place', () => {
  it('when two sweeps run at once, then each key is removed exactly once', async () => {
    const keys = [...(await filesOn({ targetType: 'run', targetId: w.runId })), ...(await filesOn({ targetType: 'run', targetId: w.runId }))];
    await t.ds.query('DELETE FROM attachments WHERE storage_key = ANY($1::text[])', [keys]);
    const disk = storage();
    const removals = new Map<string, number>();
    const slow: FileStorage = {
      ...disk,
      async delete(key) {
        removals.set(key, (removals.get(key) ?? 0) + 1);
        await new Promise((r) => setTimeout(r, 20));
        await disk.delete(key);
      },
    };
    await Promise.all([sweepStoredFiles(t.ds, slow, { batchSize: 4 }), sweepStoredFiles(t.ds, slow, { batchSize: 4 }), sweepAllStoredFiles(t.ds, slow, 4)]);
    expect(keys.map((k) => removals.get(k))).toEqual(keys.map(() => 1));
    expect(keys.filter(onDisk)).toEqual([]);
  });

  it('when the server\'s sweeper is asked to sweep soon, then it does so without waiting for its interval, and stops cleanly', async () => {
    const keys = await filesOn({ targetType: 'run', targetId: w.runId });
    const sweeper = startFileSweeper(t.ds, storage(), 3_600_000);
    try {
      await t.ds.query('DELETE FROM attachments WHERE storage_key = ANY($1::text[])', [keys]);
      sweeper.soon();
      sweeper.soon();
      await expect.poll(() => keys.filter(onDisk), { timeout: 5000 }).toEqual([]);
    } finally {
      await sweeper.stop();
    }
  });

  it('when the sweeper\'s interval passes, then it sweeps on its own', async () => {
    const keys = await filesOn({ targetType: 'run', targetId: w.runId });
    const sweeper = startFileSweeper(t.ds, storage(), 100);
    try {
      await t.ds.query('DELETE FROM attachments WHERE storage_key = ANY($1::text[])', [keys]);
      // A sweep removes the objects first and their queue rows as its batch commits: both, in time.
      await expect.poll(async () => ({ onDisk: keys.filter(onDisk), queued: await queued(keys) }), { timeout: 5000 }).toEqual({ onDisk: [], queued: [] });
    } finally {
      await sweeper.stop();
    }
  });
});

