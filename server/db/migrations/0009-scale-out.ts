/**
 * What the load benchmark (bench/load.ts) asked of the schema.
 *
 * Run lists take their page from test_runs before joining (server/runs/routes.ts), ordered by the
 * sort column and then the id in the same direction; these indexes hold exactly that order, so a
 * page is a short index range instead of a sort of every run of the lab. The (organization_id,
 * updated_at, id) index takes over from (organization_id, updated_at DESC): a btree serves both
 * directions.
 *
 * The standard tenant policy (organization_id = the transaction's app.org_id, or the system switch)
 * is restated with each setting in a scalar subquery: PostgreSQL then reads the settings once per
 * statement (an InitPlan) instead of once per row, which made counting a lab's 10,000 runs about
 * three times slower than the scan itself. Which rows pass is unchanged. Only policies that still
 * have the standard text are restated (a table with a policy of its own keeps it).
 *
 * `precheck_starts` counts the manufacturers' pre-checks per person in PostgreSQL, so every API
 * process shares the hourly allowance (server/uploads/precheck-limiter.ts), as sign_in_failures
 * does for sign-ins. It holds no tenant data (a person and a time), like sign_in_failures.
 */
import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

const PER_ROW = `((organization_id = (NULLIF(current_setting('app.org_id'::text, true), ''::text))::uuid) OR (current_setting('app.system'::text, true) = 'on'::text))`;
const ONCE = `organization_id = (SELECT nullif(current_setting('app.org_id', true), '')::uuid) OR (SELECT current_setting('app.system', true) = 'on')`;
const ONCE_PARSED = `((organization_id = ( SELECT (NULLIF(current_setting('app.org_id'::text, true), ''::text))::uuid AS "nullif")) OR ( SELECT (current_setting('app.system'::text, true) = 'on'::text)))`;

/** Restate every tenant_isolation policy whose expression reads `from` (as PostgreSQL prints it) as `to`. */
const restatePolicies = (from: string, to: string) => `
  DO $restate$
  DECLARE t record;
  BEGIN
    FOR t IN SELECT tablename FROM pg_policies
              WHERE schemaname = current_schema() AND policyname = 'tenant_isolation' AND qual = $from$${from}$from$ AND with_check = $from$${from}$from$ LOOP
      EXECUTE format('ALTER POLICY tenant_isolation ON %I USING (%s) WITH CHECK (%s)', t.tablename, $to$${to}$to$, $to$${to}$to$);
    END LOOP;
  END $restate$;`;

const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE INDEX test_runs_org_updated_id ON test_runs (organization_id, updated_at, id);
    DROP INDEX test_runs_org_updated;
    CREATE INDEX test_runs_org_created_id ON test_runs (organization_id, created_at, id);

    CREATE TABLE precheck_starts (
      id bigserial PRIMARY KEY,
      user_id uuid NOT NULL REFERENCES users(id),
      started_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX precheck_starts_user_at ON precheck_starts (user_id, started_at DESC);
  `);
  await qi.sequelize.query(restatePolicies(PER_ROW, ONCE));
};

const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(restatePolicies(ONCE_PARSED, PER_ROW));
  await qi.sequelize.query(`
    DROP TABLE IF EXISTS precheck_starts;
    DROP INDEX IF EXISTS test_runs_org_created_id;
    CREATE INDEX IF NOT EXISTS test_runs_org_updated ON test_runs (organization_id, updated_at DESC);
    DROP INDEX IF EXISTS test_runs_org_updated_id;
  `);
};

export const migration = { name: '0009-scale-out', up, down };
