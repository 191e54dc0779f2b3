/**
 * Invented results for samples, tests and benches: nine results of a marine HF SSB radio against
 * the 47 CFR Part 80 limits, repeatable to any row count and with any number of mask figures.
 * The values are made up; the limits quote the rule text (47 CFR 80.207, 80.209, 80.211).
 */
import type { ReportResult } from './report-document';
import { buildSampleImdPlot, buildSampleMaskPlot } from './sample-plots';

const BASE_RESULTS: readonly ReportResult[] = [
  {
    testName: 'Carrier suppression',
    testPoint: '2182 kHz, 150 W PEP, tones 400 + 1800 Hz',
    value: 46.31,
    unit: 'dB',
    limit: '\u2265 40 dB below PEP',
    margin: 6.31,
    expandedUncertainty: 1.21,
    coverageFactor: 2,
    verdict: 'pass',
  },
  {
    testName: 'Carrier suppression',
    testPoint: '8291 kHz, 150 W PEP, tones 400 + 1800 Hz',
    value: 44.85,
    unit: 'dB',
    limit: '\u2265 40 dB below PEP',
    margin: 4.85,
    expandedUncertainty: 1.21,
    coverageFactor: 2,
    verdict: 'pass',
  },
  {
    testName: 'Unwanted sideband suppression',
    testPoint: '2182 kHz, single tone 1000 Hz',
    value: 41.0,
    unit: 'dB',
    limit: '\u2265 40 dB below PEP',
    margin: 1.0,
    expandedUncertainty: 1.21,
    coverageFactor: 2,
    verdict: 'conditional-pass',
    note:
      'Margin smaller than the expanded uncertainty: conditional pass under the agreed decision rule.',
  },
  {
    testName: 'Two-tone intermodulation',
    testPoint: '2182 kHz, IM3, tones 400 + 1800 Hz',
    value: -31.02,
    unit: 'dB re PEP',
    limit: 'Reported only (no limit)',
    margin: null,
    expandedUncertainty: 1.5,
    coverageFactor: 2,
    verdict: 'not-evaluated',
  },
  {
    testName: 'Emission mask',
    testPoint: '2182 kHz, 150 W PEP, two-tone drive',
    value: -31.6,
    unit: 'dB re mean',
    limit: '47 CFR 80.211 mask, AB 3.0 kHz',
    margin: 3.6,
    expandedUncertainty: 1.5,
    coverageFactor: 2,
    verdict: 'pass',
  },
  {
    testName: 'Spurious emissions',
    testPoint: '2182 kHz, 150 W PEP, 9 kHz to 30 MHz',
    value: 68.2,
    unit: 'dB',
    limit: '\u2265 64.76 dB below mean (43 + 10 log10(150 W))',
    margin: 3.44,
    expandedUncertainty: 1.8,
    coverageFactor: 2,
    verdict: 'pass',
  },
  {
    testName: 'Frequency tolerance',
    testPoint: '8291 kHz, 22 \u00b0C, 13.8 V',
    value: 3.2,
    unit: 'Hz',
    limit: '\u2264 20 Hz',
    margin: 16.8,
    expandedUncertainty: 0.4,
    coverageFactor: 2,
    verdict: 'pass',
  },
  {
    testName: 'Occupied bandwidth',
    testPoint: '2182 kHz, tones 400 + 1800 Hz',
    value: 2376,
    unit: 'Hz',
    limit: '\u2264 3000 Hz (authorized bandwidth)',
    margin: 624,
    expandedUncertainty: 40,
    coverageFactor: 2,
    verdict: 'pass',
  },
  {
    testName: 'Audio frequency response',
    testPoint: '350 Hz to 2700 Hz, 2182 kHz',
    value: 4.1,
    unit: 'dB',
    limit: '\u2264 6 dB total variation',
    margin: 1.9,
    expandedUncertainty: 0.6,
    coverageFactor: 2,
    verdict: 'pass',
  },
];

export interface SampleResultsOptions {
  /** Rows wanted (default 9, the base set once). */
  count?: number;
  /** Results that carry a mask figure (default 1; an IMD figure is added to the IMD row). */
  plotCount?: number;
  /** Trace points per mask figure (default 1000). */
  pointsPerPlot?: number;
}

/**
 * Returns `count` results cycling through the base set; repeats get a run number in the test
 * point. Counts below 0 or non-integers throw a RangeError.
 * @example buildSampleResults({ count: 120 }).length // 120
 */
export function buildSampleResults(options: SampleResultsOptions = {}): ReportResult[] {
  const count = options.count ?? BASE_RESULTS.length;
  const plotCount = options.plotCount ?? 1;
  const points = options.pointsPerPlot ?? 1000;
  for (const [name, v] of Object.entries({ count, plotCount, points })) {
    if (!Number.isInteger(v) || v < 0) {
      throw new RangeError(`buildSampleResults: ${name} must be a whole number >= 0, got ${v}`);
    }
  }
  const results: ReportResult[] = [];
  let plotsLeft = plotCount;
  for (let i = 0; i < count; i++) {
    const base = BASE_RESULTS[i % BASE_RESULTS.length];
    const run = Math.floor(i / BASE_RESULTS.length);
    const testPoint = run === 0 ? base.testPoint : `${base.testPoint}, run ${run + 1}`;
    const result: ReportResult = { ...base, testPoint };
    if (base.testName === 'Emission mask' && plotsLeft > 0) {
      const mask = buildSampleMaskPlot(points, 150, i + 1);
      const { leastMarginDb, levelAtLeastMarginDb, ...plot } = mask;
      Object.assign(result, { plot, value: levelAtLeastMarginDb, margin: leastMarginDb });
      plotsLeft -= 1;
    } else if (base.testName === 'Two-tone intermodulation' && run === 0) {
      result.plot = buildSampleImdPlot(7);
    }
    results.push(result);
  }
  // Mask figures beyond the emission-mask rows go on the spurious rows, so any plot count is met.
  for (let i = 0; plotsLeft > 0 && i < results.length; i++) {
    if (!results[i].plot) {
      const mask = buildSampleMaskPlot(points, 150, 1000 + i);
      const { leastMarginDb: _m, levelAtLeastMarginDb: _l, ...plot } = mask;
      results[i].plot = plot;
      plotsLeft -= 1;
    }
  }
  return results;
}
