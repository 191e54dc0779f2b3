import { requireArrayLike, requireFinite } from '../units/number-guards';
import { compileEmissionMask } from './compiled-mask';
import type { EmissionMask } from './emission-mask';
import type { MaskCheckOptions, MaskCheckResult, MaskTrace } from './mask-check-result';
import { walkMaskSide } from './mask-walk';
import type { MaskWalk } from './mask-walk';
import { noiseBandwidthCorrectionDb } from './noise-bandwidth-correction';

const FN = 'checkEmissionMask';

/**
 * Checks a spectrum trace against a symmetric emission mask. At each compared point
 * margin = (referenceDbm + limitRelDb(|f − centre|)) − (level + correction); negative margins are
 * over the limit and the verdict is 'pass' only when every margin is ≥ 0.
 *
 * Correction: when options.noiseLike is true and referenceBandwidthHz is given, every level is
 * scaled by 10·log10(referenceBandwidthHz / trace.rbwHz) (noise-like emissions scale with
 * bandwidth; published relation, 300 Hz → 4 kHz: +11.25 dB). CW tones are not corrected: leave
 * noiseLike false for them.
 *
 * Source: limit semantics per EmissionMask (47 CFR 80.211 / 87.139 wording). Units: Hz, dBm, dB.
 * Domain: frequencies finite and non-decreasing (sorted traces only); levels below +Infinity
 * (-Infinity is no power); equal array lengths ≥ 1; centerHz and referenceDbm finite; at least
 * one point outside the mask's exempt band.
 * Bad input: RangeError (TypeError for non-arrays) whose message starts with 'checkEmissionMask'.
 * Speed: one pass to validate, one walk outward on each side of the centre.
 *
 * @example
 * checkEmissionMask({ frequencyHz: [0, 3000], levelDbm: [-10, -60] },
 *   { reference: 'pep', vertices: [[1000, 0], [2000, -40]] }, { centerHz: 0, referenceDbm: 0 });
 * // verdict 'pass', worstMarginDb 10 at index 0; segment [2000, ∞) has margin 20
 */
export function checkEmissionMask(
  trace: MaskTrace,
  mask: EmissionMask,
  options: MaskCheckOptions,
): MaskCheckResult {
  const f = requireArrayLike(FN, 'trace.frequencyHz', trace?.frequencyHz);
  const level = requireArrayLike(FN, 'trace.levelDbm', trace.levelDbm);
  if (f.length !== level.length) {
    throw new RangeError(
      `${FN}: frequencyHz and levelDbm lengths differ (${f.length} vs ${level.length})`,
    );
  }
  if (f.length === 0) throw new RangeError(`${FN}: the trace is empty`);
  const compiled = compileEmissionMask(FN, mask);
  const centerHz = requireFinite(FN, 'centerHz', options?.centerHz);
  const referenceDbm = requireFinite(FN, 'referenceDbm', options.referenceDbm);

  let correctionDb = 0;
  if (options.noiseLike === true && options.referenceBandwidthHz !== undefined) {
    if (trace.rbwHz === undefined) {
      throw new RangeError(`${FN}: noise-like correction needs trace.rbwHz`);
    }
    correctionDb = noiseBandwidthCorrectionDb(options.referenceBandwidthHz, trace.rbwHz);
  }

  // Validate order and find the first index at or above the centre in one pass.
  let split = f.length;
  let previous = -Infinity;
  for (let i = 0; i < f.length; i++) {
    const fi = f[i];
    if (!(fi >= previous) || fi === Infinity) {
      throw new RangeError(`${FN}: frequencyHz must be finite and ascending (index ${i})`);
    }
    if (split === f.length && fi >= centerHz) split = i;
    previous = fi;
  }

  const w: MaskWalk = {
    mask: compiled,
    f,
    level,
    baseDbm: referenceDbm - correctionDb,
    worstMargin: Infinity,
    worstIndex: f.length, // above every index, so the first point always becomes the worst
    count: 0,
    segWorst: new Float64Array(compiled.count).fill(NaN),
    segIndex: new Int32Array(compiled.count).fill(-1),
    segCount: new Int32Array(compiled.count),
  };
  walkMaskSide(FN, w, split - 1, -1, -1, centerHz);
  walkMaskSide(FN, w, split, f.length, 1, centerHz);
  if (w.count === 0) throw new RangeError(`${FN}: no trace point lies outside the exempt band`);

  const segments = Array.from({ length: compiled.count }, (_, s) => ({
    fromOffsetHz: compiled.startHz[s],
    toOffsetHz: compiled.endHz[s],
    fromRelDb: compiled.startDb[s],
    toRelDb: compiled.endDb[s],
    pointCount: w.segCount[s],
    worstMarginDb: w.segWorst[s],
    worstFrequencyHz: w.segIndex[s] >= 0 ? f[w.segIndex[s]] : NaN,
  }));
  return {
    verdict: w.worstMargin >= 0 ? 'pass' : 'fail',
    worstMarginDb: w.worstMargin,
    worstFrequencyHz: f[w.worstIndex],
    worstIndex: w.worstIndex,
    pointCount: w.count,
    segments,
    reference: mask.reference,
    correctionDb,
  };
}
