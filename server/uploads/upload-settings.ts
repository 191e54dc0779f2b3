/**
 * Limits and places of uploads, read once from the environment when the routes are built. The
 * data folder is the one the server configuration names (SIDECHECK_DATA_DIR, by default
 * `.data/files` in the project); every limit has a default that suits a bench and can be set.
 */
import path from 'node:path';
import { projectRoot } from '../config/project-root';
import { wholeNumberSetting } from '../config/whole-number-setting';

export interface UploadSettings {
  /** Root of the local file store (storage keys live below it). */
  dataDir: string;
  /** Largest single file accepted, bytes (SIDECHECK_UPLOAD_MAX_BYTES, default 200 MB). */
  maxFileBytes: number;
  /** Largest trace CSV, bytes: a CSV is parsed whole (SIDECHECK_TRACE_MAX_BYTES, default 16 MB). */
  maxTraceBytes: number;
  /** Largest file of a manufacturer's pre-check (SIDECHECK_PRECHECK_MAX_BYTES, default 50 MB). */
  maxPrecheckBytes: number;
  /** Pre-checks one person may run per hour (SIDECHECK_PRECHECK_PER_HOUR, default 20). */
  precheckPerHour: number;
}

const MB = 1_000_000;

const positiveInteger = (env: NodeJS.ProcessEnv, name: string, fallback: number): number => wholeNumberSetting(env, name, fallback, { min: 1 });

/** @example uploadSettingsFromEnv({ SIDECHECK_UPLOAD_MAX_BYTES: '1000' }).maxFileBytes // 1000 */
export function uploadSettingsFromEnv(env: NodeJS.ProcessEnv = process.env): UploadSettings {
  return {
    dataDir: env.SIDECHECK_DATA_DIR ?? path.join(projectRoot(), '.data', 'files'),
    maxFileBytes: positiveInteger(env, 'SIDECHECK_UPLOAD_MAX_BYTES', 200 * MB),
    maxTraceBytes: positiveInteger(env, 'SIDECHECK_TRACE_MAX_BYTES', 16 * MB),
    maxPrecheckBytes: positiveInteger(env, 'SIDECHECK_PRECHECK_MAX_BYTES', 50 * MB),
    precheckPerHour: positiveInteger(env, 'SIDECHECK_PRECHECK_PER_HOUR', 20),
  };
}
