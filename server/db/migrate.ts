import { Umzug, SequelizeStorage } from 'umzug';
import type { Sequelize } from 'sequelize';
import { migration as foundation } from './migrations/0001-foundation';
import { migration as accounts } from './migrations/0002-accounts';
import { migration as equipment } from './migrations/0003-equipment';
import { migration as billing } from './migrations/0004-billing';
import { migration as uploads } from './migrations/0005-uploads';
import { migration as comments } from './migrations/0006-comments';
import { migration as certificates } from './migrations/0007-certificates';
import { migration as calibrationNotices } from './migrations/0008-calibration-notices';
import { migration as scaleOut } from './migrations/0009-scale-out';
import { migration as runListKeys } from './migrations/0010-run-list-keys';
import { migration as lz4Analysis } from './migrations/0011-lz4-analysis';

/** Every migration, in order. Add a new file under migrations/ and append it here. */
const MIGRATIONS = [foundation, accounts, equipment, billing, uploads, comments, certificates, calibrationNotices, scaleOut, runListKeys, lz4Analysis];

export function createMigrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: MIGRATIONS.map((m) => ({ name: m.name, up: m.up, down: m.down })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

export async function migrateUp(sequelize: Sequelize): Promise<string[]> {
  const applied = await createMigrator(sequelize).up();
  return applied.map((m) => m.name);
}
