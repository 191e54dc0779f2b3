/**
 * Saving a reading, the request a bench makes most: two prepared statements in the request's
 * transaction. The first reads what the rules need (run-case-target.ts); the second writes
 * the reading, the result computed by the shared engine, the run's last test date and the audit
 * entry, together. The entered values are kept unchanged even when they do not evaluate yet.
 */
import { conflict, notFound, validationFailed } from '../http/problem';
import type { RouteContext } from '../http/route';
import { preparedRows } from '../db/prepared-query';
import type { TestCase } from '../db/models';
import { evaluateTestCase, EvaluationError } from '../../shared/evaluation/evaluate-test-case';
import { ENGINE_VERSION } from '../../shared/engine-version';
import { READING_FIELDS, type ReadingValues } from '../../shared/evaluation/reading-fields';
import { contributionsByBudget, instrumentsOnRecord, refuseOverdue } from '../instruments/run-instruments';
import { apiKeyIdOf } from '../audit/audit';
import { presentResult } from './run-presenter';
import { loadRunCaseTarget } from './run-case-target';
import { todayIso } from '../instruments/calibration-status';

/** Data-modifying CTEs run once each, to completion, whether or not the final SELECT reads them. */
const SAVE_WRITE = `
WITH reading AS (
  INSERT INTO readings (organization_id, run_id, test_case_id, values, entered_by) VALUES ($1::uuid, $2::uuid, $3::uuid, $4::jsonb, $5::uuid)
  RETURNING id, created_at
), result AS (
  INSERT INTO results (organization_id, run_id, test_case_id, reading_id, engine_version, value, unit, limit_value, margin,
                       expanded_uncertainty, coverage_factor, verdict, detail)
  SELECT $1, $2, $3, reading.id, $6::text, $7::float8, $8::text, $9::float8, $10::float8, $11::float8, $12::float8, $13::text, $14::jsonb
    FROM reading WHERE $13::text IS NOT NULL
  RETURNING id, created_at
), run AS (
  UPDATE test_runs SET tested_to = $15::date, updated_at = now() WHERE id = $2 AND tested_to IS DISTINCT FROM $15::date
  RETURNING id
), logged AS (
  INSERT INTO audit_log (organization_id, user_id, api_key_id, action, entity, entity_id, after)
  VALUES ($1, $5, $16::uuid, 'save-reading', 'test-run', $2::text, $17::jsonb)
)
SELECT reading.id AS "readingId", reading.created_at AS "readingCreatedAt", result.id AS "resultId", result.created_at AS "resultCreatedAt"
  FROM reading LEFT JOIN result ON true`;

export async function saveReading(ctx: RouteContext, runId: string, caseId: string, values: ReadingValues) {
  const transaction = ctx.transaction!;
  const organizationId = ctx.organizationId!;
  const target = await loadRunCaseTarget(transaction, organizationId, runId, caseId);
  if (!target) throw notFound('The test run');
  if (target.state !== 'testing') throw conflict(`Readings can only be changed while the run is on the bench; it is ${target.state}.`, { code: 'run-not-editable' });
  if (!target.caseId || !target.kind) throw notFound('The test case');
  checkReadingShape(target.kind, values);
  const today = todayIso();
  refuseOverdue(target.instruments, today, 'Replace or recalibrate it before saving readings with it.');

  let computed: ReturnType<typeof evaluateTestCase> | null = null;
  let problem: string | null = null;
  try {
    computed = evaluateTestCase({ kind: target.kind, readings: values, rules: target.rules, instrumentContributions: contributionsByBudget(target.instruments) });
  } catch (error) {
    if (!(error instanceof EvaluationError) && !(error instanceof RangeError) && !(error instanceof TypeError)) throw error;
    problem = error.message;
  }
  const detail = computed && {
    limitText: computed.limitText,
    direction: computed.direction,
    decisionRuleText: computed.decisionRuleText,
    budget: computed.uncertainty.rows,
    inputs: computed.detail,
    combinedStandard: computed.uncertainty.combinedStandard,
    instruments: instrumentsOnRecord(target.instruments),
  };
  const userId = ctx.principal?.userId ?? null;
  const apiKeyId = apiKeyIdOf(ctx.req);
  const [saved] = await preparedRows<{ readingId: string; readingCreatedAt: Date; resultId: string | null; resultCreatedAt: Date | null }>(transaction, SAVE_WRITE, [
    organizationId,
    runId,
    target.caseId,
    JSON.stringify(values),
    userId,
    ENGINE_VERSION,
    computed?.value ?? null,
    computed?.unit ?? null,
    computed?.limit ?? null,
    computed?.margin ?? null,
    computed?.uncertainty.expanded ?? null,
    computed?.uncertainty.coverageFactor ?? null,
    computed?.verdict ?? null,
    detail && JSON.stringify(detail),
    today,
    apiKeyId,
    JSON.stringify({ testCaseId: target.caseId, values, verdict: computed?.verdict ?? null }),
  ], { thenCommit: true }); // the request's last statement: its COMMIT goes with it
  const result =
    computed && detail && saved.resultId && saved.resultCreatedAt
      ? presentResult({
          id: saved.resultId,
          readingId: saved.readingId,
          engineVersion: ENGINE_VERSION,
          value: computed.value,
          unit: computed.unit,
          limitValue: computed.limit,
          margin: computed.margin,
          expandedUncertainty: computed.uncertainty.expanded,
          coverageFactor: computed.uncertainty.coverageFactor,
          verdict: computed.verdict,
          detail,
          createdAt: saved.resultCreatedAt,
        })
      : null;
  return { reading: { id: saved.readingId, values, createdAt: saved.readingCreatedAt.toISOString() }, result, problem };
}

/** Numeric fields take numbers (or null while not yet read); only the fields of the kind, and a note. */
export function checkReadingShape(kind: TestCase['kind'], values: ReadingValues): void {
  const fields = READING_FIELDS[kind];
  const errors: { pointer: string; message: string }[] = [];
  for (const [key, value] of Object.entries(values)) {
    if (key === 'note') {
      if (value !== null && typeof value !== 'string') errors.push({ pointer: `/values/note`, message: 'must be text' });
      continue;
    }
    const field = fields.find((f) => f.key === key);
    if (!field) errors.push({ pointer: `/values/${key}`, message: `is not a reading of ${kind}` });
    else if (value !== null && typeof value !== 'number') errors.push({ pointer: `/values/${key}`, message: `${field.label} must be a number in ${field.unit}` });
  }
  if (errors.length) throw validationFailed(`The reading has ${errors.length} problem${errors.length === 1 ? '' : 's'}: ${errors[0].pointer} ${errors[0].message}.`, errors);
}
