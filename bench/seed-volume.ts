/**
 * Volume for the load benchmark (bench/load.ts): invented labs, each with N test runs and the
 * records a lab at that size has around them, written with bulk SQL (INSERT ... SELECT over
 * generate_series) in the system scope, one transaction per lab. Every lab, person, client and
 * radio here is invented (`.example` addresses).
 *
 * Per lab, for N runs: N/10 devices (at most 50 clients, the first five linked to invented
 * manufacturer organizations), one plan per device with four test cases (carrier suppression at
 * 2182 and 8291 kHz, unwanted sideband, and the two-tone mask judged from uploaded traces), an
 * equipment register (two instruments on every run), 8 people (admin, 4 engineers, 2 reviewers,
 * billing), one audit entry per run, and readings with their results for the finished runs (3 per
 * run) and for half of the runs on the bench (1). States follow age: the newest 3 % are draft or
 * on the bench, the next 17 % mostly on the bench (1 in 10 in review, 1 in 10 approved), older
 * runs approved, and one in eight of those issued with a report. Only those issued runs carry a
 * stored signed PDF (a real ~45 kB one, rendered and signed once here), so ten labs stay near
 * 450 MB of PDFs rather than several GB; nothing in the load run reads the others' reports.
 * Readings use fixed values and the stored results are what the shared engine computes for them
 * (computed once here), so the records agree with each other.
 *
 *   DATABASE_URL=... node node_modules/tsx/dist/cli.mjs bench/seed-volume.ts [--labs 10] [--runs 10000]
 *
 * Run it on a fresh (migrated) database; it is idempotent per lab: a lab whose code exists
 * already is left as it is. A lab of 10,000 runs takes about 7 s here, the load run's twelve labs
 * about 80 s with the final VACUUM ANALYZE.
 */
import { QueryTypes, type Sequelize } from 'sequelize';
import { createSequelize } from '../server/db/sequelize';
import { initModels, type Instrument } from '../server/db/models';
import { asSystem } from '../server/tenancy/tenant-transaction';
import { ensureBuiltInRuleSets } from '../server/demo/seed';
import { hashPassword } from '../server/auth/password';
import { demoInstruments } from '../server/demo/demo-instruments';
import { todayIso } from '../server/instruments/calibration-status';
import { contributionsByBudget } from '../server/instruments/run-instruments';
import { evaluateTestCase } from '../shared/evaluation/evaluate-test-case';
import { ENGINE_VERSION } from '../shared/engine-version';
import { generateLabSigningIdentity } from '../server/signing/generate-lab-signing-identity';
import { signPdf } from '../server/signing/sign-pdf';
import { sha256Hex } from '../server/signing/sha256-hex';
import { renderReportPdf } from '../templates/report/render-report';
import { buildSampleReportDocument } from '../templates/report/sample-report-document';
import type { RuleSetBody } from '../shared/rules/rule-set';

/** The password of every person the volume seed creates (invented, bench only). */
export const VOLUME_PASSWORD = 'load-bench-password-2026';

/** One lab to seed: its code (also its people's e-mail domain part) and its number of runs. */
export interface VolumeLab {
  code: string;
  runs: number;
}

/** The ten labs of the load run (10 x 10,000 runs) and two small ones for the 1x / 10x / 100x figure. */
export function volumeLabs(options: { labs?: number; runsPerLab?: number; scaleLabs?: boolean } = {}): VolumeLab[] {
  const labs = Array.from({ length: options.labs ?? 10 }, (_, i) => ({ code: `LOAD${String(i + 1).padStart(2, '0')}`, runs: options.runsPerLab ?? 10_000 }));
  if (options.scaleLabs !== false) labs.push({ code: 'LOADS100', runs: 100 }, { code: 'LOADS1K', runs: 1_000 });
  return labs;
}

const LAB_NAMES = ['Brindle Point RF Lab', 'Corrach Test House', 'Dunmere Radio Laboratory', 'Elsworth Marine RF', 'Fallowmoor Compliance Lab', 'Gannet Sound Test Centre', 'Harrowmere Signals Lab', 'Inchkeel RF Services', 'Juniper Quay Test Lab', 'Kelderby Radio Test', 'Larkspur Bay RF', 'Mossbank Transmitter Lab'];
const MAKERS = [
  { code: 'LMFR1', name: 'Tidewrack Marine Radio' },
  { code: 'LMFR2', name: 'Skerrow Communications' },
  { code: 'LMFR3', name: 'Pellmoor Electronics' },
  { code: 'LMFR4', name: 'Corvell Maritime Systems' },
  { code: 'LMFR5', name: 'Ashgrove Radio Works' },
];
const CLIENT_FIRST = ['Tidewrack', 'Skerrow', 'Pellmoor', 'Corvell', 'Ashgrove', 'Brackwater', 'Saltrigg', 'Cormery', 'Dunlin', 'Wherry'];
const CLIENT_SECOND = ['Marine Radio', 'Communications', 'Electronics', 'Maritime Systems', 'Radio Works'];
const ROLES: { key: string; role: string; count: number }[] = [
  { key: 'admin', role: 'lab-admin', count: 1 },
  { key: 'engineer', role: 'engineer', count: 4 },
  { key: 'reviewer', role: 'reviewer', count: 2 },
  { key: 'billing', role: 'billing', count: 1 },
];
/** The test cases of every plan; the mask case (position 4) is judged from an uploaded trace. */
const CASES = [
  { position: 1, kind: 'carrier-suppression', label: '2182 kHz, full power', frequencyHz: 2_182_000 },
  { position: 2, kind: 'carrier-suppression', label: '8291 kHz, full power', frequencyHz: 8_291_000 },
  { position: 3, kind: 'unwanted-sideband', label: '2182 kHz, 1 kHz tone', frequencyHz: 2_182_000 },
  { position: 4, kind: 'emission-mask', label: '2182 kHz, two-tone mask (trace)', frequencyHz: 2_182_000 },
] as const;
const CARRIER_VALUES = { pepDbm: 51.76, carrierDbm: 6.4 };
const SIDEBAND_VALUES = { wantedToneDbm: 48.7, imageToneDbm: 2.1 };
/** The two instruments on every run (serial numbers from server/demo/demo-instruments.ts). */
const RUN_INSTRUMENT_SERIALS = ['KSA-26-0193', 'KAT-40-1127'];

const BULK_TABLES = ['clients', 'devices', 'test_plans', 'test_cases', 'test_runs', 'run_instruments', 'readings', 'results', 'audit_log', 'reports'];

/** E-mail of a seeded person, e.g. engineer2.load01@load-bench.example. */
export function volumeEmail(code: string, key: string, n: number): string {
  return `${key}${n}.${code.toLowerCase()}@load-bench.example`;
}

interface SharedInputs {
  passwordHash: string;
  ruleSetId: string;
  snapshot: Record<string, unknown>;
  makerIds: string[];
  pdf: Buffer;
  pdfSha256: string;
  pageCount: number;
}

/** The sample maritime rule set, the invented manufacturers, one signed PDF, one password hash. */
async function sharedInputs(sequelize: Sequelize): Promise<SharedInputs> {
  await ensureBuiltInRuleSets(sequelize);
  const [passwordHash, signed] = await Promise.all([hashPassword(VOLUME_PASSWORD), samplePdf()]);
  return asSystem(sequelize, async (transaction) => {
    const [ruleSet] = await sequelize.query<{ id: string; key: string; name: string; version: number; body: RuleSetBody }>(
      "SELECT id, key, name, version, body FROM rule_sets WHERE organization_id IS NULL AND key = 'us-maritime-hf-ssb' ORDER BY version DESC LIMIT 1",
      { type: QueryTypes.SELECT, transaction },
    );
    const makerIds: string[] = [];
    for (const m of MAKERS) {
      const [row] = await sequelize.query<{ id: string }>(
        `INSERT INTO organizations (kind, name, code, address_lines) VALUES ('manufacturer', :name, :code, '["1 Invented Wharf", "Nowhere Bay"]')
         ON CONFLICT (code) DO UPDATE SET code = EXCLUDED.code RETURNING id`,
        { replacements: m, type: QueryTypes.SELECT, transaction },
      );
      makerIds.push(row.id);
    }
    return {
      passwordHash,
      ruleSetId: ruleSet.id,
      snapshot: { ...ruleSet.body, name: ruleSet.name, version: ruleSet.version, key: ruleSet.key },
      makerIds,
      ...signed,
    };
  });
}

async function samplePdf(): Promise<{ pdf: Buffer; pdfSha256: string; pageCount: number }> {
  const identity = generateLabSigningIdentity({ labName: LAB_NAMES[0], country: 'GB' });
  const { pdf, pageCount } = await renderReportPdf(buildSampleReportDocument());
  const signed = await signPdf(pdf, identity, { reason: 'Load benchmark sample report', name: 'Load bench reviewer' });
  return { pdf: signed, pdfSha256: sha256Hex(signed), pageCount };
}

/** What the shared engine stores for the fixed readings, as saveReading would (server/runs/run-service.ts). */
function storedResult(kind: 'carrier-suppression' | 'unwanted-sideband', values: Record<string, number>, rules: RuleSetBody, instruments: Instrument[]) {
  const r = evaluateTestCase({ kind, readings: values, rules, instrumentContributions: contributionsByBudget(instruments) });
  return {
    value: r.value,
    unit: r.unit,
    limit: r.limit,
    margin: r.margin,
    expanded: r.uncertainty.expanded,
    k: r.uncertainty.coverageFactor,
    verdict: r.verdict,
    detail: JSON.stringify({
      limitText: r.limitText,
      direction: r.direction,
      decisionRuleText: r.decisionRuleText,
      budget: r.uncertainty.rows,
      inputs: r.detail,
      combinedStandard: r.uncertainty.combinedStandard,
      instruments: instruments.map((i) => ({ id: i.id, name: i.name, serialNumber: i.serialNumber, calibrationDue: i.calibrationDue, certificateRef: i.certificateRef })),
    }),
  };
}

/** Seed one lab in one system-scope transaction; false when its code exists already. */
async function seedLab(sequelize: Sequelize, shared: SharedInputs, lab: VolumeLab, index: number): Promise<boolean> {
  return asSystem(sequelize, async (transaction) => {
    const q = <T extends object = Record<string, unknown>>(sql: string, replacements: Record<string, unknown> = {}) =>
      sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction });
    const run = (sql: string, replacements: Record<string, unknown>) => sequelize.query(sql, { replacements, transaction });
    if ((await q('SELECT 1 FROM organizations WHERE code = :code', { code: lab.code })).length) return false;
    // Bulk statements of a big lab may outlast the application's 30 s statement limit on a busy machine.
    await sequelize.query('SET LOCAL statement_timeout = 0', { transaction });
    const name = LAB_NAMES[index % LAB_NAMES.length] + (index >= LAB_NAMES.length ? ` ${index + 1}` : '');
    const [org] = await q<{ id: string }>(
      `INSERT INTO organizations (kind, name, code, address_lines, email, accreditation) VALUES ('lab', :name, :code, '["3 Invented Quay", "Harbour Town"]', :email, 'Invented accreditation 0000')
       RETURNING id`,
      { name, code: lab.code, email: `lab@${lab.code.toLowerCase()}.load-bench.example` },
    );
    const ids: Record<string, string[]> = {};
    for (const r of ROLES) {
      ids[r.key] = [];
      for (let n = 1; n <= r.count; n++) {
        const [user] = await q<{ id: string }>(
          'INSERT INTO users (email, display_name, password_hash) VALUES (:email, :display, :hash) RETURNING id',
          { email: volumeEmail(lab.code, r.key, n), display: `${r.role.replace('lab-', '')} ${n}, ${name}`, hash: shared.passwordHash },
        );
        await run('INSERT INTO memberships (organization_id, user_id, role) VALUES (:org, :user, :role)', { org: org.id, user: user.id, role: r.role });
        ids[r.key].push(user.id);
      }
    }
    const o = { org: org.id, n: lab.runs };
    const devices = Math.max(10, Math.round(lab.runs / 10));
    const clients = Math.min(50, devices);

    // The equipment register: the demo's invented instruments (one overdue, one due soon).
    const instruments: Instrument[] = [];
    for (const i of demoInstruments(todayIso())) {
      const [row] = await q<{ id: string }>(
        `INSERT INTO instruments (organization_id, name, model, serial_number, calibrated_on, calibration_due, certificate_ref, contributions)
         VALUES (:org, :name, :model, :serial, :on, :due, :cert, :contributions::jsonb) RETURNING id`,
        { org: org.id, name: i.name, model: i.model, serial: i.serialNumber, on: i.calibratedOn, due: i.calibrationDue, cert: i.certificateRef, contributions: JSON.stringify(i.contributions) },
      );
      if (RUN_INSTRUMENT_SERIALS.includes(i.serialNumber)) instruments.push({ ...i, id: row.id } as unknown as Instrument);
    }

    await run(
      `INSERT INTO clients (organization_id, client_organization_id, name, address_lines, contact_name, contact_email, created_at)
       SELECT :org, CASE WHEN g <= 5 THEN (ARRAY[:makers]::uuid[])[g] END,
              (ARRAY[:first])[1 + (g - 1) % 10] || ' ' || (ARRAY[:second])[1 + ((g - 1) / 10) % 5],
              '["7 Invented Road", "Portside"]', 'Contact ' || g, 'contact@client-' || g || '.' || lower(:code) || '.load-bench.example',
              now() - interval '2 years' + g * interval '1 day'
         FROM generate_series(1, :clients) g`,
      { ...o, makers: shared.makerIds, first: CLIENT_FIRST, second: CLIENT_SECOND, code: lab.code, clients },
    );
    await run(
      `WITH c AS (SELECT id, name, row_number() OVER (ORDER BY created_at, id) AS k FROM clients WHERE organization_id = :org)
       INSERT INTO devices (organization_id, client_id, manufacturer, model, serial_number, firmware, rated_pep_w, emission_designator,
                            frequency_min_hz, frequency_max_hz, modes, received_on, condition, created_at)
       SELECT :org, c.id, c.name, (ARRAY['HX-150', 'MR-400', 'SB-125', 'TR-1000', 'VX-60'])[1 + g % 5] || ' HF SSB transceiver',
              'SN-' || lpad(g::text, 6, '0'), '2.' || (g % 9), (ARRAY[150, 400, 125, 1000, 60])[1 + g % 5], '2K80J3E',
              1600000, 27500000, '{USB,LSB}', (now() - (:devices - g) * interval '8 hours')::date, 'As received, no visible damage',
              now() - (:devices - g) * interval '8 hours'
         FROM generate_series(1, :devices) g JOIN c ON c.k = 1 + (g - 1) % :clients`,
      { ...o, devices, clients },
    );
    await run(
      `INSERT INTO test_plans (organization_id, device_id, rule_set_id, rule_set_snapshot, name, created_at)
       SELECT :org, d.id, :ruleSet, :snapshot::jsonb, split_part(d.model, ' ', 1) || ' type test', d.created_at FROM devices d WHERE d.organization_id = :org`,
      { ...o, ruleSet: shared.ruleSetId, snapshot: JSON.stringify(shared.snapshot) },
    );
    await run(
      `INSERT INTO test_cases (organization_id, plan_id, position, kind, label, parameters)
       SELECT :org, p.id, k.position, k.kind, k.label, jsonb_build_object('frequencyHz', k.hz, 'sideband', 'USB', 'powerLevel', 'Full rated PEP')
         FROM test_plans p CROSS JOIN (SELECT * FROM jsonb_to_recordset(:cases::jsonb) AS x(position int, kind text, label text, "frequencyHz" double precision)) k(position, kind, label, hz)
        WHERE p.organization_id = :org`,
      { ...o, cases: JSON.stringify(CASES) },
    );
    // Runs: number g is the g-th oldest; ten runs per plan; states by age (see the header).
    await run(
      `WITH p AS (SELECT id, row_number() OVER (ORDER BY created_at, id) AS k FROM test_plans WHERE organization_id = :org),
            g AS (SELECT g, :n - g AS age,
                         CASE WHEN :n - g < :n * 0.03 THEN CASE WHEN g % 3 = 0 THEN 'draft' ELSE 'testing' END
                              WHEN :n - g < :n * 0.20 THEN CASE g % 10 WHEN 0 THEN 'in-review' WHEN 1 THEN 'approved' ELSE 'testing' END
                              WHEN g % 8 = 0 THEN 'issued' ELSE 'approved' END AS state
                    FROM generate_series(1, :n) g)
       INSERT INTO test_runs (organization_id, plan_id, number, state, engineer_id, reviewer_id, tested_from, tested_to, created_at, updated_at)
       SELECT :org, p.id, 'RUN-' || lpad(g.g::text, 6, '0'), g.state, (ARRAY[:engineers]::uuid[])[1 + g.g % 4],
              CASE WHEN g.state IN ('approved', 'issued') THEN (ARRAY[:reviewers]::uuid[])[1 + g.g % 2] END,
              CASE WHEN g.state <> 'draft' THEN (now() - g.age * interval '50 minutes')::date END,
              CASE WHEN g.state NOT IN ('draft', 'testing') THEN (now() - g.age * interval '50 minutes' + interval '1 day')::date END,
              now() - g.age * interval '50 minutes', now() - g.age * interval '50 minutes' + CASE WHEN g.state = 'testing' THEN interval '10 minutes' ELSE interval '2 days' END
         FROM g JOIN p ON p.k = 1 + (g.g - 1) % :plans`,
      { ...o, engineers: ids.engineer, reviewers: ids.reviewer, plans: devices },
    );
    await run(
      `INSERT INTO org_counters (organization_id, name, value) VALUES (:org, 'run', :n)`,
      o,
    );
    await run(
      `INSERT INTO run_instruments (organization_id, run_id, instrument_id, assigned_by, created_at)
       SELECT :org, r.id, i, r.engineer_id, r.created_at FROM test_runs r CROSS JOIN unnest(ARRAY[:instruments]::uuid[]) i
        WHERE r.organization_id = :org AND r.state <> 'draft'`,
      { ...o, instruments: instruments.map((i) => i.id) },
    );
    // Statistics that include this lab's new rows (ANALYZE counts the transaction's own inserts), so
    // the joins below are planned for 10,000 runs rather than for none.
    await sequelize.query('ANALYZE test_runs, test_cases', { transaction });
    await run(
      `INSERT INTO readings (organization_id, run_id, test_case_id, values, entered_by, created_at)
       SELECT :org, r.id, c.id, CASE c.kind WHEN 'carrier-suppression' THEN :carrier::jsonb ELSE :sideband::jsonb END, r.engineer_id, r.created_at + c.position * interval '20 minutes'
         FROM test_runs r JOIN test_cases c ON c.organization_id = :org AND c.plan_id = r.plan_id
        WHERE r.organization_id = :org
          AND ((r.state NOT IN ('draft', 'testing') AND c.position <= 3) OR (r.state = 'testing' AND c.position = 1 AND right(r.number, 1)::int % 2 = 0))`,
      { ...o, carrier: JSON.stringify(CARRIER_VALUES), sideband: JSON.stringify(SIDEBAND_VALUES) },
    );
    await sequelize.query('ANALYZE readings', { transaction });
    for (const [kind, values] of [['carrier-suppression', CARRIER_VALUES], ['unwanted-sideband', SIDEBAND_VALUES]] as const) {
      const s = storedResult(kind, values, shared.snapshot as unknown as RuleSetBody, instruments);
      await run(
        `INSERT INTO results (organization_id, run_id, test_case_id, reading_id, engine_version, value, unit, limit_value, margin,
                              expanded_uncertainty, coverage_factor, verdict, detail, created_at)
         SELECT :org, x.run_id, x.test_case_id, x.id, :engine, :value, :unit, :limit, :margin, :expanded, :k, :verdict, :detail::jsonb, x.created_at
             FROM readings x WHERE x.organization_id = :org AND x.values ->> :field IS NOT NULL`,
        { ...o, ...s, engine: ENGINE_VERSION, field: Object.keys(values)[0] },
      );
    }
    await run(
      `INSERT INTO audit_log (organization_id, user_id, action, entity, entity_id, after, at)
       SELECT :org, r.engineer_id, 'create', 'test-run', r.id::text, jsonb_build_object('number', r.number), r.created_at
         FROM test_runs r WHERE r.organization_id = :org`,
      o,
    );
    const verdicts = JSON.stringify(['pass', 'pass', 'pass']);
    await run(
      `INSERT INTO reports (organization_id, run_id, client_organization_id, report_number, revision, verify_token, sha256, pdf, page_count, summary, issued_by, issued_at)
       SELECT :org, r.id, c.client_organization_id, :code || '-' || extract(year FROM r.updated_at) || '-' || lpad(r.number_n::text, 5, '0'), 1,
              replace(gen_random_uuid()::text, '-', ''), :sha, :pdf, :pages,
              jsonb_build_object('device', d.manufacturer || ' ' || d.model, 'serialNumber', d.serial_number, 'client', c.name, 'lab', :name,
                                 'verdicts', :verdicts::jsonb, 'receivedOn', d.received_on, 'testedFrom', r.tested_from, 'testedTo', r.tested_to),
              r.reviewer_id, r.updated_at
         FROM (SELECT *, right(number, 6)::int AS number_n FROM test_runs WHERE organization_id = :org AND state = 'issued') r
         JOIN test_plans p ON p.id = r.plan_id JOIN devices d ON d.id = p.device_id JOIN clients c ON c.id = d.client_id`,
      { ...o, code: lab.code, name, sha: shared.pdfSha256, pdf: shared.pdf, pages: shared.pageCount, verdicts },
    );
    return true;
  });
}

/**
 * Seed every lab that does not exist yet, then refresh the planner's statistics (as autovacuum
 * would after a bulk load). Returns the codes created and the time taken.
 */
export async function seedVolume(sequelize: Sequelize, labs: VolumeLab[], log: (line: string) => void = () => undefined): Promise<{ created: string[]; ms: number }> {
  const started = performance.now();
  const shared = await sharedInputs(sequelize);
  const created: string[] = [];
  for (const [i, lab] of labs.entries()) {
    const t0 = performance.now();
    if (await seedLab(sequelize, shared, lab, i)) {
      created.push(lab.code);
      // Fresh statistics before the next lab, so its joins are planned for the tables' real size.
      await sequelize.query(`ANALYZE ${BULK_TABLES.join(', ')}`);
      log(`  ${lab.code}: ${lab.runs.toLocaleString('en')} runs in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
    }
  }
  if (created.length) await sequelize.query('VACUUM ANALYZE');
  return { created, ms: performance.now() - started };
}

async function main(): Promise<void> {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('seed-volume: set DATABASE_URL to a migrated scratch database');
  const arg = (name: string) => {
    const i = process.argv.indexOf(name);
    return i > 0 ? Number(process.argv[i + 1]) : undefined;
  };
  const sequelize = createSequelize(url, { poolMax: 2 });
  initModels(sequelize);
  try {
    const labs = volumeLabs({ labs: arg('--labs'), runsPerLab: arg('--runs') });
    const { created, ms } = await seedVolume(sequelize, labs, console.log);
    console.log(`seeded ${created.length} lab(s) in ${(ms / 1000).toFixed(1)} s`);
  } finally {
    await sequelize.close();
  }
}

if (require.main === module) {
  main().catch((error) => {
    console.error(error instanceof Error ? error.stack : error);
    process.exit(1);
  });
}
