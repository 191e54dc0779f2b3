import { createMulberry32 } from './mulberry32';
import type { SampleArray } from './windowed-segmenter';

/**
 * Seeded complex white Gaussian noise: each call fills i[k], q[k] (k in [from, from + count))
 * by ADDING independent N(0, σ²) values with σ² = powerLinear/2 per axis, so E|n|² = powerLinear.
 * Uniforms come from {@link createMulberry32}; the Box–Muller transform turns each pair
 * (u₁, u₂) into the two axes: r = √(−2·ln u₁), i = r·cos 2πu₂, q = r·sin 2πu₂.
 *
 * Source: G. E. P. Box and M. E. Muller, "A note on the generation of random normal deviates",
 * Ann. Math. Statist. 29(2), 1958. u₁ is taken in (0, 1] so ln u₁ is finite.
 * Domain: powerLinear finite ≥ 0; seed an integer.
 * Bad input: RangeError starting with "createComplexNoise".
 *
 * @example
 * const noise = createComplexNoise({ powerLinear: 1e-6, seed: 7 });
 * noise.addTo(i, q, 0, i.length); // adds −60 dBFS of noise to i, q
 */
export function createComplexNoise(options: { powerLinear: number; seed: number }): {
  addTo(i: SampleArray, q: SampleArray, from: number, count: number): void;
} {
  const p = options.powerLinear;
  if (typeof p !== 'number' || !Number.isFinite(p) || p < 0) {
    throw new RangeError(
      `createComplexNoise: powerLinear must be finite and ≥ 0, got ${String(p)}`,
    );
  }
  if (!Number.isInteger(options.seed)) {
    throw new RangeError(`createComplexNoise: seed must be an integer, got ${options.seed}`);
  }
  const uniform = createMulberry32(options.seed);
  const sigma = Math.sqrt(p / 2);
  return {
    addTo(i, q, from, count) {
      for (let k = from, end = from + count; k < end; k++) {
        const u1 = 1 - uniform();
        const angle = 2 * Math.PI * uniform();
        const r = sigma * Math.sqrt(-2 * Math.log(u1));
        i[k] += r * Math.cos(angle);
        q[k] += r * Math.sin(angle);
      }
    },
  };
}
