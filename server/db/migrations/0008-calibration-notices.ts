/**
 * What the daily calibration check has already mailed: one row per instrument and due date, so a
 * lab's administrators hear once about each due date however often the check runs (a new due
 * date after recalibration is a new notice).
 */
import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE calibration_notices (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      instrument_id uuid NOT NULL,
      calibration_due date NOT NULL,
      recipients integer NOT NULL CHECK (recipients >= 0),
      sent_at timestamptz NOT NULL DEFAULT now(),
      FOREIGN KEY (organization_id, instrument_id) REFERENCES instruments (organization_id, id) ON DELETE CASCADE,
      UNIQUE (organization_id, instrument_id, calibration_due)
    );
    ALTER TABLE calibration_notices ENABLE ROW LEVEL SECURITY;
    ALTER TABLE calibration_notices FORCE ROW LEVEL SECURITY;
    CREATE POLICY tenant_isolation ON calibration_notices
      USING (organization_id = nullif(current_setting('app.org_id', true), '')::uuid OR current_setting('app.system', true) = 'on')
      WITH CHECK (organization_id = nullif(current_setting('app.org_id', true), '')::uuid OR current_setting('app.system', true) = 'on');
  `);
};

const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE IF EXISTS calibration_notices');
};

export const migration = { name: '0008-calibration-notices', up, down };
