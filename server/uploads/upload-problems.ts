/**
 * The problems an upload can answer with, beside the shared factories of server/http/problem.ts:
 * a file the importers refuse (422, naming the part and the line or byte offset), a capture the
 * engine cannot analyse (422), and storage that is full (507) or failing (500). Each says that
 * nothing was stored, which the upload path guarantees.
 */
import { Problem } from '../http/problem';
import { StorageError } from '../storage/file-storage';

export interface ImportLocation {
  part: 'file' | 'data';
  line?: number;
  column?: number;
  byteOffset?: number;
}

/** A bad file: the importer's message as detail, and where in which part the problem is. */
export class ImportProblem extends Problem {
  readonly location: ImportLocation;

  constructor(message: string, location: ImportLocation) {
    super({ status: 422, code: 'import-failed', title: 'The file could not be read', detail: `${message} Nothing was stored.`, errors: [{ pointer: `/${location.part}`, message }] });
    this.location = location;
  }

  override toJSON(instance?: string) {
    return { ...super.toJSON(instance), location: this.location };
  }
}

/** A file that reads but cannot be analysed (no signal, too few samples). */
export const analysisFailed = (part: 'file' | 'data', message: string) =>
  new Problem({ status: 422, code: 'analysis-failed', title: 'The file could not be analysed', detail: `${message} Nothing was stored.`, errors: [{ pointer: `/${part}`, message }] });

/** The file is fine but cannot decide this test case, or a parameter it needs is missing. */
export const notEvaluable = (message: string) =>
  new Problem({ status: 422, code: 'not-evaluable', title: 'The upload cannot be evaluated', detail: `${message} Nothing was stored.` });

/** A storage failure as a problem: full (507 Insufficient Storage, RFC 4918 11.5) or failing (500). */
export function storageProblem(error: StorageError): Problem {
  if (error.reason === 'no-space') {
    return new Problem({ status: 507, code: 'insufficient-storage', title: 'Storage is full', detail: 'The server has no room to keep this file right now. Nothing was stored; try again later or tell the lab administrator.' });
  }
  return new Problem({ status: 500, code: 'storage-failed', title: 'Storage failed', detail: 'The server could not store the file. Nothing was stored; try again, and tell the lab administrator if it happens again.' });
}

/** Sizes for messages: "200 MB", "64 kB", "512 bytes" (SI prefixes). */
export function formatBytes(bytes: number): string {
  if (bytes >= 1e6) return `${Number((bytes / 1e6).toFixed(1))} MB`;
  if (bytes >= 1e3) return `${Number((bytes / 1e3).toFixed(1))} kB`;
  return `${bytes} bytes`;
}
