import crypto from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import fs from 'node:fs/promises';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import type { Readable } from 'node:stream';
import { StorageError, storageErrorFrom, type FileStorage, type StorageSource, type StoredObjectInfo } from './file-storage';
import { assertStorageKey } from './storage-key';

/** Folder under the root for bytes still being written; never a key (keys cannot start with '.'). */
export const PARTIAL_FOLDER = '.partial';

/**
 * A FileStorage on the local disk under `rootDir` (the configured data folder). A put writes to
 * `<root>/.partial/<random>` first, flushes it, then renames it into place, so a reader never
 * sees half a file and a failed write leaves nothing behind; a `moveFrom` source on the same file
 * system is renamed in without copying. The key is resolved inside the root and checked again
 * after resolution (defence in depth on top of the key syntax).
 *
 * @example const storage = createLocalDiskStorage('/srv/sidecheck/files');
 * await storage.put('uploads/org/id/file', { stream: fs.createReadStream(tmp) });
 */
export function createLocalDiskStorage(rootDir: string): FileStorage {
  const root = path.resolve(rootDir);
  const partialDir = path.join(root, PARTIAL_FOLDER);

  function pathOf(key: string): string {
    assertStorageKey(key);
    const target = path.resolve(root, ...key.split('/'));
    if (!target.startsWith(root + path.sep)) throw new StorageError('invalid-key', 'storage: the key leaves the storage root');
    return target;
  }

  async function info(key: string, target: string): Promise<StoredObjectInfo> {
    const s = await fs.stat(target);
    return { key, sizeBytes: s.size, modifiedAt: s.mtime };
  }

  async function writePartial(stream: Readable): Promise<string> {
    await fs.mkdir(partialDir, { recursive: true });
    const partial = path.join(partialDir, crypto.randomUUID());
    try {
      await pipeline(stream, createWriteStream(partial, { flags: 'wx' }));
      const handle = await fs.open(partial, 'r+');
      await handle.sync().finally(() => handle.close());
      return partial;
    } catch (error) {
      await fs.rm(partial, { force: true });
      throw error;
    }
  }

  return {
    async put(key: string, source: StorageSource): Promise<StoredObjectInfo> {
      const target = pathOf(key);
      let written: string | null = null;
      try {
        if (await exists(target)) throw new StorageError('exists', `storage: ${key} already exists`);
        await fs.mkdir(path.dirname(target), { recursive: true });
        written = 'stream' in source ? await writePartial(source.stream) : source.moveFrom;
        await fs.rename(written, target).catch(async (error: { code?: string }) => {
          if (error.code !== 'EXDEV') throw error;
          // Another file system: copy through a partial file, then remove the original.
          const copied = await writePartial(createReadStream(written!));
          await fs.rename(copied, target);
          await fs.rm(written!, { force: true });
        });
        return await info(key, target);
      } catch (error) {
        // A stream source leaves no partial file behind; a moved-in file stays with its owner.
        if (written && 'stream' in source) await fs.rm(written, { force: true });
        throw storageErrorFrom(error, 'store', key);
      }
    },

    async get(key: string): Promise<Readable> {
      const target = pathOf(key);
      try {
        await fs.access(target);
      } catch (error) {
        throw storageErrorFrom(error, 'read', key);
      }
      return createReadStream(target);
    },

    async stat(key: string): Promise<StoredObjectInfo | null> {
      const target = pathOf(key);
      try {
        return await info(key, target);
      } catch (error) {
        if ((error as { code?: string }).code === 'ENOENT') return null;
        throw storageErrorFrom(error, 'inspect', key);
      }
    },

    async delete(key: string): Promise<void> {
      const target = pathOf(key);
      try {
        await fs.rm(target, { force: true });
        // Leave no empty folder behind (rmdir refuses a folder that still holds something).
        await fs.rmdir(path.dirname(target)).catch(() => undefined);
      } catch (error) {
        throw storageErrorFrom(error, 'delete', key);
      }
    },
  };
}

async function exists(target: string): Promise<boolean> {
  try {
    await fs.access(target);
    return true;
  } catch {
    return false;
  }
}
