/**
 * Where attachment bytes live. Keys are made by the server (`<attachment id>/original`,
 * `<attachment id>/thumbnail`), never from what a user typed or named a file, and the
 * stored objects are reached only through the access-checked API: nothing is public.
 */
export interface FileStorage {
  /** Stores the bytes under the key, replacing anything already there. */
  put(key: string, bytes: Buffer, contentType: string): Promise<void>;
  /** The bytes under the key, or null when nothing is stored there. */
  get(key: string): Promise<Buffer | null>;
  /** Removes the object; removing a key that holds nothing is not an error. */
  delete(key: string): Promise<void>;
  /**
   * Every stored object, with when it was last written, a page at a time (for the storage check; no
   * request uses it). Only keys the server could have made are listed; anything else is not ours.
   */
  list(): AsyncIterable<StoredObject[]>;
  /** For logs and docs: "disk" or "s3". */
  readonly kind: 'disk' | 's3';
}

export interface StoredObject {
  key: string;
  modifiedAt: Date;
}

/** Whether the key is one the server could have made (see assertStorageKey). */
export function isStorageKey(key: string): boolean {
  try {
    assertStorageKey(key);
    return true;
  } catch {
    return false;
  }
}

/** Lower-case letters, digits, dashes and dots in `/`-separated segments; no `.` or `..` segment. */
const KEY_PATTERN = /^[a-z0-9][a-z0-9.-]*(\/[a-z0-9][a-z0-9.-]*)*$/;

/** Refuses any key the server would not have made (path traversal, absolute paths, odd characters). */
export function assertStorageKey(key: string): void {
  if (key.length > 200 || !KEY_PATTERN.test(key) || key.split('/').some((part) => part === '.' || part === '..' || part.includes('..'))) {
    throw new Error(`Refusing storage key ${JSON.stringify(key)}`);
  }
}
