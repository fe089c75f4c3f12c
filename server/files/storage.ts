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
  /** For logs and docs: "disk" or "s3". */
  readonly kind: 'disk' | 's3';
}

/** Lower-case letters, digits, dashes and dots in `/`-separated segments; no `.` or `..` segment. */
const KEY_PATTERN = /^[a-z0-9][a-z0-9.-]*(\/[a-z0-9][a-z0-9.-]*)*$/;

/** Refuses any key the server would not have made (path traversal, absolute paths, odd characters). */
export function assertStorageKey(key: string): void {
  if (key.length > 200 || !KEY_PATTERN.test(key) || key.split('/').some((part) => part === '.' || part === '..' || part.includes('..'))) {
    throw new Error(`Refusing storage key ${JSON.stringify(key)}`);
  }
}
