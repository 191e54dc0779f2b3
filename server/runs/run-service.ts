/**
 * The rules of a test run: who may move it, to where, and what must be true first. Handlers call
 * these; the state table itself lives in shared/runs/run-state.ts so the client shows the same.
 */
import { Op, type Sequelize } from 'sequelize';
import { Client, Device, Reading, Result, TestCase, TestPlan, TestRun, Upload } from '../db/models';
import { conflict, forbidden, notFound, validationFailed } from '../http/problem';
import type { RouteContext } from '../http/route';
import { nextState, type RunAction } from '../../shared/runs/run-state';
import { evaluateTestCase, EvaluationError } from '../../shared/evaluation/evaluate-test-case';
import { ENGINE_VERSION } from '../../shared/engine-version';
import { READING_FIELDS, type ReadingValues } from '../../shared/evaluation/reading-fields';
import { audit } from '../audit/audit';
import { nextCounter } from './run-number';
import { presentResult, presentRun } from './run-presenter';
import { assignedInstruments, contributionsByBudget, presentRunInstrument, refuseOverdue } from '../instruments/run-instruments';
import { todayIso } from '../instruments/calibration-status';
import { presentUpload, presentUploadResult } from '../uploads/upload-presenter';

export async function loadRun(id: string) {
  const run = await TestRun.findByPk(id);
  if (!run) throw notFound('The test run');
  return run;
}

export async function runDetail(run: TestRun) {
  const plan = (await TestPlan.findByPk(run.planId))!;
  const device = (await Device.findByPk(plan.deviceId))!;
  const client = (await Client.findByPk(device.clientId))!;
  const cases = await TestCase.findAll({ where: { planId: plan.id }, order: [['position', 'ASC']] });
  // Each query names the organization so the (organization_id, run_id, ...) indexes serve it.
  const byRun = { organizationId: run.organizationId, runId: run.id };
  const readings = await Reading.findAll({ where: byRun, order: [['createdAt', 'DESC']] });
  const results = await Result.findAll({ where: byRun, order: [['createdAt', 'DESC']] });
  const uploads = await Upload.findAll({ where: byRun, attributes: { exclude: ['analysis'] }, order: [['createdAt', 'DESC']] });
  const instruments = await assignedInstruments(run);
  const today = todayIso();
  return {
    ...presentRun(run),
    instruments: instruments.map((i) => presentRunInstrument(i, today)),
    plan: { id: plan.id, name: plan.name, ruleSet: plan.ruleSetSnapshot },
    device: { id: device.id, manufacturer: device.manufacturer, model: device.model, serialNumber: device.serialNumber, emissionDesignator: device.emissionDesignator, ratedPepW: device.ratedPepW },
    client: { id: client.id, name: client.name, contactName: client.contactName, contactEmail: client.contactEmail },
    testCases: cases.map((c) => {
      const reading = readings.find((r) => r.testCaseId === c.id) ?? null;
      const result = results.find((r) => r.testCaseId === c.id && r.readingId !== null) ?? null;
      // The latest result computed from an uploaded trace or capture (server/uploads).
      const traceResult = results.find((r) => r.testCaseId === c.id && r.uploadId !== null) ?? null;
      return {
        id: c.id,
        position: c.position,
        kind: c.kind,
        label: c.label,
        parameters: c.parameters,
        reading: reading && { id: reading.id, values: reading.values, enteredBy: reading.enteredBy, createdAt: reading.createdAt.toISOString() },
        result: result && result.readingId === reading?.id ? presentResult(result) : null,
        uploads: uploads.filter((u) => u.testCaseId === c.id).map(presentUpload),
        traceResult: traceResult && presentUploadResult(traceResult),
      };
    }),
  };
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

export async function saveReading(ctx: RouteContext, run: TestRun, caseId: string, values: ReadingValues) {
  if (run.state !== 'testing') throw conflict(`Readings can only be changed while the run is on the bench; it is ${run.state}.`, { code: 'run-not-editable' });
  const testCase = await TestCase.findOne({ where: { id: caseId, planId: run.planId } });
  if (!testCase) throw notFound('The test case');
  const plan = (await TestPlan.findByPk(run.planId))!;
  checkReadingShape(testCase.kind, values);
  const instruments = await assignedInstruments(run);
  refuseOverdue(instruments, todayIso(), 'Replace or recalibrate it before saving readings with it.');
  // The entered values are kept unchanged even when they do not evaluate yet: nothing typed is lost.
  const reading = await Reading.create({ organizationId: run.organizationId, runId: run.id, testCaseId: testCase.id, values, enteredBy: ctx.principal?.userId ?? null });
  let result: Result | null = null;
  let problem: string | null = null;
  try {
    const r = evaluateTestCase({ kind: testCase.kind, readings: values, rules: plan.ruleSetSnapshot, instrumentContributions: contributionsByBudget(instruments) });
    result = await Result.create({
      organizationId: run.organizationId,
      runId: run.id,
      testCaseId: testCase.id,
      readingId: reading.id,
      engineVersion: ENGINE_VERSION,
      value: r.value,
      unit: r.unit,
      limitValue: r.limit,
      margin: r.margin,
      expandedUncertainty: r.uncertainty.expanded,
      coverageFactor: r.uncertainty.coverageFactor,
      verdict: r.verdict,
      detail: { limitText: r.limitText, direction: r.direction, decisionRuleText: r.decisionRuleText, budget: r.uncertainty.rows, inputs: r.detail, combinedStandard: r.uncertainty.combinedStandard, instruments: instruments.map((i) => ({ id: i.id, name: i.name, serialNumber: i.serialNumber, calibrationDue: i.calibrationDue, certificateRef: i.certificateRef })) } as Record<string, unknown>,
    });
  } catch (error) {
    if (!(error instanceof EvaluationError) && !(error instanceof RangeError) && !(error instanceof TypeError)) throw error;
    problem = error.message;
  }
  await run.update({ testedTo: new Date().toISOString().slice(0, 10) });
  await audit(ctx, { action: 'save-reading', entity: 'test-run', entityId: run.id, after: { testCaseId: testCase.id, values, verdict: result?.verdict ?? null } });
  return { reading: { id: reading.id, values: reading.values, createdAt: reading.createdAt.toISOString() }, result: result && presentResult(result), problem };
}

/** Numeric fields take numbers (or null while not yet read); only the fields of the kind, and a note. */
function checkReadingShape(kind: TestCase['kind'], values: ReadingValues): void {
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
    const detail = await runDetail(run);
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
