import crypto from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import { HEAD_BYTES } from './hashing-disk-engine';
import type { ReceivedUpload } from './receive-multipart';

/**
 * A file made on the server (the demo seed's invented trace) as if it had been uploaded: written
 * into a folder of its own under the incoming folder with its SHA-256, so it takes exactly the
 * path of a real upload from identification to storage. Text fields are given as text, as
 * multipart would carry them.
 */
export async function receiveLocalFile(incomingDir: string, file: { name: string; bytes: Buffer; contentType?: string }, fields: Record<string, string>): Promise<ReceivedUpload> {
  const folder = path.join(incomingDir, crypto.randomUUID());
  await fs.mkdir(folder, { recursive: true });
  const filePath = path.join(folder, `part-file-${crypto.randomUUID()}`);
  await fs.writeFile(filePath, file.bytes, { flag: 'wx' });
  return {
    fields,
    file: { field: 'file', path: filePath, sizeBytes: file.bytes.length, sha256: crypto.createHash('sha256').update(file.bytes).digest('hex'), head: file.bytes.subarray(0, HEAD_BYTES), originalName: file.name, contentType: file.contentType ?? 'application/octet-stream' },
    data: null,
    folder,
    discard: () => fs.rm(folder, { recursive: true, force: true }),
  };
}
