import { requirePositive } from '../units/number-guards';
import { complexFftOfSize, isPowerOfTwo, type ComplexFft } from './fft';
import type { PowerSpectrum } from './power-spectrum';
import { WINDOW_COEFFICIENTS, windowCoefficients, type WindowName } from './window';
import { windowMetrics } from './window-metrics';
import { createWindowedSegmenter, type SampleArray } from './windowed-segmenter';

export type { SampleArray };

/** Options of a Welch PSD estimate. */
export interface WelchOptions {
  sampleRateHz: number;
  /** FFT length per segment; a power of two ≥ 2. */
  segmentLength: number;
  /** Fraction of a segment shared with the next, 0 ≤ overlap < 1; default 0.5. */
  overlap?: number;
  /** Default 'hann'. */
  window?: WindowName;
}

/** A Welch estimate: two-sided, fftshifted (frequency ascends from −fs/2). */
export interface WelchResult extends PowerSpectrum {
  segmentsAveraged: number;
  /** Equivalent noise bandwidth of one bin, Hz (ENBW in bins × fs/N). */
  enbwHz: number;
}

/** A streaming Welch estimator: push chunks of any length, read the average at any time. */
export interface WelchAccumulator {
  push(i: SampleArray, q: SampleArray): void;
  result(): WelchResult;
  readonly samplesPushed: number;
  readonly segmentsAveraged: number;
  /** Mean |x|² of every sample pushed (0 before any): read in the same pass as the copy. */
  readonly meanPower: number;
  /** Largest |x|² of every sample pushed (0 before any). */
  readonly peakPower: number;
}

/**
 * Streaming Welch PSD of complex samples x = i + j·q. Segments of N samples, hop
 * N − floor(overlap·N), are windowed, transformed and their |X[k]|² summed; partial segments
 * are carried between pushes (⌈N/hop⌉ buffers of N samples, two at 50 % overlap), so memory
 * does not grow with the record and no STFT matrix is built.
 *
 *   psd[k] = Σ_segments |Σₙ w[n]·x[n]·e^(−j2πkn/N)|² / (fs · Σw² · segments)
 *
 * Source: P. D. Welch, IEEE Trans. Audio Electroacoust. AU-15(2), 1967; normalization as
 * scipy.signal.welch with scaling='density', detrend=False, return_onesided=False (two-sided for
 * complex input), then fftshift. ∫psd df equals the mean power for a stationary record (the
 * Parseval identity; common practice).
 * Units: sampleRateHz in Hz; psd in sample units² per Hz; frequencyHz bin centres in Hz.
 * Domain: sampleRateHz finite > 0; segmentLength a power of two ≥ 2; 0 ≤ overlap < 1.
 * Bad input: RangeError starting with "createWelchAccumulator"; push() with i, q of unequal length
 * or holding NaN/±Infinity, and result() before one full segment, throw RangeErrors starting with
 * "WelchAccumulator.push" / "WelchAccumulator.result". A chunk that throws for a non-finite
 * sample is kept up to the segment boundary before that sample; treat the estimate as spoilt.
 *
 * @example
 * const acc = createWelchAccumulator({ sampleRateHz: 48000, segmentLength: 1024 });
 * acc.push(i, q); acc.result().psd; // 1024 bins, −24000 Hz … +23953.125 Hz
 */
export function createWelchAccumulator(options: WelchOptions): WelchAccumulator {
  return createNamedWelchAccumulator(options, {
    create: 'createWelchAccumulator',
    push: 'WelchAccumulator.push',
    result: 'WelchAccumulator.result',
  });
}

/**
 * {@link createWelchAccumulator} whose error messages start with the given names, for callers
 * that wrap it (the IQ analyzer) and keep their own names in messages. Not re-exported.
 */
export function createNamedWelchAccumulator(
  options: WelchOptions,
  names: { create: string; push: string; result: string },
): WelchAccumulator {
  const fn = names.create;
  const fs = requirePositive(fn, 'sampleRateHz', options.sampleRateHz);
  const n = options.segmentLength;
  if (!isPowerOfTwo(n) || n < 2) {
    throw new RangeError(`${fn}: segmentLength must be a power of two ≥ 2, got ${n}`);
  }
  const overlap = options.overlap ?? 0.5;
  if (typeof overlap !== 'number' || !(overlap >= 0 && overlap < 1)) {
    throw new RangeError(`${fn}: overlap must be in [0, 1), got ${String(overlap)}`);
  }
  const windowName = options.window ?? 'hann';
  if (!Object.hasOwn(WINDOW_COEFFICIENTS, windowName)) {
    throw new RangeError(`${fn}: unknown window ${JSON.stringify(windowName)}`);
  }
  const w = windowCoefficients(windowName, n);
  const metrics = windowMetrics(w);
  const hop = n - Math.floor(overlap * n);
  const fft: ComplexFft = complexFftOfSize(n);
  const spectrum = fft.createBuffer();
  const sum = new Float64Array(n); // Σ |X[k]|² over segments, FFT order
  let segments = 0;
  const segmenter = createWindowedSegmenter(w, hop, (segment) => {
    fft.forward(segment, spectrum);
    accumulatePower(spectrum, sum);
    segments++;
  });

  function push(i: SampleArray, q: SampleArray): void {
    if (i.length !== q.length) {
      throw new RangeError(`${names.push}: i and q lengths differ (${i.length} vs ${q.length})`);
    }
    const chunkStart = segmenter.samplesPushed;
    const bad = segmenter.push(i, q);
    if (bad >= 0) {
      throw new RangeError(
        `${names.push}: sample ${chunkStart + bad} is not finite (or its |x|² overflows)`,
      );
    }
  }

  function result(): WelchResult {
    if (segments === 0) {
      throw new RangeError(
        `${names.result}: no complete segment yet (${segmenter.samplesPushed} of ${n} samples)`,
      );
    }
    const binWidthHz = fs / n;
    const scale = 1 / (fs * metrics.sumOfSquares * segments);
    const frequencyHz = new Float64Array(n);
    const psd = new Float64Array(n);
    const half = n / 2;
    for (let m = 0; m < n; m++) {
      frequencyHz[m] = (m - half) * binWidthHz;
      psd[m] = sum[(m + half) % n] * scale;
    }
    return {
      frequencyHz,
      psd,
      binWidthHz,
      segmentsAveraged: segments,
      enbwHz: metrics.enbwBins * binWidthHz,
    };
  }

  return {
    push,
    result,
    get samplesPushed() {
      return segmenter.samplesPushed;
    },
    get segmentsAveraged() {
      return segments;
    },
    get meanPower() {
      return segmenter.meanPower;
    },
    get peakPower() {
      return segmenter.peakPower;
    },
  };
}

/**
 * One-shot Welch PSD of a whole record: {@link createWelchAccumulator}, one push, result().
 * Bad input: as createWelchAccumulator (a record shorter than one segment included), with
 * messages starting with "welchPsd".
 * @example welchPsd(i, q, { sampleRateHz: 1000, segmentLength: 16 }).binWidthHz; // 62.5
 */
export function welchPsd(i: SampleArray, q: SampleArray, options: WelchOptions): WelchResult {
  const name = 'welchPsd';
  const acc = createNamedWelchAccumulator(options, { create: name, push: name, result: name });
  acc.push(i, q);
  return acc.result();
}

/** sum[k] += |X[k]|² for an interleaved spectrum X (a plain function: V8 keeps it tight). */
function accumulatePower(spectrum: number[], sum: Float64Array): void {
  for (let k = 0, m = 0; k < sum.length; k++, m += 2) {
    const re = spectrum[m];
    const im = spectrum[m + 1];
    sum[k] += re * re + im * im;
  }
}
