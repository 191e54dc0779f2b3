/**
 * The rules of a test run: who may move it, to where, and what must be true first. Handlers call
 * these; the state table itself lives in shared/runs/run-state.ts so the client shows the same.
 */
import { Op, type Sequelize } from 'sequelize';
import { Reading, TestPlan, TestRun } from '../db/models';
import { conflict, forbidden, notFound, validationFailed } from '../http/problem';
import type { RouteContext } from '../http/route';
import { nextState, type RunAction } from '../../shared/runs/run-state';
import { audit } from '../audit/audit';
import { nextCounter } from './run-number';
import { presentRun } from './run-presenter';
import { assignedInstruments, refuseOverdue } from '../instruments/run-instruments';
import { todayIso } from '../instruments/calibration-status';
import { runDetail } from './run-detail';

export async function loadRun(id: string) {
  const run = await TestRun.findByPk(id);
  if (!run) throw notFound('The test run');
  return run;
}

export async function createRun(sequelize: Sequelize, ctx: RouteContext, planId: string) {
  const plan = await TestPlan.findByPk(planId);
  if (!plan) throw validationFailed('The test plan does not exist.', [{ pointer: '/planId', message: 'is not one of your plans' }]);
  const n = await nextCounter(sequelize, ctx.organizationId!, 'run', ctx.transaction);
  const run = await TestRun.create({
    organizationId: ctx.organizationId!,
    planId: plan.id,
    number: `RUN-${String(n).padStart(6, '0')}`,
    state: 'testing',
    engineerId: ctx.principal!.userId,
    testedFrom: new Date().toISOString().slice(0, 10),
  });
  await audit(ctx, { action: 'create', entity: 'test-run', entityId: run.id, after: presentRun(run) });
  return run;
}

async function enteredBy(run: TestRun): Promise<string[]> {
  const rows = await Reading.findAll({ where: { organizationId: run.organizationId, runId: run.id, enteredBy: { [Op.ne]: null } }, attributes: ['enteredBy'], group: ['enteredBy'] });
  return rows.map((r) => r.enteredBy!);
}

export async function transition(ctx: RouteContext, run: TestRun, action: RunAction, reason?: string) {
  const to = nextState(run.state, action);
  if (!to) throw conflict(`A run that is ${run.state} cannot be moved with "${action}".`, { code: 'illegal-transition' });
  const before = presentRun(run);
  const me = ctx.principal!.userId;
  if (action === 'submit') {
    const detail = await runDetail(ctx.transaction!, run.id);
    const missing = detail.testCases.filter((c) => !c.result && !c.traceResult);
    if (missing.length) throw conflict(`Every test case needs a computed result before review; missing: ${missing.map((c) => c.label).join(', ')}.`, { code: 'results-missing' });
    refuseOverdue(await assignedInstruments(run), todayIso(), 'Repeat the affected measurements with calibrated equipment before review.');
  }
  if (action === 'approve') {
    // Four eyes: the person who authorizes must not be one who measured (ISO/IEC 17025:2017 7.8.1.1).
    const measuredBy = new Set([run.engineerId, ...(await enteredBy(run))]);
    if (measuredBy.has(me)) throw forbidden('You took readings on this run, so a different reviewer must authorize it.');
  }
  const changes: Partial<TestRun> = { state: to };
  if (action === 'approve') changes.reviewerId = me;
  if (action === 'return' || action === 'revise') changes.returnReason = reason ?? null;
  if (action === 'submit') changes.returnReason = null;
  await run.update(changes);
  await audit(ctx, { action: `run-${action}`, entity: 'test-run', entityId: run.id, before, after: { ...presentRun(run), reason: reason ?? null } });
  return run;
}
