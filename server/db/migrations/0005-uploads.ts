/**
 * Uploaded analyzer traces and I/Q captures, and results computed from them.
 *
 * `uploads` records one raw file as received (a SigMF recording is two: the metadata in `file_*`,
 * the samples in `data_*`), where it is stored (a storage key the server chose: never the
 * client's name), its size and SHA-256, the parameters it was analysed with and the analysis
 * (figures and a thinned trace or PSD for the chart). Like readings it is a technical record
 * (ISO/IEC 17025:2017 7.5, 7.11): append-only, refused UPDATE and DELETE by trigger. A result now
 * comes either from a reading or from an upload, never both. Foreign keys carry organization_id,
 * so an upload can only join a run, a test case and a result of its own organization.
 */
import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    -- Target for the same-organization foreign key to test cases (an index, so it can coexist with others).
    CREATE UNIQUE INDEX IF NOT EXISTS test_cases_org_id_key ON test_cases (organization_id, id);

    CREATE TABLE uploads (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      run_id uuid NOT NULL,
      test_case_id uuid NOT NULL,
      format text NOT NULL CHECK (format IN ('trace-csv', 'sigmf', 'wav', 'cf32', 'ci16')),
      file_name text NOT NULL CHECK (length(file_name) BETWEEN 1 AND 200),
      file_key text NOT NULL UNIQUE,
      file_size_bytes bigint NOT NULL CHECK (file_size_bytes >= 0),
      file_sha256 text NOT NULL CHECK (file_sha256 ~ '^[0-9a-f]{64}$'),
      data_file_name text CHECK (length(data_file_name) BETWEEN 1 AND 200),
      data_key text UNIQUE,
      data_size_bytes bigint CHECK (data_size_bytes >= 0),
      data_sha256 text CHECK (data_sha256 ~ '^[0-9a-f]{64}$'),
      parameters jsonb NOT NULL DEFAULT '{}',
      analysis jsonb NOT NULL,
      engine_version text NOT NULL,
      uploaded_by uuid REFERENCES users(id),
      api_key_id uuid REFERENCES api_keys(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (organization_id, id),
      CHECK ((format = 'sigmf') = (data_key IS NOT NULL)),
      CHECK ((data_key IS NULL) = (data_sha256 IS NULL) AND (data_key IS NULL) = (data_size_bytes IS NULL)),
      FOREIGN KEY (organization_id, run_id) REFERENCES test_runs (organization_id, id),
      FOREIGN KEY (organization_id, test_case_id) REFERENCES test_cases (organization_id, id)
    );
    CREATE INDEX uploads_org_run_case ON uploads (organization_id, run_id, test_case_id, created_at DESC);
    CREATE INDEX uploads_org_created ON uploads (organization_id, created_at DESC);
    CREATE TRIGGER uploads_append_only BEFORE UPDATE OR DELETE ON uploads FOR EACH ROW EXECUTE FUNCTION refuse_change();
    ALTER TABLE uploads ENABLE ROW LEVEL SECURITY;
    ALTER TABLE uploads FORCE ROW LEVEL SECURITY;
    CREATE POLICY tenant_isolation ON uploads
      USING (organization_id = nullif(current_setting('app.org_id', true), '')::uuid
             OR current_setting('app.system', true) = 'on')
      WITH CHECK (organization_id = nullif(current_setting('app.org_id', true), '')::uuid
             OR current_setting('app.system', true) = 'on');

    ALTER TABLE results ALTER COLUMN reading_id DROP NOT NULL;
    ALTER TABLE results ADD COLUMN upload_id uuid;
    ALTER TABLE results ADD CONSTRAINT results_upload_same_org FOREIGN KEY (organization_id, upload_id) REFERENCES uploads (organization_id, id);
    ALTER TABLE results ADD CONSTRAINT results_one_source CHECK (num_nonnulls(reading_id, upload_id) = 1);
    CREATE INDEX results_org_upload ON results (organization_id, upload_id) WHERE upload_id IS NOT NULL;
  `);
};

const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  // Results computed from uploads have no reading: SET NOT NULL then fails, and nothing is reverted.
  await qi.sequelize.query(`
    DROP INDEX IF EXISTS results_org_upload;
    ALTER TABLE results DROP CONSTRAINT IF EXISTS results_one_source;
    ALTER TABLE results DROP CONSTRAINT IF EXISTS results_upload_same_org;
    ALTER TABLE results DROP COLUMN IF EXISTS upload_id;
    ALTER TABLE results ALTER COLUMN reading_id SET NOT NULL;
    DROP TABLE IF EXISTS uploads;
    DROP INDEX IF EXISTS test_cases_org_id_key;
  `);
};

export const migration = { name: '0005-uploads', up, down };
