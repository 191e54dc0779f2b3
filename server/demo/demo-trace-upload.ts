import type { Sequelize } from 'sequelize';
import { Organization, TestCase, TestRun, Upload, User } from '../db/models';
import type { RouteContext } from '../http/route';
import { asSystem, inTenant } from '../tenancy/tenant-transaction';
import { ingestUpload } from '../uploads/ingest-upload';
import { receiveLocalFile } from '../uploads/local-upload';
import { uploadDepsFromEnv, type UploadDeps } from '../uploads/upload-deps';
import { loadUploadTarget } from '../uploads/upload-target';
import { demoMaskTrace } from './demo-mask-trace';
import { DEMO_LAB } from './demo-scenario';

/**
 * Gives the demo run on the bench its invented emission-mask trace, uploaded by its engineer
 * through the same path as a real upload (analysis, result, stored file, audit). Idempotent: does
 * nothing when the case already has an upload or the run is no longer on the bench. Runs after
 * the demo's own transaction has committed, since an upload writes in a tenant transaction of its
 * own (the lookup is cross-organization, hence asSystem: a documented seed caller).
 */
export async function ensureDemoTraceUpload(sequelize: Sequelize, deps: UploadDeps = uploadDepsFromEnv(sequelize)): Promise<boolean> {
  const found = await asSystem(sequelize, async () => {
    const lab = await Organization.findOne({ where: { code: DEMO_LAB.code } });
    const run = lab && (await TestRun.findOne({ where: { organizationId: lab.id, state: 'testing' }, order: [['number', 'ASC']] }));
    const testCase = run && (await TestCase.findOne({ where: { planId: run.planId, kind: 'emission-mask' } }));
    if (!lab || !run || !testCase || !run.engineerId) return null;
    if ((await Upload.count({ where: { runId: run.id, testCaseId: testCase.id } })) > 0) return null;
    return { labId: lab.id, runId: run.id, caseId: testCase.id, engineer: (await User.findByPk(run.engineerId))! };
  });
  if (!found) return false;
  const { engineer } = found;
  const ctx = { organizationId: found.labId, principal: { userId: engineer.id, email: engineer.email, displayName: engineer.displayName, memberships: [] }, req: {}, transaction: null } as unknown as RouteContext;
  const target = await inTenant(sequelize, found.labId, (transaction) => loadUploadTarget(transaction, found.labId, found.runId, found.caseId));
  const trace = demoMaskTrace();
  const received = await receiveLocalFile(deps.incomingDir, { name: 'HX150 2182 kHz two-tone mask.csv', bytes: Buffer.from(trace.csv), contentType: 'text/csv' }, { referenceDbm: trace.referenceDbm.toFixed(2) });
  try {
    await ingestUpload(deps, ctx, target, received);
  } finally {
    await received.discard();
  }
  return true;
}
