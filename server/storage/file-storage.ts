/**
 * Where raw files live: a key-value store of byte streams. The application only ever names
 * objects by keys it builds itself (see storage-key.ts), so nothing a client sends becomes part of
 * a path. The local-disk implementation keeps them under the configured data folder; an
 * S3-compatible store fits behind the same four methods (put = PutObject from a stream, get =
 * GetObject, stat = HeadObject, delete = DeleteObject).
 */
import type { Readable } from 'node:stream';

/** The bytes to store: a stream, or a local file the store may move in (then it is gone). */
export type StorageSource = { stream: Readable } | { moveFrom: string };

export interface StoredObjectInfo {
  key: string;
  sizeBytes: number;
  modifiedAt: Date;
}

export interface FileStorage {
  /** Stores the bytes under `key`, whole or not at all; refuses a key that exists ('exists'). */
  put(key: string, source: StorageSource): Promise<StoredObjectInfo>;
  /** The stored bytes, unchanged; 'not-found' for an unknown key. */
  get(key: string): Promise<Readable>;
  /** Size and time of an object, or null when there is none. */
  stat(key: string): Promise<StoredObjectInfo | null>;
  /** Removes an object; removing one that is not there is not an error. */
  delete(key: string): Promise<void>;
}

export type StorageFailure = 'not-found' | 'exists' | 'no-space' | 'invalid-key' | 'failed';

/** A storage operation that did not happen; `reason` is what the caller can act on. */
export class StorageError extends Error {
  constructor(
    readonly reason: StorageFailure,
    message: string,
    override readonly cause?: unknown,
  ) {
    super(message);
    this.name = 'StorageError';
  }
}

const NO_SPACE = new Set(['ENOSPC', 'EDQUOT', 'EFBIG']);

/**
 * Turns an operating-system error into a StorageError: ENOSPC/EDQUOT/EFBIG mean the store is full
 * ('no-space', which the API answers with 507), ENOENT 'not-found', EEXIST 'exists', anything else
 * 'failed'. The message names the action and the key, never a file-system path.
 * @example storageErrorFrom(Object.assign(new Error('x'), { code: 'ENOSPC' }), 'put', 'a/b').reason // 'no-space'
 */
export function storageErrorFrom(error: unknown, action: string, key: string): StorageError {
  if (error instanceof StorageError) return error;
  const code = (error as { code?: string } | null)?.code ?? '';
  if (NO_SPACE.has(code)) return new StorageError('no-space', `storage: no space left to ${action} ${key}`, error);
  if (code === 'ENOENT') return new StorageError('not-found', `storage: ${key} was not found`, error);
  if (code === 'EEXIST') return new StorageError('exists', `storage: ${key} already exists`, error);
  return new StorageError('failed', `storage: could not ${action} ${key} (${code || 'error'})`, error);
}
