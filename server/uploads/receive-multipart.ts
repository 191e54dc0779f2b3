import crypto from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import type { Request, Response } from 'express';
import multer, { MulterError } from 'multer';
import { badRequest, payloadTooLarge, Problem, unsupportedMediaType, validationFailed } from '../http/problem';
import { storageErrorFrom } from '../storage/file-storage';
import { hashingDiskEngine, type HashedFile } from './hashing-disk-engine';
import { formatBytes, storageProblem } from './upload-problems';

/** One file part as received: where its bytes are now, and what the sender said about it. */
export interface ReceivedPart {
  field: 'file' | 'data';
  path: string;
  sizeBytes: number;
  sha256: string;
  /** The first bytes (64 KiB at most), for type detection and headers. */
  head: Buffer;
  /** As sent (with any folders in it): checked and sanitized before it is kept. */
  originalName: string;
  /** As sent; never trusted, only compared with the bytes. */
  contentType: string;
}

export interface ReceivedUpload {
  fields: Record<string, unknown>;
  file: ReceivedPart | null;
  data: ReceivedPart | null;
  /** The request's own folder under the incoming folder. */
  folder: string;
  /** Removes whatever of the request is still in the incoming folder. */
  discard(): Promise<void>;
}

/**
 * Reads a multipart/form-data request: text fields into memory (small, bounded), the `file`
 * part (and `data` when allowed) streamed to a folder of its own under `incomingDir`, with SHA-256
 * and size. Limits: maxFileBytes per file (413), 10 text fields of at most 200 characters, no
 * other file fields (422). A request that is not multipart is refused with 415. On any failure the
 * request's folder is removed before the problem is thrown, so nothing is left behind.
 */
export async function receiveMultipart(req: Request, res: Response, options: { incomingDir: string; maxFileBytes: number; allowData: boolean }): Promise<ReceivedUpload> {
  if (!req.is('multipart/form-data')) {
    throw unsupportedMediaType('Send the upload as multipart/form-data, with the file in the field "file".');
  }
  const folder = path.join(options.incomingDir, crypto.randomUUID());
  const discard = () => fs.rm(folder, { recursive: true, force: true });
  try {
    await fs.mkdir(folder, { recursive: true });
    const fileFields = [{ name: 'file', maxCount: 1 }, ...(options.allowData ? [{ name: 'data', maxCount: 1 }] : [])];
    const middleware = multer({
      storage: hashingDiskEngine(folder),
      preservePath: true, // so a name with folders in it can be seen, and refused
      limits: { fileSize: options.maxFileBytes, files: fileFields.length, fields: 10, fieldSize: 200, fieldNameSize: 40, parts: 12 },
    }).fields(fileFields);
    await new Promise<void>((resolve, reject) => middleware(req, res, (error?: unknown) => (error ? reject(error) : resolve())));
  } catch (error) {
    await discard();
    throw toProblem(error, options);
  }
  const files = (req.files ?? {}) as Record<string, (Express.Multer.File & HashedFile)[]>;
  const part = (field: 'file' | 'data'): ReceivedPart | null => {
    const f = files[field]?.[0];
    return f ? { field, path: f.path, sizeBytes: f.size, sha256: f.sha256, head: f.head, originalName: f.originalname, contentType: f.mimetype } : null;
  };
  return { fields: { ...(req.body as Record<string, unknown>) }, file: part('file'), data: part('data'), folder, discard };
}

function toProblem(error: unknown, options: { maxFileBytes: number; allowData: boolean }): Problem {
  if (error instanceof Problem) return error;
  if (error instanceof MulterError) {
    const field = error.field ?? '';
    switch (error.code) {
      case 'LIMIT_FILE_SIZE':
        return payloadTooLarge(`The "${field}" part is larger than ${formatBytes(options.maxFileBytes)}, the most the server accepts. Nothing was stored.`);
      case 'LIMIT_UNEXPECTED_FILE': {
        const expected = options.allowData ? '"file" (and the SigMF samples as "data")' : '"file"';
        return validationFailed(`Unexpected file part "${field}": send the file as ${expected}.`, [{ pointer: `/${field}`, message: 'is not a file part of this request' }]);
      }
      case 'LIMIT_FIELD_VALUE':
        return validationFailed(`The field "${field}" is too long.`, [{ pointer: `/${field}`, message: 'is too long' }]);
      default:
        return validationFailed(`The multipart request has too many or too long parts (${error.code}).`);
    }
  }
  const code = (error as { code?: string } | null)?.code;
  if (code && /^E[A-Z]+$/.test(code)) return storageProblem(storageErrorFrom(error, 'receive', 'the upload'));
  return badRequest(`The multipart body could not be read: ${error instanceof Error ? error.message : 'malformed'}.`);
}
