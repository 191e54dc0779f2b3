import { requireFinite } from '../units/number-guards';

/**
 * Frequencies of the odd-order intermodulation products of a two-tone test nearest the tones.
 * With tones f1 < f2 and spacing Δ = f2 − f1, the order-(2k+1) products fall at f1 − k·Δ and
 * f2 + k·Δ: IM3 at f1 − Δ and f2 + Δ, IM5 at f1 − 2Δ and f2 + 2Δ.
 *
 * Source: common practice (products m·f1 − (m−1)·f2); tones 1100/1700 Hz → IM3 at 500 and
 * 2300 Hz, IM5 at −100 and 2900 Hz. Works for audio or RF frequencies alike; a negative audio
 * frequency means the product lies on the other side of the suppressed carrier.
 * Units: Hz. Domain: finite, unequal tones (their order does not matter); order 3 or 5.
 * Bad input: RangeError starting with the function name.
 *
 * @example intermodProductFrequencies({ tone1Hz: 1100, tone2Hz: 1700, order: 3 });
 * // { lowerHz: 500, upperHz: 2300 }
 */
export function intermodProductFrequencies(test: {
  tone1Hz: number;
  tone2Hz: number;
  order: 3 | 5;
}): { lowerHz: number; upperHz: number } {
  const fn = 'intermodProductFrequencies';
  const a = requireFinite(fn, 'tone1Hz', test.tone1Hz);
  const b = requireFinite(fn, 'tone2Hz', test.tone2Hz);
  if (a === b) throw new RangeError(`${fn}: the two tones must differ, both are ${a} Hz`);
  if (test.order !== 3 && test.order !== 5) {
    throw new RangeError(`${fn}: order must be 3 or 5, got ${String(test.order)}`);
  }
  const low = Math.min(a, b);
  const high = Math.max(a, b);
  const k = (test.order - 1) / 2;
  const spacing = high - low;
  return { lowerHz: low - k * spacing, upperHz: high + k * spacing };
}
