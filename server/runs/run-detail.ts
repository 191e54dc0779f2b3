/**
 * The run workspace (GET /runs/:id and the answer of every run action): the run, its plan, device,
 * client and instruments, and per test case the latest reading, the result of that reading, the
 * latest result from an upload, and the uploads. One prepared statement builds it all: the latest
 * rows come from the (organization_id, run_id, test_case_id, created_at DESC) indexes, one probe
 * a case, however many readings the run has collected (every save keeps the earlier ones).
 */
import type { Transaction } from 'sequelize';
import { isoText } from '../db/iso-text';
import { preparedRows } from '../db/prepared-query';
import { notFound } from '../http/problem';
import { calibrationStatus, todayIso } from '../instruments/calibration-status';
import type { TestCase } from '../db/models';

const resultJson = (alias: string, source: 'readingId' | 'uploadId') => `json_build_object(
  'id', ${alias}.id, '${source}', ${alias}.${source === 'readingId' ? 'reading_id' : 'upload_id'}, 'engineVersion', ${alias}.engine_version,
  'value', ${alias}.value, 'unit', ${alias}.unit, 'limit', ${alias}.limit_value, 'margin', ${alias}.margin,
  'expandedUncertainty', ${alias}.expanded_uncertainty, 'coverageFactor', ${alias}.coverage_factor, 'verdict', ${alias}.verdict,
  'detail', ${alias}.detail, 'createdAt', ${isoText(`${alias}.created_at`)})`;

const RUN_DETAIL = `
SELECT r.id, r.number, r.state, r.plan_id AS "planId", r.engineer_id AS "engineerId", r.reviewer_id AS "reviewerId",
       r.return_reason AS "returnReason", r.tested_from::text AS "testedFrom", r.tested_to::text AS "testedTo",
       ${isoText('r.created_at')} AS "createdAt", ${isoText('r.updated_at')} AS "updatedAt",
       json_build_object('id', p.id, 'name', p.name, 'ruleSet', p.rule_set_snapshot) AS plan,
       json_build_object('id', d.id, 'manufacturer', d.manufacturer, 'model', d.model, 'serialNumber', d.serial_number,
                         'emissionDesignator', d.emission_designator, 'ratedPepW', d.rated_pep_w) AS device,
       json_build_object('id', c.id, 'name', c.name, 'contactName', c.contact_name, 'contactEmail', c.contact_email) AS client,
       coalesce((SELECT json_agg(json_build_object('id', i.id, 'name', i.name, 'model', i.model, 'serialNumber', i.serial_number,
                                                   'calibratedOn', i.calibrated_on, 'calibrationDue', i.calibration_due, 'certificateRef', i.certificate_ref)
                                 ORDER BY i.name, i.id)
                   FROM run_instruments ri JOIN instruments i ON i.organization_id = ri.organization_id AND i.id = ri.instrument_id
                  WHERE ri.organization_id = r.organization_id AND ri.run_id = r.id), '[]') AS instruments,
       coalesce((SELECT json_agg(json_build_object(
                  'id', tc.id, 'position', tc.position, 'kind', tc.kind, 'label', tc.label, 'parameters', tc.parameters,
                  'reading', (SELECT json_build_object('id', rd.id, 'values', rd.values, 'enteredBy', rd.entered_by, 'createdAt', ${isoText('rd.created_at')})
                                FROM readings rd WHERE rd.organization_id = r.organization_id AND rd.run_id = r.id AND rd.test_case_id = tc.id
                               ORDER BY rd.created_at DESC LIMIT 1),
                  'result', (SELECT ${resultJson('rs', 'readingId')}
                               FROM results rs WHERE rs.organization_id = r.organization_id AND rs.run_id = r.id AND rs.test_case_id = tc.id AND rs.reading_id IS NOT NULL
                              ORDER BY rs.created_at DESC LIMIT 1),
                  'traceResult', (SELECT ${resultJson('ts', 'uploadId')}
                                    FROM results ts WHERE ts.organization_id = r.organization_id AND ts.run_id = r.id AND ts.test_case_id = tc.id AND ts.upload_id IS NOT NULL
                                   ORDER BY ts.created_at DESC LIMIT 1),
                  'uploads', coalesce((SELECT json_agg(json_build_object(
                                'id', u.id, 'runId', u.run_id, 'testCaseId', u.test_case_id, 'format', u.format,
                                'file', json_build_object('name', u.file_name, 'sizeBytes', u.file_size_bytes, 'sha256', u.file_sha256, 'href', '/api/uploads/' || u.id || '/file'),
                                'data', CASE WHEN u.data_key IS NULL THEN NULL ELSE json_build_object('name', u.data_file_name, 'sizeBytes', u.data_size_bytes, 'sha256', u.data_sha256, 'href', '/api/uploads/' || u.id || '/file?part=data') END,
                                'parameters', u.parameters, 'engineVersion', u.engine_version, 'uploadedBy', u.uploaded_by,
                                'viaApiKey', u.api_key_id IS NOT NULL, 'createdAt', ${isoText('u.created_at')}) ORDER BY u.created_at DESC)
                                 FROM uploads u WHERE u.organization_id = r.organization_id AND u.run_id = r.id AND u.test_case_id = tc.id), '[]')
                ) ORDER BY tc.position)
                  FROM test_cases tc WHERE tc.organization_id = r.organization_id AND tc.plan_id = r.plan_id), '[]') AS "testCases"
  FROM test_runs r
  JOIN test_plans p ON p.organization_id = r.organization_id AND p.id = r.plan_id
  JOIN devices d ON d.organization_id = r.organization_id AND d.id = p.device_id
  JOIN clients c ON c.organization_id = r.organization_id AND c.id = d.client_id
 WHERE r.id = $1`;

interface Stored {
  id: string;
  readingId?: string;
  uploadId?: string;
  [key: string]: unknown;
}
interface CaseRow {
  id: string;
  position: number;
  kind: TestCase['kind'];
  label: string;
  parameters: Record<string, unknown>;
  reading: { id: string; values: Record<string, unknown>; enteredBy: string | null; createdAt: string } | null;
  result: Stored | null;
  traceResult: Stored | null;
  uploads: Record<string, unknown>[];
}
interface DetailRow {
  id: string;
  number: string;
  state: string;
  planId: string;
  engineerId: string | null;
  reviewerId: string | null;
  returnReason: string | null;
  testedFrom: string | null;
  testedTo: string | null;
  createdAt: string;
  updatedAt: string;
  plan: { id: string; name: string; ruleSet: Record<string, unknown> };
  device: Record<string, unknown>;
  client: Record<string, unknown>;
  instruments: { id: string; name: string; model: string; serialNumber: string; calibratedOn: string; calibrationDue: string; certificateRef: string }[];
  testCases: CaseRow[];
}

/**
 * The workspace of run `runId`, or a 404 when there is no such run in the organization.
 * `thenCommit` when it is the transaction's last statement (server/db/prepared-query.ts).
 */
export async function runDetail(transaction: Transaction, runId: string, options: { thenCommit?: boolean } = {}) {
  const [row] = await preparedRows<DetailRow>(transaction, RUN_DETAIL, [runId], options);
  if (!row) throw notFound('The test run');
  const today = todayIso();
  const { instruments, testCases, ...run } = row;
  return {
    ...run,
    instruments: instruments.map((i) => ({ ...i, calibrationStatus: calibrationStatus(i.calibrationDue, today) })),
    testCases: testCases.map((c) => ({
      ...c,
      // A result is shown only while its reading is the latest one (a later reading may not evaluate).
      result: c.result && c.reading && c.result.readingId === c.reading.id ? c.result : null,
    })),
  };
}
