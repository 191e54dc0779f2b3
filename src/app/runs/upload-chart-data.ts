import { maskLimitLine } from './mask-limit-line';
import type { MaskFigures, UploadAnalysis } from './uploads-api';

/** Everything the spectrum chart needs for one stored analysis. */
export interface ChartData {
  frequencyHz: Float64Array;
  levelDb: (number | null)[];
  /** The mask at each point, dBm; null when there is no mask. */
  limitDb: (number | null)[] | null;
  worstIndex: number | null;
  levelUnit: string;
  /** The axis is labelled as the offset from this frequency. */
  originHz: number;
  frequencyLabel: string;
}

/**
 * The chart series for an upload's analysis. A trace is drawn in dBm about the assigned frequency
 * (the mask's centre) or the carrier; a capture's PSD in dBFS/Hz about its carrier (0 Hz). The
 * stored plot is thinned (min/max per bucket), so the exact worst point of the mask check — its
 * frequency and the level there — is inserted in frequency order and ringed, and the mask is
 * evaluated at every plotted frequency. Pure; points without a frequency are dropped.
 * @example uploadChartData(traceAnalysis, mask, -31.2).worstIndex // index of mask.worstFrequencyHz
 */
export function uploadChartData(analysis: UploadAnalysis, mask: MaskFigures | null = null, worstLevelDbm: number | null = null): ChartData {
  const xs: number[] = [];
  const ys: (number | null)[] = [];
  analysis.plot.x.forEach((x, i) => {
    if (x === null) return;
    xs.push(x);
    ys.push(analysis.plot.y[i] ?? null);
  });
  let worstIndex: number | null = null;
  if (mask && worstLevelDbm !== null && Number.isFinite(worstLevelDbm)) {
    let at = xs.findIndex((x) => x >= mask.worstFrequencyHz);
    if (at < 0) at = xs.length;
    if (xs[at] === mask.worstFrequencyHz) ys[at] = worstLevelDbm;
    else {
      xs.splice(at, 0, mask.worstFrequencyHz);
      ys.splice(at, 0, worstLevelDbm);
    }
    worstIndex = at;
  }
  const frequencyHz = Float64Array.from(xs);
  if (analysis.source === 'iq') {
    return { frequencyHz, levelDb: ys, limitDb: null, worstIndex: null, levelUnit: 'dBFS/Hz', originHz: 0, frequencyLabel: 'Offset from the carrier (kHz)' };
  }
  return {
    frequencyHz,
    levelDb: ys,
    limitDb: mask ? maskLimitLine(frequencyHz, mask) : null,
    worstIndex,
    levelUnit: 'dBm',
    originHz: mask ? mask.assignedHz : analysis.carrierHz,
    frequencyLabel: mask ? 'Offset from the assigned frequency (kHz)' : 'Offset from the carrier (kHz)',
  };
}
