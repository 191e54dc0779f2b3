/**
 * mulberry32: a small, fast, seeded 32-bit pseudo-random generator with a 2³² period, for
 * reproducible test signals and demo data (never for anything security-related).
 *
 * Source: T. Ettinger's mulberry32 (2017, public domain), as widely reproduced: state
 * a += 0x6D2B79F5; t = (a ^ a>>>15)·(a | 1); t ^= t + (t ^ t>>>7)·(t | 61); out = t ^ t>>>14.
 * Output: uniform on [0, 1) in steps of 2⁻³².
 * Domain: seed an integer (taken modulo 2³²). Bad input: a non-integer seed → RangeError
 * starting with "createMulberry32".
 *
 * @example const next = createMulberry32(42); next(); // same first value on every run
 */
export function createMulberry32(seed: number): () => number {
  if (!Number.isInteger(seed)) {
    throw new RangeError(`createMulberry32: seed must be an integer, got ${seed}`);
  }
  let state = seed | 0;
  return function next(): number {
    state = (state + 0x6d2b79f5) | 0;
    let t = Math.imul(state ^ (state >>> 15), state | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
