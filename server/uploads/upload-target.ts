import { TestCase, TestPlan, TestRun } from '../db/models';
import { conflict, notFound } from '../http/problem';

/**
 * The run and test case an upload is for, read in the caller's tenant transaction: another lab's
 * run, or a case of another plan, is "not found"; a run that is not on the bench (testing) takes
 * no uploads, like readings. Called before the body is read, so a wrong address costs nothing.
 */
export async function loadUploadTarget(runId: string, caseId: string): Promise<{ run: TestRun; testCase: TestCase; plan: TestPlan }> {
  const run = await TestRun.findByPk(runId);
  if (!run) throw notFound('The test run');
  const testCase = await TestCase.findOne({ where: { id: caseId, planId: run.planId } });
  if (!testCase) throw notFound('The test case');
  if (run.state !== 'testing') throw conflict(`Files can only be uploaded while the run is on the bench; it is ${run.state}.`, { code: 'run-not-editable' });
  const plan = (await TestPlan.findByPk(run.planId))!;
  return { run, testCase, plan };
}

/** The case's carrier frequency and sideband, as the plan stored them ({ frequencyHz, sideband: 'USB' }). */
export function caseDefaults(testCase: TestCase): { carrierHz?: number; sideband?: 'usb' | 'lsb' } {
  const p = testCase.parameters as { frequencyHz?: unknown; sideband?: unknown };
  const sideband = typeof p.sideband === 'string' ? p.sideband.toLowerCase() : undefined;
  return {
    ...(typeof p.frequencyHz === 'number' && Number.isFinite(p.frequencyHz) && { carrierHz: p.frequencyHz }),
    ...((sideband === 'usb' || sideband === 'lsb') && { sideband }),
  };
}
