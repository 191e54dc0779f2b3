/**
 * From an imported spectrum trace or I/Q capture analysis to a result with margin, uncertainty
 * and verdict: the emission mask and occupied bandwidth from a trace; carrier suppression,
 * unwanted-sideband suppression, intermodulation and occupied bandwidth from an I/Q analysis.
 * The last step (budget, GUM combination with k = 2, ILAC-G8 decision rule) is the one hand
 * readings use (`concludeMeasurement`), so both kinds of evidence are judged alike. Pure.
 */
import type { RuleSetBody } from '../rules/rule-set';
import type { TestKind } from '../rules/test-kind';
import type { UncertaintyContribution } from '../uncertainty/uncertainty-contribution';
import type { EmissionMask } from '../mask/emission-mask';
import { checkEmissionMask } from '../mask/check-emission-mask';
import { occupiedBandwidthFromTrace } from '../bandwidth/occupied-bandwidth';
import { diagnosePhasing, type PhasingDiagnosis } from '../phasing/diagnose-phasing';
import { concludeMeasurement, EvaluationError, limitOf, type Budget, type Measured } from './evaluate-test-case';
import type { TestCaseResult } from './test-case-result';

/** A spectrum-analyzer trace (ascending frequencies) and what places the mask on it. */
export interface TraceEvidence {
  source: 'trace';
  frequencyHz: Float64Array | readonly number[];
  levelDbm: Float64Array | readonly number[];
  rbwHz?: number;
  /** Carrier frequency on the trace's frequency axis, Hz. */
  carrierHz: number;
  sideband: 'usb' | 'lsb';
  /** Measured power the mask is relative to (mean or PEP, as the rule set says), dBm. */
  referenceDbm?: number;
}

/** The figures of an I/Q analysis that carry a limit (see shared/iq IqAnalysis). */
export interface IqEvidence {
  source: 'iq';
  carrierSuppressionDb: number;
  unwantedSidebandSuppressionDb: number | null;
  imd3Db: number | null;
  imd5Db: number | null;
  occupiedBandwidthHz: number;
}

export type UploadEvidence = TraceEvidence | IqEvidence;

/** The mask check behind an emission-mask result, for the reviewer and the chart. */
export interface MaskFigures {
  assignedHz: number;
  referenceDbm: number;
  reference: 'pep' | 'mean';
  exemptWithinOffsetHz: number;
  worstFrequencyHz: number;
  worstOffsetHz: number;
  worstMarginDb: number;
  pointCount: number;
  segments: { fromOffsetHz: number; toOffsetHz: number | null; fromRelDb: number; toRelDb: number; pointCount: number; worstMarginDb: number | null }[];
}

export interface TraceEvaluation extends TestCaseResult {
  mask?: MaskFigures;
  /** For an unwanted-sideband result that does not pass: the modulator errors that explain it. */
  phasing?: PhasingDiagnosis;
}

/** The test kinds each kind of evidence can decide. */
export const EVALUABLE_KINDS: Record<UploadEvidence['source'], readonly TestKind[]> = {
  trace: ['emission-mask', 'occupied-bandwidth'],
  iq: ['carrier-suppression', 'unwanted-sideband', 'intermodulation', 'occupied-bandwidth'],
};

const round = (x: number, digits = 4) => Number(x.toFixed(digits));
const present = (x: number | null): x is number => x !== null && Number.isFinite(x);

/**
 * Evaluates one test case from an upload. Emission mask: checkEmissionMask about the assigned
 * frequency = carrier ± assignedOffsetHz (− for LSB, the emission being mirrored; common
 * practice), relative to referenceDbm; within the first vertex, when it is 0 dB, the rule sets no
 * limit (e.g. 47 CFR 80.211(a): within 50 % of the authorized bandwidth) and points there are
 * not compared. The value is the level at the worst point and the limit the mask there (dBm);
 * the margin is the worst margin. Occupied bandwidth per ITU RR 1.153 (99 %).
 *
 * @throws EvaluationError when the evidence cannot decide the kind, a needed figure is missing
 *   (no reference level, no tone), or the rule set lacks the limit or the budget.
 * @example evaluateTrace({ kind: 'carrier-suppression', rules: maritime, evidence: { source: 'iq',
 *   carrierSuppressionDb: 45.2, unwantedSidebandSuppressionDb: null, imd3Db: null, imd5Db: null,
 *   occupiedBandwidthHz: 2400 } }).verdict // 'pass' against 40 dB
 */
export function evaluateTrace(input: {
  kind: TestKind;
  evidence: UploadEvidence;
  rules: RuleSetBody;
  instrumentContributions?: UncertaintyContribution[] | Partial<Record<Budget, UncertaintyContribution[]>>;
}): TraceEvaluation {
  const { kind, evidence, rules } = input;
  if (!EVALUABLE_KINDS[evidence.source].includes(kind)) {
    const what = evidence.source === 'trace' ? 'a spectrum-analyzer trace' : 'an I/Q capture';
    throw new EvaluationError(`A ${kind} case cannot be evaluated from ${what}; ${evidence.source === 'trace' ? 'upload an I/Q capture or enter readings' : 'upload a spectrum-analyzer trace (CSV)'}.`);
  }
  const measured = evidence.source === 'trace' ? measureTrace(kind, evidence, rules) : { m: measureIq(kind, evidence, rules) };
  const result: TraceEvaluation = concludeMeasurement(kind, measured.m, rules, input.instrumentContributions);
  if ('mask' in measured && measured.mask) result.mask = measured.mask;
  if (kind === 'unwanted-sideband' && result.verdict !== 'pass') {
    result.phasing = diagnosePhasing({ measuredSuppressionDb: result.value, requiredDb: result.limit });
  }
  return result;
}

function measureTrace(kind: TestKind, t: TraceEvidence, rules: RuleSetBody): { m: Measured; mask?: MaskFigures } {
  const obw = occupiedBandwidthFromTrace(t.frequencyHz, t.levelDbm);
  const obwDetail = { occupiedBandwidthHz: round(obw.bandwidthHz, 2), occupiedLowerHz: round(obw.lowerHz, 2), occupiedUpperHz: round(obw.upperHz, 2), rbwHz: t.rbwHz ?? null };
  if (kind === 'occupied-bandwidth') return { m: bandwidthMeasured(obw.bandwidthHz, rules, obwDetail) };
  const limit = limitOf(rules, 'emissionMask', 'emission-mask');
  if (t.referenceDbm === undefined || !Number.isFinite(t.referenceDbm)) {
    throw new EvaluationError(`An emission-mask check needs the measured ${limit.reference === 'pep' ? 'PEP' : 'mean power'} in dBm (referenceDbm).`);
  }
  const v = limit.vertices;
  const mask: EmissionMask = { reference: limit.reference, vertices: v, exemptWithinOffsetHz: v.length > 0 && v[0][1] === 0 ? v[0][0] : 0 };
  const assignedHz = t.carrierHz + (t.sideband === 'lsb' ? -1 : 1) * (limit.assignedOffsetHz ?? 0);
  const check = checkEmissionMask({ frequencyHz: t.frequencyHz, levelDbm: t.levelDbm, rbwHz: t.rbwHz }, mask, { centerHz: assignedHz, referenceDbm: t.referenceDbm });
  const levelAtWorst = t.levelDbm[check.worstIndex] + check.correctionDb;
  const refName = limit.reference === 'pep' ? 'PEP' : 'mean power';
  return {
    m: {
      value: levelAtWorst,
      unit: 'dBm at the worst point',
      limit: levelAtWorst + check.worstMarginDb,
      limitText: `emission mask relative to the ${refName} about the assigned frequency (${limit.source})`,
      direction: 'at-most',
      detail: { referenceDbm: t.referenceDbm, assignedHz, worstFrequencyHz: check.worstFrequencyHz, worstOffsetHz: round(check.worstFrequencyHz - assignedHz, 3), worstMarginDb: round(check.worstMarginDb), ...obwDetail },
      // The mask is read relative to a level measured on the same path: the relative budget (common practice).
      budget: 'relative',
    },
    mask: {
      assignedHz,
      referenceDbm: t.referenceDbm,
      reference: limit.reference,
      exemptWithinOffsetHz: mask.exemptWithinOffsetHz ?? 0,
      worstFrequencyHz: check.worstFrequencyHz,
      worstOffsetHz: check.worstFrequencyHz - assignedHz,
      worstMarginDb: check.worstMarginDb,
      pointCount: check.pointCount,
      segments: check.segments.map((s) => ({ fromOffsetHz: s.fromOffsetHz, toOffsetHz: Number.isFinite(s.toOffsetHz) ? s.toOffsetHz : null, fromRelDb: s.fromRelDb, toRelDb: s.toRelDb, pointCount: s.pointCount, worstMarginDb: Number.isFinite(s.worstMarginDb) ? s.worstMarginDb : null })),
    },
  };
}

function bandwidthMeasured(bandwidthHz: number, rules: RuleSetBody, detail: Measured['detail']): Measured {
  const limit = limitOf(rules, 'occupiedBandwidth', 'occupied-bandwidth');
  return { value: bandwidthHz, unit: 'Hz', limit: limit.maxHz, limitText: `at most ${limit.maxHz} Hz (${limit.source})`, direction: 'at-most', detail, budget: 'bandwidthHz' };
}

function measureIq(kind: TestKind, iq: IqEvidence, rules: RuleSetBody): Measured {
  switch (kind) {
    case 'carrier-suppression': {
      const limit = limitOf(rules, 'carrierSuppression', 'carrier-suppression');
      if (!Number.isFinite(iq.carrierSuppressionDb)) throw new EvaluationError('The carrier is not measurable in this capture (no power at 0 Hz).');
      return { value: iq.carrierSuppressionDb, unit: 'dB below PEP', limit: limit.minDbBelowPep, limitText: `at least ${limit.minDbBelowPep} dB below PEP (${limit.source})`, direction: 'at-least', detail: { carrierSuppressionDb: round(iq.carrierSuppressionDb) }, budget: 'relative' };
    }
    case 'unwanted-sideband': {
      const limit = limitOf(rules, 'unwantedSideband', 'unwanted-sideband');
      if (!present(iq.unwantedSidebandSuppressionDb)) throw new EvaluationError('No wanted tone was found in the capture: record it with one audio tone (e.g. 1 kHz).');
      return { value: iq.unwantedSidebandSuppressionDb, unit: 'dB below the wanted tone', limit: limit.minDb, limitText: `at least ${limit.minDb} dB below the wanted sideband (${limit.source})`, direction: 'at-least', detail: { unwantedSidebandSuppressionDb: round(iq.unwantedSidebandSuppressionDb) }, budget: 'relative' };
    }
    case 'intermodulation': {
      const limit = limitOf(rules, 'intermodulation', 'intermodulation');
      if (!present(iq.imd3Db)) throw new EvaluationError('No two-tone signal was found in the capture: record it with two equal audio tones.');
      // The weaker-suppressed order decides, as with hand readings.
      const fifthDecides = present(iq.imd5Db) && iq.imd5Db < iq.imd3Db;
      const value = fifthDecides ? (iq.imd5Db as number) : iq.imd3Db;
      return { value, unit: 'dB below PEP', limit: limit.minDbBelowPep, limitText: `products at least ${limit.minDbBelowPep} dB below PEP (${limit.source})`, direction: 'at-least', detail: { imd3BelowPepDb: round(iq.imd3Db), imd5BelowPepDb: present(iq.imd5Db) ? round(iq.imd5Db) : null, decidingOrder: fifthDecides ? 5 : 3 }, budget: 'relative' };
    }
    default:
      return bandwidthMeasured(iq.occupiedBandwidthHz, rules, { occupiedBandwidthHz: round(iq.occupiedBandwidthHz, 2) });
  }
}
