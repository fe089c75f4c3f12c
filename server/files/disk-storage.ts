import { mkdir, readdir, readFile, rename, rm, rmdir, stat, writeFile } from 'node:fs/promises';
import { randomUUID } from 'node:crypto';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { assertStorageKey, isStorageKey, type FileStorage, type StoredObject } from './storage';

/** Relative to the working directory the server starts in; git-ignored with the rest of `.data/`. */
export const DEFAULT_UPLOAD_DIR = '.data/uploads';

/**
 * Files under one folder on this machine's disk. Keys become paths below the root; a key that
 * would leave the root is refused. Writes go to a temporary name first, then are renamed, so a
 * reader never sees half a file.
 */
export function diskStorage(rootDir: string = DEFAULT_UPLOAD_DIR): FileStorage {
  const root = resolve(rootDir);
  const pathOf = (key: string) => {
    assertStorageKey(key);
    const path = resolve(root, key);
    if (!path.startsWith(root + sep)) throw new Error(`Refusing storage key ${JSON.stringify(key)}`);
    return path;
  };
  return {
    kind: 'disk',
    async put(key, bytes) {
      const path = pathOf(key);
      await mkdir(dirname(path), { recursive: true });
      const temporary = `${path}.${randomUUID()}.part`;
      await writeFile(temporary, bytes, { flag: 'wx' });
      await rename(temporary, path);
    },
    async get(key) {
      try {
        return await readFile(pathOf(key));
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
        throw err;
      }
    },
    async delete(key) {
      const path = pathOf(key);
      await rm(path, { force: true });
      // The record's folder (`<attachment id>/`) goes with its last object; one still holding a file stays.
      const folder = dirname(path);
      if (folder !== root) {
        await rmdir(folder).catch((err: NodeJS.ErrnoException) => {
          if (err.code !== 'ENOTEMPTY' && err.code !== 'EEXIST' && err.code !== 'ENOENT') throw err;
        });
      }
    },
    async *list() {
      let entries;
      try {
        entries = await readdir(root, { recursive: true, withFileTypes: true });
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === 'ENOENT') return;
        throw err;
      }
      const page: StoredObject[] = [];
      for (const entry of entries) {
        if (!entry.isFile()) continue;
        const path = join(entry.parentPath, entry.name);
        // A write in progress (`….part`) is not an object yet, and is not a key the server makes.
        const key = relative(root, path).split(sep).join('/');
        if (!isStorageKey(key) || key.endsWith('.part')) continue;
        const info = await stat(path).catch(() => null);
        if (info) page.push({ key, modifiedAt: info.mtime });
        if (page.length === 1000) yield page.splice(0);
      }
      if (page.length > 0) yield page;
    },
  };
}
