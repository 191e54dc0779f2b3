/**
 * Review comments: a thread per test case of a run, between the engineer who measured and the
 * technical reviewer (ISO/IEC 17025:2017 7.5.1 technical records include who checked what; clause
 * wording from memory). Comments are records: append-only like readings, a database trigger
 * refuses UPDATE and DELETE. Row-level security is the tenant policy of every other table, and the
 * foreign keys carry organization_id so a comment can never join a run or case of another lab.
 */
import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    -- Target for the same-organization foreign key to test cases (another migration may have made it).
    CREATE UNIQUE INDEX IF NOT EXISTS test_cases_org_id ON test_cases (organization_id, id);

    CREATE TABLE run_comments (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      run_id uuid NOT NULL,
      test_case_id uuid NOT NULL,
      author_id uuid NOT NULL REFERENCES users(id),
      author_role text NOT NULL CHECK (author_role IN ('lab-admin', 'engineer', 'reviewer')),
      body text NOT NULL CHECK (length(btrim(body)) BETWEEN 1 AND 4000),
      created_at timestamptz NOT NULL DEFAULT now(),
      FOREIGN KEY (organization_id, run_id) REFERENCES test_runs (organization_id, id),
      FOREIGN KEY (organization_id, test_case_id) REFERENCES test_cases (organization_id, id)
    );
    CREATE INDEX run_comments_org_run_case ON run_comments (organization_id, run_id, test_case_id, created_at);
    CREATE TRIGGER run_comments_append_only BEFORE UPDATE OR DELETE ON run_comments FOR EACH ROW EXECUTE FUNCTION refuse_change();
    ALTER TABLE run_comments ENABLE ROW LEVEL SECURITY;
    ALTER TABLE run_comments FORCE ROW LEVEL SECURITY;
    CREATE POLICY tenant_isolation ON run_comments
      USING (organization_id = nullif(current_setting('app.org_id', true), '')::uuid
             OR current_setting('app.system', true) = 'on')
      WITH CHECK (organization_id = nullif(current_setting('app.org_id', true), '')::uuid
             OR current_setting('app.system', true) = 'on');
  `);
};

const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE IF EXISTS run_comments;
    -- Drop the index only when it is ours (a plain index), not another migration's constraint.
    DO $$ BEGIN
      IF NOT EXISTS (SELECT 1 FROM pg_constraint WHERE conname = 'test_cases_org_id') THEN
        DROP INDEX IF EXISTS test_cases_org_id;
      END IF;
    END $$;
  `);
};

export const migration = { name: '0006-comments', up, down };
