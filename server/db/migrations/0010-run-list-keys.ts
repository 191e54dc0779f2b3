/**
 * What the run list needs to stay fast at 10,000 and 100,000 runs per lab (bench/load.ts).
 *
 * Sort and search keys on the run itself. Sorting by client or model used to join every run of
 * the lab to its plan, device and client before taking a page (about 25 ms at 10,000 runs), and a
 * search scanned them all (about 15 ms). `test_runs` now carries `client_name`, `device_model` and
 * `search_text` (the run number, device manufacturer, model, serial number and client name, lower
 * case). Triggers keep them true: filled when a run is created, and rewritten for every run of a
 * client or device when its name, model or serial number changes. Nothing else writes them.
 * Searches go through `run_search_terms`: the words of each run's search text (split at spaces,
 * and again at hyphens, so "HX-150" is found by "hx-150", "hx" and "150"), one row each, kept by a
 * trigger whenever the search text changes. A search word matches the beginning of a term: a
 * range on the (organization_id, term) primary key, in byte order (COLLATE "C"). A trigram index
 * on the text itself could find any substring, but row-level security keeps PostgreSQL from
 * using it: LIKE is not a leakproof operator, so the tenant policy must be checked on each row
 * before it, and a search would read every run of the lab (about 4 ms at 10,000 runs here, 40 ms
 * at 100,000). Comparisons of text are leakproof, so the range is an index condition.
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

    -- An index kept by triggers, not a record: no foreign keys (checking two of them for each of a
    -- bulk load's terms took most of its time); a deleted run's terms go with it (trigger below).
    CREATE TABLE run_search_terms (
      organization_id uuid NOT NULL,
      term text COLLATE "C" NOT NULL,
      run_id uuid NOT NULL,
      PRIMARY KEY (organization_id, term, run_id)
    );
    CREATE INDEX run_search_terms_run ON run_search_terms (organization_id, run_id);
    ALTER TABLE run_search_terms ENABLE ROW LEVEL SECURITY;
    ALTER TABLE run_search_terms FORCE ROW LEVEL SECURITY;
    CREATE POLICY tenant_isolation ON run_search_terms USING (${TENANT_POLICY}) WITH CHECK (${TENANT_POLICY});

    -- The words of a search text, and their hyphen-separated parts.
    CREATE FUNCTION run_search_words(text) RETURNS SETOF text LANGUAGE sql IMMUTABLE PARALLEL SAFE AS $fn$
      SELECT w FROM string_to_table($1, ' ') w WHERE w <> ''
      UNION
      SELECT w FROM string_to_table(translate($1, '-', ' '), ' ') w WHERE w <> ''
    $fn$;
    -- New runs: once per statement, so a bulk load adds its terms in one set-based insert.
    CREATE FUNCTION run_search_terms_add() RETURNS trigger LANGUAGE plpgsql AS $fn$
    BEGIN
      INSERT INTO run_search_terms (organization_id, term, run_id)
        SELECT n.organization_id, w, n.id FROM new_runs n, run_search_words(n.search_text) w;
      RETURN NULL;
    END $fn$;
    CREATE TRIGGER test_runs_search_terms AFTER INSERT ON test_runs
      REFERENCING NEW TABLE AS new_runs FOR EACH STATEMENT EXECUTE FUNCTION run_search_terms_add();
    -- A changed search text (a client or device renamed): that run's terms anew; a deleted run: none.
    CREATE FUNCTION run_search_terms_renew() RETURNS trigger LANGUAGE plpgsql AS $fn$
    BEGIN
      DELETE FROM run_search_terms WHERE organization_id = OLD.organization_id AND run_id = OLD.id;
      IF TG_OP = 'UPDATE' THEN
        INSERT INTO run_search_terms (organization_id, term, run_id)
          SELECT NEW.organization_id, w, NEW.id FROM run_search_words(NEW.search_text) w;
      END IF;
      RETURN NULL;
    END $fn$;
    CREATE TRIGGER test_runs_search_terms_change AFTER UPDATE ON test_runs
      FOR EACH ROW WHEN (OLD.search_text IS DISTINCT FROM NEW.search_text) EXECUTE FUNCTION run_search_terms_renew();
    CREATE TRIGGER test_runs_search_terms_delete AFTER DELETE ON test_runs
      FOR EACH ROW EXECUTE FUNCTION run_search_terms_renew();
    INSERT INTO run_search_terms (organization_id, term, run_id)
      SELECT r.organization_id, w, r.id FROM test_runs r, run_search_words(r.search_text) w;

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
    DROP TRIGGER IF EXISTS test_runs_search_terms ON test_runs;
    DROP TRIGGER IF EXISTS test_runs_search_terms_change ON test_runs;
    DROP TRIGGER IF EXISTS test_runs_search_terms_delete ON test_runs;
    DROP FUNCTION IF EXISTS run_search_terms_add(), run_search_terms_renew(), run_search_words(text);
    DROP TABLE IF EXISTS run_search_terms;
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
    DROP INDEX IF EXISTS test_runs_org_client_id, test_runs_org_model_id, test_runs_org_state_id, test_runs_org_engineer_updated;
    ALTER TABLE test_runs DROP COLUMN IF EXISTS client_name, DROP COLUMN IF EXISTS device_model, DROP COLUMN IF EXISTS search_text;
  `);
};

export const migration = { name: '0010-run-list-keys', up, down };
