/**
 * What saving a reading or uploading a file for one test case of a run needs to know, in one
 * prepared statement: the run's state, the case (kind and parameters), the plan's rule-set
 * snapshot and the instruments on the run with their calibration and contributions.
 */
import type { Transaction } from 'sequelize';
import { preparedRows } from '../db/prepared-query';
import type { TestCase } from '../db/models';
import type { RuleSetBody } from '../../shared/rules/rule-set';
import type { RunInstrumentFacts } from '../instruments/run-instruments';

const RUN_CASE_TARGET = `
SELECT r.id AS "runId", r.organization_id AS "organizationId", r.state, tc.id AS "caseId", tc.kind, tc.parameters, p.rule_set_snapshot AS rules,
       coalesce((SELECT json_agg(json_build_object('id', i.id, 'name', i.name, 'serialNumber', i.serial_number, 'calibrationDue', i.calibration_due,
                                                   'certificateRef', i.certificate_ref, 'contributions', i.contributions) ORDER BY i.name, i.id)
                   FROM run_instruments ri JOIN instruments i ON i.organization_id = ri.organization_id AND i.id = ri.instrument_id
                  WHERE ri.organization_id = r.organization_id AND ri.run_id = r.id), '[]') AS instruments
  FROM test_runs r
  JOIN test_plans p ON p.organization_id = r.organization_id AND p.id = r.plan_id
  LEFT JOIN test_cases tc ON tc.organization_id = r.organization_id AND tc.plan_id = r.plan_id AND tc.id = $2
 WHERE r.id = $1 AND r.organization_id = $3`;

export interface RunCaseTarget {
  runId: string;
  organizationId: string;
  state: string;
  /** Null when the case is not one of the run's plan. */
  caseId: string | null;
  kind: TestCase['kind'] | null;
  parameters: Record<string, unknown> | null;
  rules: RuleSetBody;
  instruments: RunInstrumentFacts[];
}

/** The run `runId` of the organization with case `caseId`, or null when there is no such run. */
export async function loadRunCaseTarget(transaction: Transaction, organizationId: string, runId: string, caseId: string): Promise<RunCaseTarget | null> {
  const [row] = await preparedRows<RunCaseTarget>(transaction, RUN_CASE_TARGET, [runId, caseId, organizationId]);
  return row ?? null;
}
