import fs from 'node:fs/promises';
import path from 'node:path';
import type { UploadFormat } from '../../shared/schemas/uploads';
import type { ReceivedUpload } from './receive-multipart';

const EXTENSION: Record<UploadFormat, string> = { 'trace-csv': 'csv', sigmf: 'sigmf-meta', wav: 'wav', cf32: 'cf32', ci16: 'ci16' };

export interface PlacedParts {
  filePath: string;
  dataPath: string | null;
}

/**
 * Gives the received parts the names the readers expect, inside the request's own folder:
 * `file.<ext>` for the identified format and `file.sigmf-data` beside SigMF metadata (the SigMF
 * pair convention the command line's reader follows). These names are ours: an importer's
 * message then reads "file.sigmf-data: ...", matching the multipart part the sender used.
 */
export async function placeParts(received: ReceivedUpload, format: UploadFormat): Promise<PlacedParts> {
  const filePath = path.join(received.folder, `file.${EXTENSION[format]}`);
  await fs.rename(received.file!.path, filePath);
  let dataPath: string | null = null;
  if (received.data) {
    dataPath = path.join(received.folder, 'file.sigmf-data');
    await fs.rename(received.data.path, dataPath);
  }
  return { filePath, dataPath };
}
