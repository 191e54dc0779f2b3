import { EVALUABLE_KINDS, evaluateTrace } from '../../shared/evaluation/evaluate-trace';
import { EvaluationError } from '../../shared/evaluation/evaluate-test-case';
import { diagnosePhasing } from '../../shared/phasing/diagnose-phasing';
import { TEST_KIND_LABELS } from '../../shared/rules/test-kind';
import { PRECHECK_NOTICE, precheckFieldsSchema, type PrecheckFields } from '../../shared/schemas/uploads';
import { RuleSet } from '../db/models';
import { validationFailed } from '../http/problem';
import type { RouteContext } from '../http/route';
import { inTenant } from '../tenancy/tenant-transaction';
import { prepareUpload } from './prepare-upload';
import { receiveMultipart } from './receive-multipart';
import type { UploadDeps } from './upload-deps';
import type { createPrecheckLimiter } from './precheck-limiter';

/**
 * POST /precheck: a manufacturer runs the lab's analysis on its own trace or capture against a
 * built-in sample rule set, to see every margin (and, for a capture with a wanted tone, the
 * phasing diagnosis) before sending a radio for testing. Same path as a lab upload up to the
 * analysis, then every kind the evidence can decide is judged; NOTHING is stored (no upload, no
 * result, no file: the incoming folder is emptied in every case) and the answer is marked
 * unaccredited, so it can never be mistaken for, or become, a report.
 */
export async function runPrecheck(deps: UploadDeps, limiter: ReturnType<typeof createPrecheckLimiter>, ctx: RouteContext): Promise<unknown> {
  await limiter.take(ctx.principal!.userId);
  const received = await receiveMultipart(ctx.req, ctx.res, { incomingDir: deps.incomingDir, maxFileBytes: deps.settings.maxPrecheckBytes, allowData: true });
  try {
    let ruleSet: RuleSet | null = null;
    const prepared = await prepareUpload<PrecheckFields>(received, {
      schema: precheckFieldsSchema,
      maxTraceBytes: deps.settings.maxTraceBytes,
      defaults: {},
      checkFields: async (fields) => {
        ruleSet = await inTenant(deps.sequelize, ctx.organizationId, () => RuleSet.findOne({ where: { id: fields.ruleSetId, organizationId: null, isSample: true } }));
        if (!ruleSet) throw validationFailed('Choose one of the built-in sample rule sets for a pre-check.', [{ pointer: '/ruleSetId', message: 'is not a built-in sample rule set' }]);
      },
    });
    const sample = ruleSet as unknown as RuleSet;
    const rules = sample.body;
    const checks = EVALUABLE_KINDS[prepared.evidence.source].map((kind) => {
      try {
        const e = evaluateTrace({ kind, evidence: prepared.evidence, rules });
        return { kind, label: TEST_KIND_LABELS[kind], value: e.value, unit: e.unit, limit: e.limit, limitText: e.limitText, margin: e.margin, expandedUncertainty: e.uncertainty.expanded, verdict: e.verdict, decisionRuleText: e.decisionRuleText, inputs: e.detail, ...(e.mask && { mask: e.mask }) };
      } catch (error) {
        if (!(error instanceof EvaluationError) && !(error instanceof RangeError)) throw error;
        return { kind, label: TEST_KIND_LABELS[kind], problem: error.message };
      }
    });
    const ev = prepared.evidence;
    const required = rules.limits.unwantedSideband?.minDb;
    const phasing = ev.source === 'iq' && ev.unwantedSidebandSuppressionDb !== null && required !== undefined ? diagnosePhasing({ measuredSuppressionDb: ev.unwantedSidebandSuppressionDb, requiredDb: required }) : null;
    ctx.status(200);
    return {
      unaccredited: true,
      notice: PRECHECK_NOTICE,
      ruleSet: { id: sample.id, key: sample.key, name: sample.name, version: sample.version, sampleNotice: rules.sampleNotice ?? null },
      format: prepared.format,
      file: { name: prepared.file.keptName, sizeBytes: prepared.file.sizeBytes, sha256: prepared.file.sha256 },
      data: prepared.data && { name: prepared.data.keptName, sizeBytes: prepared.data.sizeBytes, sha256: prepared.data.sha256 },
      parameters: { ...prepared.fields, carrierHz: prepared.carrierHz, sideband: prepared.sideband },
      analysis: prepared.summary,
      checks,
      phasing,
    };
  } finally {
    await received.discard();
  }
}
