import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { diskStorage } from '../../../server/files/disk-storage';

const root = mkdtempSync(join(tmpdir(), 'scrubline-disk-'));
const storage = diskStorage(join(root, 'uploads'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

describe('the disk storage', () => {
  it('when bytes are put, then get answers them, and after delete it answers null', async () => {
    const bytes = Buffer.from([1, 2, 3, 4]);
    await storage.put('0b7e1a52-3c1f-4d8e-9a66-6d2b1f0c9e11/original', bytes, 'image/png');
    expect(await storage.get('0b7e1a52-3c1f-4d8e-9a66-6d2b1f0c9e11/original')).toEqual(bytes);
    await storage.delete('0b7e1a52-3c1f-4d8e-9a66-6d2b1f0c9e11/original');
    expect(await storage.get('0b7e1a52-3c1f-4d8e-9a66-6d2b1f0c9e11/original')).toBeNull();
    // Deleting again is not an error.
    await storage.delete('0b7e1a52-3c1f-4d8e-9a66-6d2b1f0c9e11/original');
  });

  it('when the last object of a folder is deleted, then the folder goes too; one still holding an object stays', async () => {
    const folder = '5d1e2f30-1a2b-4c3d-8e9f-0a1b2c3d4e5f';
    await storage.put(`${folder}/original`, Buffer.from([1]), 'image/png');
    await storage.put(`${folder}/thumbnail`, Buffer.from([2]), 'image/webp');
    await storage.delete(`${folder}/thumbnail`);
    expect(existsSync(join(root, 'uploads', folder))).toBe(true);
    await storage.delete(`${folder}/original`);
    expect(existsSync(join(root, 'uploads', folder))).toBe(false);
    // The root itself is never removed, even when empty.
    expect(existsSync(join(root, 'uploads'))).toBe(true);
  });

  it.each(['../escape', 'a/../../escape', '/etc/passwd', 'a/./b', 'A/Original', 'a\\..\\b', '', 'a//b', 'name with space'])(
    'when the key is %j, then it is refused before the disk is touched',
    async (key) => {
      await expect(storage.put(key, Buffer.from('x'), 'text/plain')).rejects.toThrow(/Refusing storage key/);
      await expect(storage.get(key)).rejects.toThrow(/Refusing storage key/);
      await expect(storage.delete(key)).rejects.toThrow(/Refusing storage key/);
    },
  );

  it('when a key is refused, then nothing was written outside the root', () => {
    expect(existsSync(join(root, 'escape'))).toBe(false);
  });
});
