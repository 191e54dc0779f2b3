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
import { diagnosePhasing, type PhasingDiagnosis } from '../phasing/diagnose-phasing';
import { concludeMeasurement, EvaluationError, limitOf, type Budget, type Measured } from './evaluate-test-case';
import type { TestCaseResult } from './test-case-result';
import { bandwidthMeasured, measureTrace, type MaskFigures, type TraceEvidence } from './measure-trace-evidence';

export type { MaskFigures, TraceEvidence };

/** The figures of an I/Q analysis that carry a limit (see shared/iq IqAnalysis). */
export interface IqEvidence {
  source: 'iq';
  carrierSuppressionDb: number;
  unwantedSidebandSuppressionDb: number | null;
  imd3Db: number | null;
  imd5Db: number | null;
  occupiedBandwidthHz: number;
}

/** What an upload offers the evaluation: a trace, or the figures of a capture. */
export type UploadEvidence = TraceEvidence | IqEvidence;

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

type Contributions = UncertaintyContribution[] | Partial<Record<Budget, UncertaintyContribution[]>>;

/**
 * Evaluates one test case from an upload. Emission mask: checkEmissionMask about the assigned
 * frequency = carrier ± assignedOffsetHz (− for LSB, the emission being mirrored; common
 * practice), relative to referenceDbm; within the first vertex, when it is 0 dB, the rule sets no
 * limit (47 CFR 80.211(a): within 50 % of the authorized bandwidth) and points there are not
 * compared. The value is the level at the worst point and the limit the mask there (dBm), so the
 * margin is the worst margin. Occupied bandwidth per ITU RR 1.153 (99 %). From a capture, the
 * figures of the I/Q analysis (dB below PEP, or below the wanted tone), the worse IMD order
 * deciding. A failing unwanted sideband carries diagnosePhasing's explanation.
 *
 * @throws EvaluationError when the evidence cannot decide the kind, a needed figure is missing
 *   (no reference level, no tone), or the rule set lacks the limit or the budget; RangeError when
 *   no trace point lies outside the mask's exempt band.
 * @example evaluateTrace({ kind: 'carrier-suppression', rules: maritime, evidence: { source: 'iq',
 *   carrierSuppressionDb: 45.2, unwantedSidebandSuppressionDb: null, imd3Db: null, imd5Db: null,
 *   occupiedBandwidthHz: 2400 } }).verdict // 'pass' against 40 dB (47 CFR 80.207(c))
 */
export function evaluateTrace(input: { kind: TestKind; evidence: UploadEvidence; rules: RuleSetBody; instrumentContributions?: Contributions }): TraceEvaluation {
  const { kind, evidence, rules } = input;
  if (!EVALUABLE_KINDS[evidence.source].includes(kind)) {
    const what = evidence.source === 'trace' ? 'a spectrum-analyzer trace' : 'an I/Q capture';
    const instead = evidence.source === 'trace' ? 'upload an I/Q capture or enter readings' : 'upload a spectrum-analyzer trace (CSV)';
    throw new EvaluationError(`A ${kind} case cannot be evaluated from ${what}; ${instead}.`);
  }
  const measured = evidence.source === 'trace' ? measureTrace(kind, evidence, rules) : { m: measureIq(kind, evidence, rules) };
  const result: TraceEvaluation = concludeMeasurement(kind, measured.m, rules, input.instrumentContributions);
  if ('mask' in measured && measured.mask) result.mask = measured.mask;
  if (kind === 'unwanted-sideband' && result.verdict !== 'pass') {
    result.phasing = diagnosePhasing({ measuredSuppressionDb: result.value, requiredDb: result.limit });
  }
  return result;
}

const round = (x: number) => Number(x.toFixed(4));
const present = (x: number | null): x is number => x !== null && Number.isFinite(x);

function measureIq(kind: TestKind, iq: IqEvidence, rules: RuleSetBody): Measured {
  const relative = { direction: 'at-least', budget: 'relative' } as const;
  switch (kind) {
    case 'carrier-suppression': {
      const limit = limitOf(rules, 'carrierSuppression', 'carrier-suppression');
      const value = iq.carrierSuppressionDb;
      if (!Number.isFinite(value)) throw new EvaluationError('The carrier is not measurable in this capture (no power at 0 Hz).');
      const limitText = `at least ${limit.minDbBelowPep} dB below PEP (${limit.source})`;
      return { ...relative, value, unit: 'dB below PEP', limit: limit.minDbBelowPep, limitText, detail: { carrierSuppressionDb: round(value) } };
    }
    case 'unwanted-sideband': {
      const limit = limitOf(rules, 'unwantedSideband', 'unwanted-sideband');
      const value = iq.unwantedSidebandSuppressionDb;
      if (!present(value)) throw new EvaluationError('No wanted tone was found in the capture: record it with one audio tone (e.g. 1 kHz).');
      const limitText = `at least ${limit.minDb} dB below the wanted sideband (${limit.source})`;
      return { ...relative, value, unit: 'dB below the wanted tone', limit: limit.minDb, limitText, detail: { unwantedSidebandSuppressionDb: round(value) } };
    }
    case 'intermodulation': {
      const limit = limitOf(rules, 'intermodulation', 'intermodulation');
      const { imd3Db, imd5Db } = iq;
      if (!present(imd3Db)) throw new EvaluationError('No two-tone signal was found in the capture: record it with two equal audio tones.');
      // The weaker-suppressed order decides, as with hand readings.
      const fifthDecides = present(imd5Db) && imd5Db < imd3Db;
      const detail = { imd3BelowPepDb: round(imd3Db), imd5BelowPepDb: present(imd5Db) ? round(imd5Db) : null, decidingOrder: fifthDecides ? 5 : 3 };
      const limitText = `products at least ${limit.minDbBelowPep} dB below PEP (${limit.source})`;
      return { ...relative, value: fifthDecides ? (imd5Db as number) : imd3Db, unit: 'dB below PEP', limit: limit.minDbBelowPep, limitText, detail };
    }
    default:
      return bandwidthMeasured(iq.occupiedBandwidthHz, rules, { occupiedBandwidthHz: Number(iq.occupiedBandwidthHz.toFixed(2)) });
  }
}
