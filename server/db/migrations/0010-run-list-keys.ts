/**
 * What the run list needs to stay fast at 10,000 and 100,000 runs per lab (bench/load.ts).
 *
 * Sort and search keys on the run itself. Sorting by client or model used to join every run of
 * the lab to its plan, device and client before taking a page (about 25 ms at 10,000 runs), and a
 * search scanned them all (about 15 ms). `test_runs` now carries `client_name`, `device_model` and
 * `search_text` (the run number, device manufacturer, model, serial number and client name, lower
 * case). Triggers keep them true: filled when a run is created, and rewritten for every run of a
 * client or device when its name, model or serial number changes. Nothing else writes them.
 * A search reads the lab's runs newest first from one index that includes `search_text`, without
 * touching the table: a page is found after a few hundred entries, and the total filters the
 * index alone (about 0.35 µs a run here). A trigram index would find matches without the scan, but
 * row-level security keeps it from being used: LIKE is not a leakproof operator, so PostgreSQL must
 * check the tenant policy on each row before it, and never uses it as an index condition.
 *
 * Counts per state. The list's "of N" counted every matching run of the lab on each request.
 * `run_state_counts` holds, per organization and state, how many runs there are, kept by
 * triggers on test_runs (a statement-level trigger for inserts, so bulk loads add once per
 * statement). A list filtered by state alone, or not at all, reads its total from there.
 *
 * An upload's analysis (figures and the thinned trace, tens of kilobytes) is kept as json, not
 * jsonb: nothing queries inside it, and converting thousands of numbers to jsonb's numeric took
 * most of the database's time for an upload.
 *
 * The trigger functions run as the caller, under row-level security: they see and change only
 * the caller's organization (or every one in system mode), like the statement that fired them.
 */
import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

const TENANT_POLICY = `organization_id = (SELECT nullif(current_setting('app.org_id', true), '')::uuid) OR (SELECT current_setting('app.system', true) = 'on')`;

const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  // One multi-statement query is one transaction: the system switch covers the backfills below.
  await qi.sequelize.query(`
    SELECT set_config('app.system', 'on', true);

    ALTER TABLE test_runs ADD COLUMN client_name text, ADD COLUMN device_model text, ADD COLUMN search_text text;

    CREATE FUNCTION run_list_keys() RETURNS trigger LANGUAGE plpgsql AS $fn$
    BEGIN
      SELECT c.name, d.model, lower(concat_ws(' ', NEW.number, d.manufacturer, d.model, d.serial_number, c.name))
        INTO NEW.client_name, NEW.device_model, NEW.search_text
        FROM test_plans p JOIN devices d ON d.id = p.device_id JOIN clients c ON c.id = d.client_id
       WHERE p.id = NEW.plan_id;
      RETURN NEW;
    END $fn$;
    CREATE TRIGGER test_runs_list_keys BEFORE INSERT OR UPDATE OF plan_id, number ON test_runs
      FOR EACH ROW EXECUTE FUNCTION run_list_keys();

    -- A client renamed, a device's names changed, a plan moved to another device: touch plan_id of
    -- the runs concerned, which refills their keys through the trigger above (updated_at stays).
    CREATE FUNCTION client_run_list_keys() RETURNS trigger LANGUAGE plpgsql AS $fn$
    BEGIN
      UPDATE test_runs r SET plan_id = r.plan_id
        FROM test_plans p JOIN devices d ON d.id = p.device_id
       WHERE d.client_id = NEW.id AND p.id = r.plan_id AND r.organization_id = NEW.organization_id;
      RETURN NULL;
    END $fn$;
    CREATE TRIGGER clients_run_list_keys AFTER UPDATE OF name ON clients
      FOR EACH ROW WHEN (OLD.name IS DISTINCT FROM NEW.name) EXECUTE FUNCTION client_run_list_keys();

    CREATE FUNCTION device_run_list_keys() RETURNS trigger LANGUAGE plpgsql AS $fn$
    BEGIN
      UPDATE test_runs r SET plan_id = r.plan_id
        FROM test_plans p
       WHERE p.device_id = NEW.id AND p.id = r.plan_id AND r.organization_id = NEW.organization_id;
      RETURN NULL;
    END $fn$;
    CREATE TRIGGER devices_run_list_keys AFTER UPDATE OF manufacturer, model, serial_number, client_id ON devices
      FOR EACH ROW WHEN ((OLD.manufacturer, OLD.model, OLD.serial_number, OLD.client_id) IS DISTINCT FROM (NEW.manufacturer, NEW.model, NEW.serial_number, NEW.client_id))
      EXECUTE FUNCTION device_run_list_keys();

    CREATE FUNCTION plan_run_list_keys() RETURNS trigger LANGUAGE plpgsql AS $fn$
    BEGIN
      UPDATE test_runs r SET plan_id = r.plan_id WHERE r.plan_id = NEW.id AND r.organization_id = NEW.organization_id;
      RETURN NULL;
    END $fn$;
    CREATE TRIGGER test_plans_run_list_keys AFTER UPDATE OF device_id ON test_plans
      FOR EACH ROW WHEN (OLD.device_id IS DISTINCT FROM NEW.device_id) EXECUTE FUNCTION plan_run_list_keys();

    UPDATE test_runs SET plan_id = plan_id;
    ALTER TABLE test_runs ALTER COLUMN client_name SET NOT NULL, ALTER COLUMN device_model SET NOT NULL, ALTER COLUMN search_text SET NOT NULL;

    CREATE INDEX test_runs_org_client_id ON test_runs (organization_id, client_name, id);
    CREATE INDEX test_runs_org_model_id ON test_runs (organization_id, device_model, id);
    CREATE INDEX test_runs_org_state_id ON test_runs (organization_id, state, id);
    CREATE INDEX test_runs_org_engineer_updated ON test_runs (organization_id, engineer_id, state, updated_at);
    -- Replaces test_runs_org_updated_id (migration 0009): the same order, with the search key.
    CREATE INDEX test_runs_org_updated_search ON test_runs (organization_id, updated_at, id) INCLUDE (search_text);
    DROP INDEX test_runs_org_updated_id;

    CREATE TABLE run_state_counts (
      organization_id uuid NOT NULL REFERENCES organizations(id),
      state text NOT NULL,
      n bigint NOT NULL CHECK (n >= 0),
      PRIMARY KEY (organization_id, state)
    );
    ALTER TABLE run_state_counts ENABLE ROW LEVEL SECURITY;
    ALTER TABLE run_state_counts FORCE ROW LEVEL SECURITY;
    CREATE POLICY tenant_isolation ON run_state_counts USING (${TENANT_POLICY}) WITH CHECK (${TENANT_POLICY});

    CREATE FUNCTION run_state_counts_add() RETURNS trigger LANGUAGE plpgsql AS $fn$
    BEGIN
      INSERT INTO run_state_counts (organization_id, state, n)
        SELECT organization_id, state, count(*) FROM new_runs GROUP BY organization_id, state
        ON CONFLICT (organization_id, state) DO UPDATE SET n = run_state_counts.n + EXCLUDED.n;
      RETURN NULL;
    END $fn$;
    CREATE TRIGGER test_runs_count_insert AFTER INSERT ON test_runs
      REFERENCING NEW TABLE AS new_runs FOR EACH STATEMENT EXECUTE FUNCTION run_state_counts_add();

    CREATE FUNCTION run_state_counts_move() RETURNS trigger LANGUAGE plpgsql AS $fn$
    BEGIN
      IF TG_OP IN ('UPDATE', 'DELETE') THEN
        UPDATE run_state_counts SET n = n - 1 WHERE organization_id = OLD.organization_id AND state = OLD.state;
      END IF;
      IF TG_OP = 'UPDATE' THEN
        INSERT INTO run_state_counts (organization_id, state, n) VALUES (NEW.organization_id, NEW.state, 1)
          ON CONFLICT (organization_id, state) DO UPDATE SET n = run_state_counts.n + 1;
      END IF;
      RETURN NULL;
    END $fn$;
    CREATE TRIGGER test_runs_count_state AFTER UPDATE OF state, organization_id ON test_runs
      FOR EACH ROW WHEN ((OLD.state, OLD.organization_id) IS DISTINCT FROM (NEW.state, NEW.organization_id)) EXECUTE FUNCTION run_state_counts_move();
    CREATE TRIGGER test_runs_count_delete AFTER DELETE ON test_runs
      FOR EACH ROW EXECUTE FUNCTION run_state_counts_move();

    INSERT INTO run_state_counts (organization_id, state, n) SELECT organization_id, state, count(*) FROM test_runs GROUP BY organization_id, state;

    ALTER TABLE uploads ALTER COLUMN analysis TYPE json USING analysis::json;
  `);
};

const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE uploads ALTER COLUMN analysis TYPE jsonb USING analysis::jsonb;
    DROP TRIGGER IF EXISTS test_runs_count_insert ON test_runs;
    DROP TRIGGER IF EXISTS test_runs_count_state ON test_runs;
    DROP TRIGGER IF EXISTS test_runs_count_delete ON test_runs;
    DROP FUNCTION IF EXISTS run_state_counts_add(), run_state_counts_move();
    DROP TABLE IF EXISTS run_state_counts;
    DROP TRIGGER IF EXISTS test_runs_list_keys ON test_runs;
    DROP TRIGGER IF EXISTS clients_run_list_keys ON clients;
    DROP TRIGGER IF EXISTS devices_run_list_keys ON devices;
    DROP TRIGGER IF EXISTS test_plans_run_list_keys ON test_plans;
    DROP FUNCTION IF EXISTS run_list_keys(), client_run_list_keys(), device_run_list_keys(), plan_run_list_keys();
    CREATE INDEX IF NOT EXISTS test_runs_org_updated_id ON test_runs (organization_id, updated_at, id);
    DROP INDEX IF EXISTS test_runs_org_client_id, test_runs_org_model_id, test_runs_org_state_id, test_runs_org_engineer_updated, test_runs_org_updated_search;
    ALTER TABLE test_runs DROP COLUMN IF EXISTS client_name, DROP COLUMN IF EXISTS device_model, DROP COLUMN IF EXISTS search_text;
  `);
};

export const migration = { name: '0010-run-list-keys', up, down };
