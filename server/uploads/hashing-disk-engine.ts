import crypto from 'node:crypto';
import { createWriteStream } from 'node:fs';
import fs from 'node:fs/promises';
import path from 'node:path';
import { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { StorageEngine } from 'multer';

/** Bytes of the start of each file kept in memory for type detection and header parsing. */
export const HEAD_BYTES = 64 * 1024;

/** What the engine adds to multer's file record. */
export interface HashedFile {
  path: string;
  size: number;
  sha256: string;
  head: Buffer;
}

/**
 * A multer storage engine that streams each file part to its own new file in `folder` (named
 * by the server: the part's field name, never the client's file name), computing its SHA-256
 * and size on the way and keeping only the first HEAD_BYTES in memory, so memory stays bounded
 * whatever the file size. Multer calls `_removeFile` when a request fails (a size limit, a bad
 * part), so an aborted upload leaves nothing behind.
 */
export function hashingDiskEngine(folder: string): StorageEngine {
  return {
    _handleFile(_req, file, callback) {
      const target = path.join(folder, `part-${file.fieldname === 'data' ? 'data' : 'file'}-${crypto.randomUUID()}`);
      const hash = crypto.createHash('sha256');
      const head: Buffer[] = [];
      let size = 0;
      let headLength = 0;
      const tap = new Transform({
        transform(chunk: Buffer, _encoding, done) {
          hash.update(chunk);
          size += chunk.length;
          if (headLength < HEAD_BYTES) {
            const take = chunk.subarray(0, HEAD_BYTES - headLength);
            head.push(Buffer.from(take));
            headLength += take.length;
          }
          done(null, chunk);
        },
      });
      pipeline(file.stream, tap, createWriteStream(target, { flags: 'wx' }))
        .then(() => callback(null, { path: target, size, sha256: hash.digest('hex'), head: Buffer.concat(head) } as Partial<Express.Multer.File>))
        .catch(async (error: unknown) => {
          await fs.rm(target, { force: true });
          callback(error);
        });
    },
    _removeFile(_req, file, callback) {
      fs.rm(file.path, { force: true }).then(() => callback(null), callback);
    },
  };
}
