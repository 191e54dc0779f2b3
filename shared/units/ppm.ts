import { requireFinite, requirePositive } from './number-guards';

/**
 * Relative frequency offset in parts per million and back: ppm = Δf / f · 10⁶, Δf = f · ppm · 10⁻⁶.
 *
 * Source: definition of parts per million (common practice in frequency-tolerance rules such as
 * 47 CFR 2.1055); 20 Hz at 16.42 MHz = 1.218 ppm (arithmetic).
 * Domain: offset finite (sign kept), frequency finite and > 0.
 * Bad input: non-finite offset, frequency ≤ 0 → RangeError; non-number → TypeError.
 */

/** ppm from an offset in Hz at `frequencyHz`. @example hzToPpm(20, 16.42e6); // ≈ 1.21802 */
export function hzToPpm(offsetHz: number, frequencyHz: number): number {
  const offset = requireFinite('hzToPpm', 'offsetHz', offsetHz);
  return (offset / requirePositive('hzToPpm', 'frequencyHz', frequencyHz)) * 1e6;
}

/** Offset in Hz from ppm at `frequencyHz`. @example ppmToHz(1, 10e6); // 10 */
export function ppmToHz(ppm: number, frequencyHz: number): number {
  const relative = requireFinite('ppmToHz', 'ppm', ppm);
  return (relative * requirePositive('ppmToHz', 'frequencyHz', frequencyHz)) / 1e6;
}
