import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { createLocalDiskStorage, PARTIAL_FOLDER } from './local-disk-storage';
import { StorageError, storageErrorFrom } from './file-storage';
import { storageKey } from './storage-key';

let root: string;
beforeEach(async () => {
  root = await fs.mkdtemp(path.join(os.tmpdir(), 'sidecheck-storage-'));
});
afterEach(() => fs.rm(root, { recursive: true, force: true }));

/** Every file under a folder, relative, sorted (empty folders do not count). */
async function filesUnder(dir: string): Promise<string[]> {
  const entries = await fs.readdir(dir, { recursive: true, withFileTypes: true });
  return entries.filter((e) => e.isFile()).map((e) => path.relative(dir, path.join(e.parentPath, e.name))).sort();
}

async function text(stream: Readable): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

describe('local disk storage', () => {
  it('puts, stats, gets and deletes by key, bytes unchanged', async () => {
    const storage = createLocalDiskStorage(root);
    const key = storageKey('uploads', 'org-1', 'upload-1', 'file');
    const stored = await storage.put(key, { stream: Readable.from([Buffer.from('frequency_hz,level_dbm\n'), Buffer.from('1,2\n')]) });
    expect(stored.sizeBytes).toBe(27);
    expect((await storage.stat(key))?.sizeBytes).toBe(27);
    expect(await text(await storage.get(key))).toBe('frequency_hz,level_dbm\n1,2\n');
    expect(await filesUnder(root)).toEqual([path.join('uploads', 'org-1', 'upload-1', 'file')]);
    await storage.delete(key);
    await storage.delete(key); // idempotent
    expect(await storage.stat(key)).toBeNull();
    await expect(storage.get(key)).rejects.toMatchObject({ reason: 'not-found' });
    expect(await filesUnder(root)).toEqual([]);
  });

  it('moves a local file in and refuses to overwrite a key', async () => {
    const storage = createLocalDiskStorage(root);
    const incoming = path.join(root, 'incoming.bin');
    await fs.writeFile(incoming, Buffer.from([1, 2, 3]));
    await storage.put('a/b', { moveFrom: incoming });
    await expect(fs.access(incoming)).rejects.toThrow();
    await expect(storage.put('a/b', { stream: Readable.from([Buffer.from('x')]) })).rejects.toMatchObject({ reason: 'exists' });
    expect(await text(await storage.get('a/b'))).toBe('\u0001\u0002\u0003');
  });

  it('a stream that fails half way leaves nothing behind', async () => {
    const storage = createLocalDiskStorage(root);
    const failing = new Readable({
      read() {
        this.push(Buffer.alloc(1000));
        this.destroy(new Error('connection reset'));
      },
    });
    await expect(storage.put('a/b', { stream: failing })).rejects.toBeInstanceOf(StorageError);
    expect(await storage.stat('a/b')).toBeNull();
    expect(await filesUnder(root)).toEqual([]);
    expect(await fs.readdir(path.join(root, PARTIAL_FOLDER))).toEqual([]);
  });

  it.each(['../etc/passwd', '/etc/passwd', 'a//b', 'a/../../b', 'A/b', 'a/b/', '.partial/x', 'a\\b', 'a/\u0000'])('refuses the key %j', async (key) => {
    const storage = createLocalDiskStorage(root);
    await expect(storage.put(key, { stream: Readable.from([Buffer.from('x')]) })).rejects.toMatchObject({ reason: 'invalid-key' });
    await expect(storage.get(key)).rejects.toMatchObject({ reason: 'invalid-key' });
    expect(await filesUnder(root)).toEqual([]);
  });

  it.each([
    ['ENOSPC', 'no-space'],
    ['EDQUOT', 'no-space'],
    ['ENOENT', 'not-found'],
    ['EEXIST', 'exists'],
    ['EACCES', 'failed'],
  ])('classifies %s as %s (POSIX errno meanings)', (code, reason) => {
    const error = storageErrorFrom(Object.assign(new Error('os'), { code }), 'store', 'a/b');
    expect(error.reason).toBe(reason);
    expect(error.message).not.toContain(root);
  });

  it('a folder that cannot be created is a clear failure, not a crash', async () => {
    const blocked = path.join(root, 'not-a-folder');
    await fs.writeFile(blocked, 'x');
    const storage = createLocalDiskStorage(blocked);
    await expect(storage.put('a/b', { stream: Readable.from([Buffer.from('x')]) })).rejects.toMatchObject({ reason: 'failed' });
  });
});
