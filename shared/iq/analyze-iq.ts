import { isPowerOfTwo } from '../dsp/fft';
import { createNamedWelchAccumulator, welchPsd, type WelchResult } from '../dsp/welch';
import { requireFinite, requirePositive } from '../units/number-guards';
import { defaultSegmentLength } from './default-segment-length';
import { measureIqSpectrum } from './measure-iq-spectrum';

export interface IqAnalysisOptions {
  sampleRateHz: number;
  sideband?: 'usb' | 'lsb' | 'auto';
  fullScaleDbm?: number;
  segmentLength?: number;
}

export interface IqAnalysis {
  sampleRateHz: number;
  sampleCount: number;
  sideband: 'usb' | 'lsb';
  pepDbfs: number;
  meanPowerDbfs: number;
  pepDbm: number | null;
  meanPowerDbm: number | null;
  /** Carrier (0 Hz) power, dB below PEP (positive = below). */
  carrierSuppressionDb: number;
  /** Strongest wanted tone vs its mirror image, dB. */
  unwantedSidebandSuppressionDb: number | null;
  /** Stronger product of each order, dB below PEP; null without two tones. */
  imd3Db: number | null;
  imd5Db: number | null;
  /** 99 % power bandwidth from the PSD. */
  occupiedBandwidthHz: number;
  tones: { frequencyHz: number; levelDbfs: number }[];
  psd: { frequencyHz: Float64Array; psdDbfsPerHz: Float64Array };
}

/** Fewest samples analysed: a 16-point PSD is the smallest that separates a carrier from a tone. */
export const MIN_IQ_SAMPLES = 16;

/**
 * Streaming automatic analysis of a complex baseband SSB capture (carrier at 0 Hz). push()
 * takes chunks of any length; only the Welch accumulator, running sums and the first segment
 * (for captures shorter than one segment) are kept, so memory does not grow with the capture.
 *
 * dBFS: 0 dBFS is |x|² = 1. PEP = max |x|² over the samples (ITU RR 1.157 for the complex
 * envelope); mean = (1/N)·Σ|x|² (RR 1.158), summed with compensation. fullScaleDbm maps 0 dBFS
 * to that many dBm. From the Welch PSD (Hann, 50 % overlap, segment length by default the
 * smallest power of two with a ≤ 30 Hz noise bandwidth): carrier suppression = PEP − carrier
 * main-lobe power (47 CFR 80.207(c) states it below PEP); unwanted-sideband suppression = the
 * strongest wanted tone − the power at its mirror frequency (single-tone method); IMD3/IMD5 =
 * PEP − the stronger product of each order of the two strongest wanted tones (they count as a
 * two-tone test when within 6 dB); occupied bandwidth per RR 1.153 (99 %). A carrier reading of
 * exactly zero power gives carrierSuppressionDb = +Infinity.
 *
 * Domain: sampleRateHz finite > 0; sideband 'usb' | 'lsb' | 'auto' (default 'auto');
 * fullScaleDbm finite; segmentLength a power of two ≥ 16. At least 16 samples, not all zero.
 * Bad input: RangeError starting with "createIqAnalyzer" (options), "IqAnalyzer.push" (unequal
 * lengths, NaN/±Infinity samples, push after finish) or "IqAnalyzer.finish" (too few samples,
 * no signal).
 *
 * @example
 * const analyzer = createIqAnalyzer({ sampleRateHz: 192000, fullScaleDbm: 50 });
 * for (const c of chunks) analyzer.push(c.i, c.q);
 * analyzer.finish().carrierSuppressionDb; // e.g. 45.2
 */
export function createIqAnalyzer(options: IqAnalysisOptions): {
  push(i: Float32Array, q: Float32Array): void;
  finish(): IqAnalysis;
} {
  return buildAnalyzer(options, {
    create: 'createIqAnalyzer',
    push: 'IqAnalyzer.push',
    finish: 'IqAnalyzer.finish',
  });
}

/**
 * One-shot form of {@link createIqAnalyzer}: one push of the whole capture, then finish().
 * Bad input as there, with messages starting with "analyzeIq".
 * @example analyzeIq(i, q, { sampleRateHz: 48000 }).pepDbfs; // e.g. -6.02
 */
export function analyzeIq(
  i: Float32Array,
  q: Float32Array,
  options: IqAnalysisOptions,
): IqAnalysis {
  const name = 'analyzeIq';
  const analyzer = buildAnalyzer(options, { create: name, push: name, finish: name });
  analyzer.push(i, q);
  return analyzer.finish();
}

function buildAnalyzer(
  options: IqAnalysisOptions,
  names: { create: string; push: string; finish: string },
): { push(i: Float32Array, q: Float32Array): void; finish(): IqAnalysis } {
  const fn = names.create;
  const fs = requirePositive(fn, 'sampleRateHz', options.sampleRateHz);
  const sideband = options.sideband ?? 'auto';
  if (sideband !== 'usb' && sideband !== 'lsb' && sideband !== 'auto') {
    throw new RangeError(`${fn}: sideband must be 'usb', 'lsb' or 'auto', got ${String(sideband)}`);
  }
  const fullScaleDbm =
    options.fullScaleDbm === undefined
      ? null
      : requireFinite(fn, 'fullScaleDbm', options.fullScaleDbm);
  const n = options.segmentLength ?? defaultSegmentLength(fs);
  if (!isPowerOfTwo(n) || n < MIN_IQ_SAMPLES) {
    throw new RangeError(
      `${fn}: segmentLength must be a power of two ≥ ${MIN_IQ_SAMPLES}, got ${n}`,
    );
  }
  const welch = createNamedWelchAccumulator(
    { sampleRateHz: fs, segmentLength: n },
    { create: fn, push: names.push, result: names.finish },
  );
  const headI = new Float32Array(n); // the first segment, for a capture shorter than one
  const headQ = new Float32Array(n);
  let count = 0;
  let finished: IqAnalysis | null = null;
  let failed = false;

  function push(i: Float32Array, q: Float32Array): void {
    if (finished !== null) throw new RangeError(`${names.push}: the analysis is already finished`);
    if (failed) throw new RangeError(`${names.push}: an earlier push was rejected; start again`);
    if (i.length !== q.length) {
      throw new RangeError(`${names.push}: i and q lengths differ (${i.length} vs ${q.length})`);
    }
    if (count < n) {
      const take = Math.min(n - count, i.length);
      headI.set(i.subarray(0, take), count);
      headQ.set(q.subarray(0, take), count);
    }
    try {
      // The Welch copy loop also checks the samples, sums |x|² and finds its peak: one pass.
      welch.push(i, q);
    } catch (error) {
      failed = true; // part of the chunk may be in the sums: no result may come from them
      throw error;
    }
    count += i.length;
  }

  function finish(): IqAnalysis {
    if (finished !== null) return finished;
    if (failed) throw new RangeError(`${names.finish}: an earlier push was rejected; start again`);
    if (count < MIN_IQ_SAMPLES) {
      throw new RangeError(
        `${names.finish}: at least ${MIN_IQ_SAMPLES} samples are needed, got ${count}`,
      );
    }
    const peak = welch.peakPower;
    if (!(peak > 0)) {
      throw new RangeError(`${names.finish}: the capture holds no signal (all samples are zero)`);
    }
    const spectrum: WelchResult =
      welch.segmentsAveraged > 0
        ? welch.result()
        : welchPsd(headI.subarray(0, count), headQ.subarray(0, count), {
            sampleRateHz: fs,
            segmentLength: 2 ** Math.floor(Math.log2(count)),
          });
    const r = measureIqSpectrum(spectrum, sideband);
    const db = (p: number): number => 10 * Math.log10(p);
    const pepDbfs = db(peak);
    const meanPowerDbfs = db(welch.meanPower);
    const psdDbfsPerHz = spectrum.psd.map(db);
    finished = {
      sampleRateHz: fs,
      sampleCount: count,
      sideband: r.sideband,
      pepDbfs,
      meanPowerDbfs,
      pepDbm: fullScaleDbm === null ? null : fullScaleDbm + pepDbfs,
      meanPowerDbm: fullScaleDbm === null ? null : fullScaleDbm + meanPowerDbfs,
      carrierSuppressionDb: pepDbfs - db(r.carrierPowerLinear),
      unwantedSidebandSuppressionDb:
        r.wanted === null ? null : r.wanted.tone.levelDb - db(r.wanted.imagePowerLinear),
      imd3Db: r.imd3PowerLinear === null ? null : pepDbfs - db(r.imd3PowerLinear),
      imd5Db: r.imd5PowerLinear === null ? null : pepDbfs - db(r.imd5PowerLinear),
      occupiedBandwidthHz: r.occupiedBandwidthHz,
      tones: r.tones.map((t) => ({ frequencyHz: t.frequencyHz, levelDbfs: t.levelDb })),
      psd: { frequencyHz: spectrum.frequencyHz, psdDbfsPerHz },
    };
    return finished;
  }

  return { push, finish };
}
