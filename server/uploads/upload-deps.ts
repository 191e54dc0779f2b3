import path from 'node:path';
import type { Sequelize } from 'sequelize';
import type { FileStorage } from '../storage/file-storage';
import { createLocalDiskStorage } from '../storage/local-disk-storage';
import { uploadSettingsFromEnv, type UploadSettings } from './upload-settings';

/** What the upload routes need: the database, the file store, the limits, a folder for arriving bytes. */
export interface UploadDeps {
  sequelize: Sequelize;
  storage: FileStorage;
  settings: UploadSettings;
  /** Arriving files wait here (same file system as the store, so storing them is a rename). */
  incomingDir: string;
}

/**
 * The deployment's upload setup from the environment: local-disk storage under the data folder,
 * arriving files in its `.incoming` folder (never a storage key: keys cannot start with a dot).
 * A deployment with an S3-compatible store builds UploadDeps with its own FileStorage instead.
 */
export function uploadDepsFromEnv(sequelize: Sequelize, env: NodeJS.ProcessEnv = process.env): UploadDeps {
  const settings = uploadSettingsFromEnv(env);
  return { sequelize, settings, storage: createLocalDiskStorage(settings.dataDir), incomingDir: path.join(settings.dataDir, '.incoming') };
}
