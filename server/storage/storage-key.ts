import { StorageError } from './file-storage';

// Lower-case letters, digits and dashes, with dots only inside a segment: no "..", no "/" at the
// ends, no empty segments, nothing a file system or an object store reads specially.
const SEGMENT = /^[a-z0-9](?:[a-z0-9-]|\.(?!\.))*$/;
const MAX_KEY_LENGTH = 512;

/**
 * Builds a storage key from segments the server chose (ids, fixed words), e.g.
 * `uploads/<organization id>/<upload id>/file`. Every segment is checked, so a key can never climb
 * out of the store's root (`..`), name an absolute path or carry a client's file name unchecked.
 *
 * @throws StorageError 'invalid-key' naming the offending segment.
 * @example storageKey('uploads', 'b5e…', 'file') // 'uploads/b5e…/file'
 */
export function storageKey(...segments: string[]): string {
  const key = segments.join('/');
  assertStorageKey(key);
  return key;
}

/** Checks a key built elsewhere (or read back from the database) before it is used. */
export function assertStorageKey(key: string): void {
  if (typeof key !== 'string' || key.length === 0 || key.length > MAX_KEY_LENGTH) {
    throw new StorageError('invalid-key', `storage: a key must be 1 to ${MAX_KEY_LENGTH} characters`);
  }
  for (const segment of key.split('/')) {
    if (!SEGMENT.test(segment)) {
      throw new StorageError('invalid-key', `storage: key segment "${segment.slice(0, 40)}" is not allowed`);
    }
  }
}
