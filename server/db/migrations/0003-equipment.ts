/**
 * Equipment used in a run, and the indexes the lab's records need at volume.
 *
 * `run_instruments` links a test run to the instruments on the bench (ISO/IEC 17025:2017 6.4.13
 * equipment records and 7.5.1 technical records; clause wording from memory). Its foreign keys carry organization_id, so a
 * row can only ever join a run and an instrument of the same organization, even if a bug in the
 * application tried otherwise; row-level security is the same tenant policy as every other table.
 */
import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    -- Targets for the same-organization foreign keys below.
    ALTER TABLE instruments ADD CONSTRAINT instruments_org_id UNIQUE (organization_id, id);
    ALTER TABLE test_runs ADD CONSTRAINT test_runs_org_id UNIQUE (organization_id, id);

    CREATE TABLE run_instruments (
      organization_id uuid NOT NULL REFERENCES organizations(id),
      run_id uuid NOT NULL,
      instrument_id uuid NOT NULL,
      assigned_by uuid REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (organization_id, run_id, instrument_id),
      FOREIGN KEY (organization_id, run_id) REFERENCES test_runs (organization_id, id),
      FOREIGN KEY (organization_id, instrument_id) REFERENCES instruments (organization_id, id)
    );
    CREATE INDEX run_instruments_org_instrument ON run_instruments (organization_id, instrument_id);
    ALTER TABLE run_instruments ENABLE ROW LEVEL SECURITY;
    ALTER TABLE run_instruments FORCE ROW LEVEL SECURITY;
    CREATE POLICY tenant_isolation ON run_instruments
      USING (organization_id = nullif(current_setting('app.org_id', true), '')::uuid
             OR current_setting('app.system', true) = 'on')
      WITH CHECK (organization_id = nullif(current_setting('app.org_id', true), '')::uuid
             OR current_setting('app.system', true) = 'on');

    -- The equipment register: one record per physical instrument, sortable by name.
    CREATE UNIQUE INDEX instruments_org_model_serial ON instruments (organization_id, model, serial_number);
    CREATE INDEX instruments_org_name ON instruments (organization_id, name);

    -- "Does this device appear on an issued report?": device -> plans -> runs -> reports.
    CREATE INDEX test_plans_org_device ON test_plans (organization_id, device_id);
    CREATE INDEX test_runs_org_plan ON test_runs (organization_id, plan_id);
    CREATE INDEX reports_org_run ON reports (organization_id, run_id);
  `);
};

const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP INDEX IF EXISTS reports_org_run, test_runs_org_plan, test_plans_org_device, instruments_org_name, instruments_org_model_serial;
    DROP TABLE IF EXISTS run_instruments;
    ALTER TABLE test_runs DROP CONSTRAINT IF EXISTS test_runs_org_id;
    ALTER TABLE instruments DROP CONSTRAINT IF EXISTS instruments_org_id;
  `);
};

export const migration = { name: '0003-equipment', up, down };
