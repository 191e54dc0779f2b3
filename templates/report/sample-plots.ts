/**
 * Invented, deterministic plot data for samples, tests and benches: an SSB emission spectrum
 * against a stepped mask, and a two-tone intermodulation spectrum. The shapes are plausible, the
 * numbers are made up; nothing here is a measurement.
 */
import { formatNumber } from '../pdf-kit/format-number';
import type { PlotSpec } from './report-document';

/** Park-Miller minimal standard generator (Park and Miller, CACM 31(10), 1988), in [0, 1). */
function seededRandom(seed: number): () => number {
  let state = Math.max(1, Math.floor(seed) % 2147483647);
  return () => {
    state = (state * 16807) % 2147483647;
    return (state - 1) / 2147483646;
  };
}

/**
 * Stepped mask of 47 CFR 80.211 for an authorized bandwidth of 3.0 kHz, in dB relative to mean
 * power versus offset from the assigned frequency: no limit to 1.5 kHz, -28 dB to 4.5 kHz,
 * -35 dB to 7.5 kHz, then -(43 + 10 log10(P/W)) dB.
 */
function maskLevelDb(offsetHz: number, pepW: number): number {
  const a = Math.abs(offsetHz);
  return a <= 1500 ? Infinity : a <= 4500 ? -28 : a <= 7500 ? -35 : -(43 + 10 * Math.log10(pepW));
}

/**
 * An emission-mask figure with `points` trace points from -12 kHz to +12 kHz, the mask as a
 * dashed limit and the point of least margin marked (also returned as numbers, so a sample result
 * can quote them). Throws a RangeError below 10 points.
 * @example buildSampleMaskPlot(1000, 150, 1).series[0].x.length // 1000
 */
export function buildSampleMaskPlot(
  points: number,
  pepW: number,
  seed: number,
): PlotSpec & { leastMarginDb: number; levelAtLeastMarginDb: number } {
  if (!(points >= 10)) {
    throw new RangeError(`buildSampleMaskPlot: need at least 10 points, got ${points}`);
  }
  const random = seededRandom(seed);
  const x = new Float64Array(points);
  const y = new Float64Array(points);
  let worst = { x: 0, y: 0, marginDb: Infinity };
  for (let i = 0; i < points; i++) {
    const offsetHz = -12000 + (24000 * i) / (points - 1);
    // Passband 300-2700 Hz audio = +-1200 Hz about the assigned frequency, then steep skirts.
    const outside = Math.max(0, Math.abs(offsetHz) - 1200);
    const skirtDb = Math.max(-110 * (outside / 1000), -72);
    const levelDb = skirtDb + (random() - 0.5) * (outside > 0 ? 6 : 1.5);
    x[i] = offsetHz;
    y[i] = levelDb;
    // The mask starts beyond 50 % of the authorized bandwidth (1.5 kHz); no limit inside it.
    const marginDb = maskLevelDb(offsetHz, pepW) - levelDb;
    if (Math.abs(offsetHz) > 1500 && marginDb < worst.marginDb) {
      worst = { x: offsetHz, y: levelDb, marginDb };
    }
  }
  const edge = 43 + 10 * Math.log10(pepW);
  const limitX = [
    -12000, -7500, -7500, -4500, -4500, -1500, 0, 1500, 4500, 4500, 7500, 7500, 12000,
  ];
  const limitY = [-edge, -edge, -35, -35, -28, -28, Number.NaN, -28, -28, -35, -35, -edge, -edge];
  return {
    title: 'Emission mask, 2182 kHz, 150 W PEP',
    xLabel: 'Offset from assigned frequency (Hz)',
    yLabel: 'Level relative to mean power (dB)',
    series: [
      { name: 'Measured spectrum (RMS, 300 Hz RBW)', x, y, role: 'trace' },
      { name: '47 CFR 80.211 mask (AB 3.0 kHz)', x: limitX, y: limitY, role: 'limit' },
    ],
    marker: {
      x: worst.x,
      y: worst.y,
      label: `Least margin ${formatNumber(worst.marginDb, 1)} dB at ${formatNumber(worst.x, 0)} Hz`,
    },
    leastMarginDb: worst.marginDb,
    levelAtLeastMarginDb: worst.y,
  };
}

/**
 * A two-tone intermodulation figure for tones at 400 and 1800 Hz (47 CFR 2.1049 test tones for
 * a 3.0 kHz bandwidth): third- to seventh-order products at 400 - n*1400 and 1800 + n*1400 Hz.
 */
export function buildSampleImdPlot(seed: number): PlotSpec {
  const random = seededRandom(seed);
  const x = [400, 1800];
  const y = [-6.02, -6.02];
  [-32, -41, -49].forEach((levelDb, n) => {
    x.push(400 - (n + 1) * 1400, 1800 + (n + 1) * 1400);
    y.push(levelDb + random() * 2, levelDb - random() * 2);
  });
  const order = x.map((_, i) => i).sort((a, b) => x[a] - x[b]);
  return {
    title: 'Two-tone intermodulation, 2182 kHz, tones 400 Hz + 1800 Hz',
    xLabel: 'Audio-equivalent frequency (Hz)',
    yLabel: 'Level relative to PEP (dB)',
    series: [
      {
        name: 'Tones and products',
        x: order.map((i) => x[i]),
        y: order.map((i) => y[i]),
        role: 'products',
      },
    ],
    marker: { x: x[2], y: y[2], label: 'IM3 (lower)' },
  };
}
