/**
 * People and access: invitations, password resets, bench-automation API keys, auditor grants and
 * the shared sign-in failure counter.
 *
 * Tokens and keys are stored only as SHA-256 hashes, so a copy of the database does not let anyone
 * accept an invitation, reset a password or call the API. Invitations, API keys and auditor grants
 * belong to one organization and get the same row-level security as every tenant table; an
 * invitation a lab sends to its client's new organization is also visible to that lab (its
 * sponsor). Password resets and sign-in failures belong to a person or an address, not an
 * organization, like refresh tokens.
 */
import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

const TENANT_POLICY = (extra = '') => `
  USING (organization_id = nullif(current_setting('app.org_id', true), '')::uuid ${extra}
         OR current_setting('app.system', true) = 'on')
  WITH CHECK (organization_id = nullif(current_setting('app.org_id', true), '')::uuid ${extra}
         OR current_setting('app.system', true) = 'on')`;

const ROLES = `'lab-admin', 'engineer', 'reviewer', 'billing', 'manufacturer-admin', 'manufacturer-viewer'`;

const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    -- Targets for same-organization foreign keys (a grant can only name the lab's own client or device).
    ALTER TABLE clients ADD CONSTRAINT clients_org_id UNIQUE (organization_id, id);
    ALTER TABLE devices ADD CONSTRAINT devices_org_id UNIQUE (organization_id, id);

    CREATE TABLE auditor_grants (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      email text NOT NULL CHECK (length(email) BETWEEN 3 AND 254),
      auditor_user_id uuid REFERENCES users(id),
      scope text NOT NULL CHECK (scope IN ('all', 'client', 'device')),
      client_id uuid,
      device_id uuid,
      expires_on date NOT NULL,
      note text CHECK (length(note) <= 500),
      granted_by uuid REFERENCES users(id),
      accepted_at timestamptz,
      revoked_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CHECK ((scope = 'client') = (client_id IS NOT NULL)),
      CHECK ((scope = 'device') = (device_id IS NOT NULL)),
      FOREIGN KEY (organization_id, client_id) REFERENCES clients (organization_id, id),
      FOREIGN KEY (organization_id, device_id) REFERENCES devices (organization_id, id)
    );
    CREATE INDEX auditor_grants_org_created ON auditor_grants (organization_id, created_at DESC);
    CREATE INDEX auditor_grants_auditor ON auditor_grants (auditor_user_id, organization_id) WHERE auditor_user_id IS NOT NULL;

    CREATE TABLE invitations (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      sponsor_organization_id uuid REFERENCES organizations(id),
      kind text NOT NULL CHECK (kind IN ('member', 'auditor')),
      email text NOT NULL CHECK (length(email) BETWEEN 3 AND 254),
      role text CHECK (role IN (${ROLES})),
      auditor_grant_id uuid REFERENCES auditor_grants(id),
      token_hash text NOT NULL UNIQUE,
      invited_by uuid REFERENCES users(id),
      expires_at timestamptz NOT NULL,
      accepted_at timestamptz,
      accepted_by uuid REFERENCES users(id),
      revoked_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CHECK ((kind = 'member') = (role IS NOT NULL)),
      CHECK ((kind = 'auditor') = (auditor_grant_id IS NOT NULL))
    );
    CREATE INDEX invitations_org_created ON invitations (organization_id, created_at DESC);
    CREATE INDEX invitations_sponsor_created ON invitations (sponsor_organization_id, created_at DESC) WHERE sponsor_organization_id IS NOT NULL;

    CREATE TABLE api_keys (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organization_id uuid NOT NULL REFERENCES organizations(id),
      name text NOT NULL CHECK (length(name) BETWEEN 1 AND 100),
      prefix text NOT NULL,
      key_hash text NOT NULL UNIQUE,
      created_by uuid REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      last_used_at timestamptz,
      revoked_at timestamptz
    );
    CREATE INDEX api_keys_org_created ON api_keys (organization_id, created_at DESC);

    -- Which key made a change, when a key rather than a person did (readings from the bench).
    ALTER TABLE audit_log ADD COLUMN api_key_id uuid REFERENCES api_keys(id);

    CREATE TABLE password_resets (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id uuid NOT NULL REFERENCES users(id),
      token_hash text NOT NULL UNIQUE,
      expires_at timestamptz NOT NULL,
      used_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX password_resets_user ON password_resets (user_id);

    -- A sliding window of failed sign-ins, in the database so every API process counts the same.
    CREATE TABLE sign_in_failures (
      id bigserial PRIMARY KEY,
      key text NOT NULL CHECK (length(key) <= 300),
      failed_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX sign_in_failures_key_at ON sign_in_failures (key, failed_at DESC);
    CREATE INDEX sign_in_failures_at ON sign_in_failures (failed_at);
  `);
  for (const table of ['auditor_grants', 'api_keys']) {
    await qi.sequelize.query(`
      ALTER TABLE ${table} ENABLE ROW LEVEL SECURITY;
      ALTER TABLE ${table} FORCE ROW LEVEL SECURITY;
      CREATE POLICY tenant_isolation ON ${table} ${TENANT_POLICY()};
    `);
  }
  await qi.sequelize.query(`
    ALTER TABLE invitations ENABLE ROW LEVEL SECURITY;
    ALTER TABLE invitations FORCE ROW LEVEL SECURITY;
    CREATE POLICY tenant_isolation ON invitations
      ${TENANT_POLICY("OR sponsor_organization_id = nullif(current_setting('app.org_id', true), '')::uuid")};
  `);
};

const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE audit_log DROP COLUMN IF EXISTS api_key_id;
    DROP TABLE IF EXISTS sign_in_failures, password_resets, api_keys, invitations, auditor_grants;
    ALTER TABLE devices DROP CONSTRAINT IF EXISTS devices_org_id;
    ALTER TABLE clients DROP CONSTRAINT IF EXISTS clients_org_id;
  `);
};

export const migration = { name: '0002-accounts', up, down };
