/**
 * The work a request would otherwise do on the event loop for tens of milliseconds: Argon2id
 * password hashing and reading a trace CSV. It runs in the worker threads of heavy-pool.ts,
 * which run at a lower scheduling priority, so under load the requests that only read and write
 * the database keep their latency (see DEVELOPERS.md, "Heavy work off the event loop").
 *
 * Results and errors must cross a thread boundary by structured clone, which keeps neither an
 * error's class nor its extra fields: an importer's complaint comes back as data.
 */
import fs from 'node:fs';
import { hashSync, verifySync } from '@node-rs/argon2';
import { ImportError } from '../../shared/import/import-error';
import { summariseTrace, type TracePlacement } from '../analysis/summarise-trace';

export type HeavyTask =
  | { kind: 'hash-password'; password: string }
  | { kind: 'verify-password'; hash: string; password: string }
  | { kind: 'read-trace'; filePath: string; placement: TracePlacement };

/** An ImportError as data: its message already names the importer and the location. */
export interface ImportErrorData {
  message: string;
  line?: number;
  column?: number;
  byteOffset?: number;
}

export default function heavyWork(task: HeavyTask): unknown {
  switch (task.kind) {
    case 'hash-password':
      // Argon2id with the library's defaults (m = 19 MiB, t = 2, p = 1: OWASP's minimum recommendation).
      return hashSync(task.password);
    case 'verify-password':
      try {
        return verifySync(task.hash, task.password);
      } catch {
        return false; // a malformed stored hash is a failed sign-in, never a 500
      }
    case 'read-trace':
      try {
        return { trace: summariseTrace(fs.readFileSync(task.filePath, 'utf8'), task.placement) };
      } catch (error) {
        if (!(error instanceof ImportError)) throw error;
        const data: ImportErrorData = { message: error.message, line: error.line, column: error.column, byteOffset: error.byteOffset };
        return { importError: data };
      }
  }
}
