/** The signed compliance certificate issued with each report, immutable like the report itself. */
import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE report_certificates (
      report_id uuid PRIMARY KEY REFERENCES reports(id),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      client_organization_id uuid REFERENCES organizations(id),
      sha256 text NOT NULL,
      pdf bytea NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX report_certificates_org ON report_certificates (organization_id, created_at DESC);
    CREATE TRIGGER report_certificates_immutable BEFORE UPDATE OR DELETE ON report_certificates FOR EACH ROW EXECUTE FUNCTION refuse_change();
    ALTER TABLE report_certificates ENABLE ROW LEVEL SECURITY;
    ALTER TABLE report_certificates FORCE ROW LEVEL SECURITY;
    CREATE POLICY tenant_isolation ON report_certificates
      USING (organization_id = nullif(current_setting('app.org_id', true), '')::uuid OR current_setting('app.system', true) = 'on')
      WITH CHECK (organization_id = nullif(current_setting('app.org_id', true), '')::uuid OR current_setting('app.system', true) = 'on');
    CREATE POLICY certificates_client_read ON report_certificates FOR SELECT
      USING (client_organization_id = nullif(current_setting('app.org_id', true), '')::uuid);
  `);
};

const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE IF EXISTS report_certificates');
};

export const migration = { name: '0007-certificates', up, down };
