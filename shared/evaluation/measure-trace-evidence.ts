/**
 * The quantities a spectrum-analyzer trace decides: the emission mask (worst point against the
 * rule set's mask about the assigned frequency) and the occupied bandwidth. Pure; used by
 * evaluateTrace, which applies the budget and decision rule.
 */
import type { RuleSetBody } from '../rules/rule-set';
import type { TestKind } from '../rules/test-kind';
import type { EmissionMask } from '../mask/emission-mask';
import { checkEmissionMask } from '../mask/check-emission-mask';
import { occupiedBandwidthFromTrace } from '../bandwidth/occupied-bandwidth';
import { EvaluationError, limitOf, type Measured } from './evaluate-test-case';

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

/** The mask check behind an emission-mask result, for the reviewer and the chart (JSON-safe). */
export interface MaskFigures {
  assignedHz: number;
  referenceDbm: number;
  reference: 'pep' | 'mean';
  exemptWithinOffsetHz: number;
  worstFrequencyHz: number;
  worstOffsetHz: number;
  worstMarginDb: number;
  pointCount: number;
  segments: {
    fromOffsetHz: number;
    /** null for the region beyond the last vertex. */
    toOffsetHz: number | null;
    fromRelDb: number;
    toRelDb: number;
    pointCount: number;
    worstMarginDb: number | null;
  }[];
}

const round = (x: number, digits = 4) => Number(x.toFixed(digits));
const finiteOrNull = (x: number) => (Number.isFinite(x) ? x : null);

/** Occupied bandwidth (99 %, ITU RR 1.153) as a measured quantity against the rule set's limit. */
export function bandwidthMeasured(bandwidthHz: number, rules: RuleSetBody, detail: Measured['detail']): Measured {
  const limit = limitOf(rules, 'occupiedBandwidth', 'occupied-bandwidth');
  const limitText = `at most ${limit.maxHz} Hz (${limit.source})`;
  return { value: bandwidthHz, unit: 'Hz', limit: limit.maxHz, limitText, direction: 'at-most', detail, budget: 'bandwidthHz' };
}

/**
 * Measures an emission-mask or occupied-bandwidth case from a trace (see evaluateTrace for the
 * rules). Throws EvaluationError for a missing reference level or limit; RangeError (from
 * checkEmissionMask) when no point lies outside the exempt band.
 */
export function measureTrace(kind: TestKind, t: TraceEvidence, rules: RuleSetBody): { m: Measured; mask?: MaskFigures } {
  const obw = occupiedBandwidthFromTrace(t.frequencyHz, t.levelDbm);
  const obwDetail = {
    occupiedBandwidthHz: round(obw.bandwidthHz, 2),
    occupiedLowerHz: round(obw.lowerHz, 2),
    occupiedUpperHz: round(obw.upperHz, 2),
    rbwHz: t.rbwHz ?? null,
  };
  if (kind === 'occupied-bandwidth') return { m: bandwidthMeasured(obw.bandwidthHz, rules, obwDetail) };
  const limit = limitOf(rules, 'emissionMask', 'emission-mask');
  const refName = limit.reference === 'pep' ? 'PEP' : 'mean power';
  const referenceDbm = t.referenceDbm;
  if (referenceDbm === undefined || !Number.isFinite(referenceDbm)) {
    throw new EvaluationError(`An emission-mask check needs the measured ${refName} in dBm (referenceDbm).`);
  }
  const v = limit.vertices;
  // Within a first vertex of 0 dB the rule sets no limit (e.g. 80.211(a): within 50 % of the bandwidth).
  const exempt = v.length > 0 && v[0][1] === 0 ? v[0][0] : 0;
  const mask: EmissionMask = { reference: limit.reference, vertices: v, exemptWithinOffsetHz: exempt };
  const assignedHz = t.carrierHz + (t.sideband === 'lsb' ? -1 : 1) * (limit.assignedOffsetHz ?? 0);
  const trace = { frequencyHz: t.frequencyHz, levelDbm: t.levelDbm, rbwHz: t.rbwHz };
  const check = checkEmissionMask(trace, mask, { centerHz: assignedHz, referenceDbm });
  const levelAtWorst = t.levelDbm[check.worstIndex] + check.correctionDb;
  const worstOffsetHz = check.worstFrequencyHz - assignedHz;
  return {
    m: {
      value: levelAtWorst,
      unit: 'dBm at the worst point',
      limit: levelAtWorst + check.worstMarginDb,
      limitText: `emission mask relative to the ${refName} about the assigned frequency (${limit.source})`,
      direction: 'at-most',
      detail: {
        referenceDbm,
        assignedHz,
        worstFrequencyHz: check.worstFrequencyHz,
        worstOffsetHz: round(worstOffsetHz, 3),
        worstMarginDb: round(check.worstMarginDb),
        ...obwDetail,
      },
      // Levels read against a reference measured on the same path: the relative budget (common practice).
      budget: 'relative',
    },
    mask: {
      assignedHz,
      referenceDbm,
      reference: limit.reference,
      exemptWithinOffsetHz: exempt,
      worstFrequencyHz: check.worstFrequencyHz,
      worstOffsetHz,
      worstMarginDb: check.worstMarginDb,
      pointCount: check.pointCount,
      segments: check.segments.map((s) => ({
        fromOffsetHz: s.fromOffsetHz,
        toOffsetHz: finiteOrNull(s.toOffsetHz),
        fromRelDb: s.fromRelDb,
        toRelDb: s.toRelDb,
        pointCount: s.pointCount,
        worstMarginDb: finiteOrNull(s.worstMarginDb),
      })),
    },
  };
}
