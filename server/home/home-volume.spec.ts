/**
 * The home page at volume: 100,000 runs in one lab, next to a neighbour lab of the same size.
 * Checks the plans PostgreSQL chooses for the home queries (index scans that start from
 * organization_id, no sequential scan of the big tables) and the answer time.
 */
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario } from '../../test/support/factories';
import { asSystem, inTenant } from '../tenancy/tenant-transaction';
import { callerFor } from '../instruments/lab-session.test-support';
import { addDaysIso, todayIso } from '../instruments/calibration-status';
import { AWAITING_REVIEW, CALIBRATION_DUE, RECENT_ACTIVITY, RUNS_BY_STATE } from './home-queries';

const RUNS_PER_LAB = 100_000;

let t: TestApp;
let labs: Awaited<ReturnType<typeof buildLabScenario>>[];

interface PlanNode {
  'Node Type': string;
  'Relation Name'?: string;
  'Index Name'?: string;
  'Index Cond'?: string;
  Plans?: PlanNode[];
}

function nodes(plan: PlanNode): PlanNode[] {
  return [plan, ...(plan.Plans ?? []).flatMap(nodes)];
}

/** Bulk rows straight in SQL (system scope): states spread as a busy lab's would be, one in 50 in review. */
async function fill(s: Awaited<ReturnType<typeof buildLabScenario>>) {
  await asSystem(t.sequelize, async (transaction) => {
    // 100,000 runs with their list keys and search terms (triggers, migration 0010) take longer
    // than the API's 30 s statement limit on a busy machine; this fixture is not an API request.
    await t.sequelize.query("SET LOCAL statement_timeout = '180s'", { transaction });
    await t.sequelize.query(
      `INSERT INTO test_runs (organization_id, plan_id, number, state, engineer_id, updated_at, created_at)
       SELECT :org, :plan, 'BULK-' || g,
              CASE WHEN g % 50 = 0 THEN 'in-review' WHEN g % 7 = 0 THEN 'testing' WHEN g % 11 = 0 THEN 'approved' ELSE 'issued' END,
              :engineer, now() - g * interval '1 minute', now() - g * interval '1 minute'
         FROM generate_series(1, :n) g`,
      { replacements: { org: s.lab.id, plan: s.plan.id, engineer: s.engineer.id, n: RUNS_PER_LAB }, transaction },
    );
    // One reading per run, as the review query's NOT EXISTS probes them.
    await t.sequelize.query(
      `INSERT INTO readings (organization_id, run_id, test_case_id, values, entered_by)
       SELECT :org, r.id, :case, '{"pepDbm": 50, "carrierDbm": 4}', :engineer FROM test_runs r WHERE r.organization_id = :org AND r.number LIKE 'BULK-%'`,
      { replacements: { org: s.lab.id, case: s.cases[0].id, engineer: s.engineer.id }, transaction },
    );
    // A large register: 500 instruments falling due over the next four years.
    await t.sequelize.query(
      `INSERT INTO instruments (organization_id, name, model, serial_number, calibrated_on, calibration_due, certificate_ref)
       SELECT :org, 'Bulk instrument ' || g, 'Bulk model', 'BULK-' || g, current_date - 300, current_date + (g * 3), 'CERT-' || g FROM generate_series(1, 500) g`,
      { replacements: { org: s.lab.id }, transaction },
    );
    await t.sequelize.query(
      `INSERT INTO audit_log (organization_id, user_id, action, entity, entity_id, at)
       SELECT :org, :engineer, 'save-reading', 'test-run', 'bulk-' || g, now() - g * interval '1 minute' FROM generate_series(1, :n) g`,
      { replacements: { org: s.lab.id, engineer: s.engineer.id, n: RUNS_PER_LAB }, transaction },
    );
  });
}

beforeAll(async () => {
  t = await startTestApp();
  labs = [await buildLabScenario(t.sequelize), await buildLabScenario(t.sequelize)];
  for (const s of labs) await fill(s);
  // What autovacuum does after a bulk load: fresh statistics and an up-to-date visibility map.
  await t.sequelize.query('VACUUM ANALYZE test_runs, audit_log, instruments, readings');
}, 300_000);

// The bulk rows stay: readings and the audit log are append-only, `npm test` starts from a new
// cluster, and every other suite works in labs of its own.
afterAll(() => t?.close());

const BIG_TABLES = ['test_runs', 'audit_log', 'readings', 'instruments'];

async function explain(sql: string, options: { seqScan: boolean }): Promise<PlanNode[]> {
  const s = labs[0];
  const replacements = { org: s.lab.id, me: s.reviewer.id, soon: addDaysIso(todayIso(), 30), limit: 20 };
  const [row] = await inTenant(t.sequelize, s.lab.id, async () => {
    if (!options.seqScan) await t.sequelize.query('SET LOCAL enable_seqscan = off');
    return t.sequelize.query<{ 'QUERY PLAN': { Plan: PlanNode }[] }>(`EXPLAIN (FORMAT JSON) ${sql}`, { replacements, type: QueryTypes.SELECT });
  });
  return nodes(row['QUERY PLAN'][0].Plan);
}

const seqScansOfBigTables = (plan: PlanNode[]) => plan.filter((n) => n['Node Type'] === 'Seq Scan' && BIG_TABLES.includes(n['Relation Name'] ?? '')).map((n) => n['Relation Name']);
/** Index conditions on a table's indexes (a Bitmap Index Scan names only its index, which our names prefix with the table). */
const indexCondsOn = (plan: PlanNode[], table: string) => plan.filter((n) => (n['Relation Name'] === table || n['Index Name']?.startsWith(`${table}_`)) && n['Index Cond']).map((n) => n['Index Cond']!);

describe('the home queries at 100,000 runs per lab', () => {
  it.each([
    ['awaiting my review', 'test_runs_org_state_updated', AWAITING_REVIEW],
    ['calibration due', 'instruments_org_due', CALIBRATION_DUE],
    ['recent activity', 'audit_log_org_at', RECENT_ACTIVITY],
  ])('%s reads a short range of the index %s and scans no big table sequentially', async (_what, index, sql) => {
    const plan = await explain(sql, { seqScan: true });
    expect(seqScansOfBigTables(plan)).toEqual([]);
    expect(plan.map((n) => n['Index Name'])).toContain(index);
  });

  it('runs by state counts the lab’s runs through an index condition on organization_id', async () => {
    // Counting reads every run of the lab; while the lab is half the table (two big labs here) a
    // sequential scan is the planner's right choice, so the check is that the index can serve it.
    const plan = await explain(RUNS_BY_STATE, { seqScan: false });
    expect(indexCondsOn(plan, 'test_runs').join()).toMatch(/organization_id = '[0-9a-f-]{36}'::uuid/);
  });

  it('needs the explicit organization_id predicate: the row-level-security policy alone gives no index condition', async () => {
    // The policy is "organization_id = setting OR system switch"; an OR with a non-column arm is not
    // an index condition (PostgreSQL 15 docs, 11.5 "Combining Multiple Indexes"), hence :org in every query.
    const plan = await explain(RUNS_BY_STATE.replace('WHERE organization_id = :org', ''), { seqScan: false });
    expect(indexCondsOn(plan, 'test_runs')).toEqual([]);
  });

  it('answers GET /api/home in well under a second', async () => {
    const s = labs[0];
    const reviewer = await callerFor(t.app, s.reviewer, s.lab.id);
    await reviewer('get', '/home'); // warm the connection and the caches
    const started = process.hrtime.bigint();
    const res = await reviewer('get', '/home');
    const ms = Number(process.hrtime.bigint() - started) / 1e6;
    expect(res.status).toBe(200);
    // 100,000 / 50 = 2,000 runs in review (the fill's own arithmetic).
    expect(res.body.runsByState['in-review']).toBe(RUNS_PER_LAB / 50);
    expect(res.body.awaitingMyReview).toHaveLength(20);
    expect(res.body.recentActivity).toHaveLength(10);
    console.log(`GET /api/home with ${RUNS_PER_LAB} runs in the lab: ${ms.toFixed(1)} ms`);
    expect(ms).toBeLessThan(1000);
  });
});
