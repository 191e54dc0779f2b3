/**
 * The foundation schema: organizations, people, the lab's records from device to issued report,
 * an append-only audit log, and row-level security that confines every tenant-owned row to the
 * organization named by the transaction's `app.org_id` setting.
 */
import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/** Tables whose rows belong to one organization; each gets the same isolation policy. */
export const TENANT_TABLES = [
  'clients',
  'devices',
  'instruments',
  'test_plans',
  'test_cases',
  'test_runs',
  'readings',
  'results',
  'reports',
  'report_status_changes',
  'org_counters',
  'signing_identities',
] as const;

const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  const sql = (text: string) => qi.sequelize.query(text);
  await sql(`
    CREATE TABLE organizations (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      kind text NOT NULL CHECK (kind IN ('lab', 'manufacturer')),
      name text NOT NULL CHECK (length(name) BETWEEN 1 AND 200),
      code text NOT NULL UNIQUE CHECK (code ~ '^[A-Z0-9]{2,8}$'),
      address_lines jsonb NOT NULL DEFAULT '[]',
      email text,
      phone text,
      accreditation text,
      settings jsonb NOT NULL DEFAULT '{}',
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE TABLE users (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      email text NOT NULL,
      display_name text NOT NULL,
      password_hash text,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE UNIQUE INDEX users_email_lower ON users (lower(email));
    CREATE TABLE memberships (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      user_id uuid NOT NULL REFERENCES users(id),
      role text NOT NULL CHECK (role IN ('lab-admin', 'engineer', 'reviewer', 'billing', 'manufacturer-admin', 'manufacturer-viewer')),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (organization_id, user_id, role)
    );
    CREATE INDEX memberships_user ON memberships (user_id);
    CREATE TABLE refresh_tokens (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id uuid NOT NULL REFERENCES users(id),
      family_id uuid NOT NULL,
      token_hash text NOT NULL UNIQUE,
      expires_at timestamptz NOT NULL,
      rotated_at timestamptz,
      revoked_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX refresh_tokens_family ON refresh_tokens (family_id);
    CREATE INDEX refresh_tokens_user ON refresh_tokens (user_id);

    CREATE TABLE org_counters (
      organization_id uuid NOT NULL REFERENCES organizations(id),
      name text NOT NULL,
      value bigint NOT NULL DEFAULT 0,
      PRIMARY KEY (organization_id, name)
    );
    CREATE TABLE clients (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      client_organization_id uuid REFERENCES organizations(id),
      name text NOT NULL,
      address_lines jsonb NOT NULL DEFAULT '[]',
      contact_name text NOT NULL,
      contact_email text NOT NULL,
      invoice_later boolean NOT NULL DEFAULT false,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX clients_org_name ON clients (organization_id, name);
    CREATE TABLE devices (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      client_id uuid NOT NULL REFERENCES clients(id),
      manufacturer text NOT NULL,
      model text NOT NULL,
      serial_number text NOT NULL,
      firmware text,
      rated_pep_w double precision NOT NULL CHECK (rated_pep_w > 0),
      emission_designator text NOT NULL,
      frequency_min_hz double precision NOT NULL,
      frequency_max_hz double precision NOT NULL,
      modes text[] NOT NULL,
      received_on date NOT NULL,
      condition text NOT NULL DEFAULT 'As received, no visible damage',
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CHECK (frequency_max_hz >= frequency_min_hz)
    );
    CREATE INDEX devices_org_created ON devices (organization_id, created_at DESC);
    CREATE INDEX devices_org_client ON devices (organization_id, client_id);
    CREATE TABLE instruments (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      name text NOT NULL,
      model text NOT NULL,
      serial_number text NOT NULL,
      calibrated_on date NOT NULL,
      calibration_due date NOT NULL,
      certificate_ref text NOT NULL,
      contributions jsonb NOT NULL DEFAULT '[]',
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX instruments_org_due ON instruments (organization_id, calibration_due);
    CREATE TABLE rule_sets (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid REFERENCES organizations(id),
      key text NOT NULL,
      version integer NOT NULL,
      name text NOT NULL,
      service text NOT NULL,
      is_sample boolean NOT NULL DEFAULT false,
      body jsonb NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (organization_id, key, version)
    );
    CREATE TABLE test_plans (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      device_id uuid NOT NULL REFERENCES devices(id),
      rule_set_id uuid NOT NULL REFERENCES rule_sets(id),
      rule_set_snapshot jsonb NOT NULL,
      name text NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX test_plans_org_created ON test_plans (organization_id, created_at DESC);
    CREATE TABLE test_cases (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      plan_id uuid NOT NULL REFERENCES test_plans(id),
      position integer NOT NULL,
      kind text NOT NULL,
      label text NOT NULL,
      parameters jsonb NOT NULL DEFAULT '{}',
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (plan_id, position)
    );
    CREATE INDEX test_cases_org_plan ON test_cases (organization_id, plan_id);
    CREATE TABLE test_runs (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      plan_id uuid NOT NULL REFERENCES test_plans(id),
      number text NOT NULL,
      state text NOT NULL CHECK (state IN ('draft', 'testing', 'in-review', 'approved', 'issued', 'withdrawn', 'superseded')),
      engineer_id uuid REFERENCES users(id),
      reviewer_id uuid REFERENCES users(id),
      return_reason text,
      tested_from date,
      tested_to date,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (organization_id, number)
    );
    CREATE INDEX test_runs_org_state_updated ON test_runs (organization_id, state, updated_at DESC);
    CREATE INDEX test_runs_org_updated ON test_runs (organization_id, updated_at DESC);
    CREATE TABLE readings (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      run_id uuid NOT NULL REFERENCES test_runs(id),
      test_case_id uuid NOT NULL REFERENCES test_cases(id),
      values jsonb NOT NULL,
      entered_by uuid REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX readings_org_run_case ON readings (organization_id, run_id, test_case_id, created_at DESC);
    CREATE TABLE results (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      run_id uuid NOT NULL REFERENCES test_runs(id),
      test_case_id uuid NOT NULL REFERENCES test_cases(id),
      reading_id uuid NOT NULL REFERENCES readings(id),
      engine_version text NOT NULL,
      value double precision,
      unit text NOT NULL,
      limit_value double precision,
      margin double precision,
      expanded_uncertainty double precision,
      coverage_factor double precision,
      verdict text NOT NULL,
      detail jsonb NOT NULL DEFAULT '{}',
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX results_org_run_case ON results (organization_id, run_id, test_case_id, created_at DESC);
    CREATE TABLE reports (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      run_id uuid NOT NULL REFERENCES test_runs(id),
      client_organization_id uuid REFERENCES organizations(id),
      report_number text NOT NULL,
      revision integer NOT NULL DEFAULT 1,
      replaces_report_id uuid REFERENCES reports(id),
      replaces_reason text,
      verify_token text NOT NULL UNIQUE,
      sha256 text NOT NULL,
      pdf bytea NOT NULL,
      page_count integer NOT NULL,
      summary jsonb NOT NULL,
      issued_by uuid NOT NULL REFERENCES users(id),
      issued_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (organization_id, report_number, revision)
    );
    CREATE INDEX reports_org_issued ON reports (organization_id, issued_at DESC);
    CREATE INDEX reports_client_org ON reports (client_organization_id, issued_at DESC);
    CREATE TABLE report_status_changes (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      report_id uuid NOT NULL REFERENCES reports(id),
      status text NOT NULL CHECK (status IN ('withdrawn', 'superseded')),
      reason text NOT NULL,
      superseded_by_id uuid REFERENCES reports(id),
      changed_by uuid REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX report_status_changes_org_report ON report_status_changes (organization_id, report_id);
    CREATE TABLE signing_identities (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      certificate_pem text NOT NULL,
      encrypted_private_key text NOT NULL,
      source text NOT NULL CHECK (source IN ('generated', 'uploaded')),
      active boolean NOT NULL DEFAULT true,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE UNIQUE INDEX signing_identities_one_active ON signing_identities (organization_id) WHERE active;
    CREATE TABLE audit_log (
      id bigserial PRIMARY KEY,
      organization_id uuid REFERENCES organizations(id),
      user_id uuid REFERENCES users(id),
      action text NOT NULL,
      entity text NOT NULL,
      entity_id text,
      before jsonb,
      after jsonb,
      at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX audit_log_org_at ON audit_log (organization_id, at DESC);

    -- Records that must never change once written (ISO/IEC 17025:2017 7.5, 7.8.8, 7.11).
    CREATE FUNCTION refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'sidecheck: % on % is not allowed: the record is immutable', TG_OP, TG_TABLE_NAME
        USING ERRCODE = 'integrity_constraint_violation';
    END $$;
    CREATE TRIGGER reports_immutable BEFORE UPDATE OR DELETE ON reports FOR EACH ROW EXECUTE FUNCTION refuse_change();
    CREATE TRIGGER report_status_changes_immutable BEFORE UPDATE OR DELETE ON report_status_changes FOR EACH ROW EXECUTE FUNCTION refuse_change();
    CREATE TRIGGER audit_log_append_only BEFORE UPDATE OR DELETE ON audit_log FOR EACH ROW EXECUTE FUNCTION refuse_change();
    CREATE TRIGGER readings_append_only BEFORE UPDATE OR DELETE ON readings FOR EACH ROW EXECUTE FUNCTION refuse_change();
    CREATE TRIGGER results_append_only BEFORE UPDATE OR DELETE ON results FOR EACH ROW EXECUTE FUNCTION refuse_change();
  `);
  for (const table of TENANT_TABLES) {
    await sql(`
      ALTER TABLE ${table} ENABLE ROW LEVEL SECURITY;
      ALTER TABLE ${table} FORCE ROW LEVEL SECURITY;
      CREATE POLICY tenant_isolation ON ${table}
        USING (organization_id = nullif(current_setting('app.org_id', true), '')::uuid
               OR current_setting('app.system', true) = 'on')
        WITH CHECK (organization_id = nullif(current_setting('app.org_id', true), '')::uuid
               OR current_setting('app.system', true) = 'on');
    `);
  }
  // Built-in sample rule sets (organization_id NULL) are readable by every lab, writable by none.
  await sql(`
    ALTER TABLE rule_sets ENABLE ROW LEVEL SECURITY;
    ALTER TABLE rule_sets FORCE ROW LEVEL SECURITY;
    CREATE POLICY rule_sets_read ON rule_sets FOR SELECT
      USING (organization_id IS NULL OR organization_id = nullif(current_setting('app.org_id', true), '')::uuid
             OR current_setting('app.system', true) = 'on');
    CREATE POLICY rule_sets_write ON rule_sets FOR ALL
      USING (organization_id = nullif(current_setting('app.org_id', true), '')::uuid OR current_setting('app.system', true) = 'on')
      WITH CHECK (organization_id = nullif(current_setting('app.org_id', true), '')::uuid OR current_setting('app.system', true) = 'on');
  `);
  // A manufacturer reads the reports a lab issued to it, and their status, and nothing else of the lab's.
  await sql(`
    CREATE POLICY reports_client_read ON reports FOR SELECT
      USING (client_organization_id = nullif(current_setting('app.org_id', true), '')::uuid);
    CREATE POLICY report_status_client_read ON report_status_changes FOR SELECT
      USING (EXISTS (SELECT 1 FROM reports r WHERE r.id = report_id
             AND r.client_organization_id = nullif(current_setting('app.org_id', true), '')::uuid));
  `);
};

const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE IF EXISTS signing_identities, audit_log, report_status_changes, reports, results, readings, test_runs, test_cases,
      test_plans, rule_sets, instruments, devices, clients, org_counters, refresh_tokens, memberships, users,
      organizations CASCADE;
    DROP FUNCTION IF EXISTS refuse_change();
  `);
};

export const migration = { name: '0001-foundation', up, down };
