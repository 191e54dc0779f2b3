import { CompensatedSum } from '../units/compensated-sum';

/** Real sample arrays accepted by the streaming analysers. */
export type SampleArray = Float32Array | Float64Array;

/** Streams samples into overlapping, windowed segments (see {@link createWindowedSegmenter}). */
export interface WindowedSegmenter {
  /** Adds a chunk; returns the index within it of the first non-finite sample, or −1. */
  push(i: SampleArray, q: SampleArray): number;
  readonly samplesPushed: number;
  readonly meanPower: number;
  readonly peakPower: number;
}

/**
 * Cuts a complex sample stream into segments of N = window.length samples starting every `hop`
 * samples, multiplies each by the window as the samples arrive and hands each complete segment,
 * interleaved [re₀, im₀, …], to `onSegment` (the buffer is reused afterwards: read it there).
 * Each sample is written straight into the ⌈N/hop⌉ segment buffers it belongs to, so there is
 * no separate copy or windowing pass and no shifting of the overlap; in the same pass |x|² is
 * summed (per-piece partial sums into a Neumaier total) and its peak kept.
 *
 * A chunk holding NaN, ±Infinity (or a value whose square overflows) is reported by index (−1
 * when all are fine); the samples up to the piece holding it have then been taken, so the caller
 * must treat the stream as spoilt.
 * Domain: hop an integer, 1 ≤ hop ≤ N (not checked: internal to the Welch accumulator).
 */
export function createWindowedSegmenter(
  window: Float64Array,
  hop: number,
  onSegment: (segment: number[]) => void,
): WindowedSegmenter {
  const n = window.length;
  const ring = Math.ceil(n / hop); // segments open at once, at most
  // Plain arrays of doubles: what fft.js runs fastest on (see ComplexFft).
  const buffers = Array.from({ length: ring }, () => new Array<number>(2 * n).fill(0));
  let oldest = 0; // index of the oldest open segment; segment s starts at sample s·hop
  let newest = -1; // newest open segment (oldest − 1 when none is open)
  let t = 0; // samples pushed so far
  const energy = new CompensatedSum();
  let peak = 0;

  function push(i: SampleArray, q: SampleArray): number {
    const len = i.length;
    let pos = 0;
    while (pos < len) {
      if (newest < oldest || t === (newest + 1) * hop) newest++; // a segment starts here
      const oldestEnd = oldest * hop + n;
      const end = Math.min(t + (len - pos), (newest + 1) * hop, oldestEnd);
      const count = end - t;
      for (let s = oldest; s < newest; s++) {
        windowInto(buffers[s % ring], t - s * hop, i, q, pos, count);
      }
      // The newest segment sees every sample exactly once: take the power sums there.
      const p = windowIntoWithSums(buffers[newest % ring], t - newest * hop, i, q, pos, count);
      if (!Number.isFinite(p)) {
        // The first sample whose |x|² is not finite: NaN, ±Infinity, or beyond ~1e154.
        let bad = pos;
        while (Number.isFinite(i[bad] * i[bad] + q[bad] * q[bad])) bad++;
        return bad;
      }
      energy.add(p);
      pos += count;
      t = end;
      if (t === oldestEnd) onSegment(buffers[oldest++ % ring]);
    }
    return -1;
  }

  /** Writes window·x for `count` samples at segment offset `at`. */
  function windowInto(
    buffer: number[],
    at: number,
    i: SampleArray,
    q: SampleArray,
    from: number,
    count: number,
  ): void {
    for (let k = 0, m = 2 * at, j = at, x = from; k < count; k++, m += 2, j++, x++) {
      const wj = window[j];
      buffer[m] = i[x] * wj;
      buffer[m + 1] = q[x] * wj;
    }
  }

  /** As windowInto, also returning Σ|x|² and raising the peak (kept if a sample is not finite). */
  function windowIntoWithSums(
    buffer: number[],
    at: number,
    i: SampleArray,
    q: SampleArray,
    from: number,
    count: number,
  ): number {
    let total = 0;
    let top = peak;
    for (let k = 0, m = 2 * at, j = at, x = from; k < count; k++, m += 2, j++, x++) {
      const a = i[x];
      const b = q[x];
      const wj = window[j];
      buffer[m] = a * wj;
      buffer[m + 1] = b * wj;
      const p = a * a + b * b;
      total += p;
      if (p > top) top = p;
    }
    // A NaN or ±Infinity sample makes the total NaN or +Infinity: one check per piece.
    if (Number.isFinite(total)) peak = top;
    return total;
  }

  return {
    push,
    get samplesPushed() {
      return t;
    },
    get meanPower() {
      return t === 0 ? 0 : energy.value / t;
    },
    get peakPower() {
      return peak;
    },
  };
}
