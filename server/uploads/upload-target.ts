import type { Transaction } from 'sequelize';
import { conflict, notFound } from '../http/problem';
import type { TestCase } from '../db/models';
import { loadRunCaseTarget, type RunCaseTarget } from '../runs/run-case-target';

/** A run on the bench and one of its test cases: what an upload is checked and judged against. */
export type UploadTarget = RunCaseTarget & { caseId: string; kind: TestCase['kind']; parameters: Record<string, unknown> };

/**
 * The run and test case an upload is for, read in the caller's tenant transaction: another lab's
 * run, or a case of another plan, is "not found"; a run that is not on the bench (testing) takes
 * no uploads, like readings. Called before the body is read, so a wrong address costs nothing.
 */
export async function loadUploadTarget(transaction: Transaction, organizationId: string, runId: string, caseId: string): Promise<UploadTarget> {
  const target = await loadRunCaseTarget(transaction, organizationId, runId, caseId);
  if (!target) throw notFound('The test run');
  if (!target.caseId || !target.kind) throw notFound('The test case');
  if (target.state !== 'testing') throw conflict(`Files can only be uploaded while the run is on the bench; it is ${target.state}.`, { code: 'run-not-editable' });
  return target as UploadTarget;
}

/** The case's carrier frequency and sideband, as the plan stored them ({ frequencyHz, sideband: 'USB' }). */
export function caseDefaults(testCase: { parameters: Record<string, unknown> | null }): { carrierHz?: number; sideband?: 'usb' | 'lsb' } {
  const p = (testCase.parameters ?? {}) as { frequencyHz?: unknown; sideband?: unknown };
  const sideband = typeof p.sideband === 'string' ? p.sideband.toLowerCase() : undefined;
  return {
    ...(typeof p.frequencyHz === 'number' && Number.isFinite(p.frequencyHz) && { carrierHz: p.frequencyHz }),
    ...((sideband === 'usb' || sideband === 'lsb') && { sideband }),
  };
}
