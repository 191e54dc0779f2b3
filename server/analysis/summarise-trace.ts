import { parseTraceCsv } from '../../shared/import/parse-trace-csv';
import type { TraceEvidence } from '../../shared/evaluation/evaluate-trace';
import { thinForPlot, type PlotSeries } from './plot-points';

/** What is kept of a trace: its extent and peak, and a thinned copy for the chart. */
export interface TraceSummary {
  source: 'trace';
  pointCount: number;
  startHz: number;
  stopHz: number;
  rbwHz: number | null;
  carrierHz: number;
  sideband: 'usb' | 'lsb';
  peak: { frequencyHz: number; levelDbm: number };
  /** x: frequency (Hz), y: level (dBm), min/max per bucket. */
  plot: PlotSeries;
}

/** Where the trace sits: the carrier on its frequency axis, the sideband, the reference level. */
export interface TracePlacement {
  carrierHz: number;
  sideband: 'usb' | 'lsb';
  referenceDbm?: number;
}

/**
 * A spectrum-analyzer trace CSV's text (shared parseTraceCsv: units from the header, strictly
 * ascending frequencies) as the evidence the evaluation needs plus the summary kept with the
 * upload. Pure: runs in a worker thread (server/workers/heavy-work.ts).
 *
 * @throws ImportError naming the line and column of the first bad field.
 */
export function summariseTrace(text: string, placement: TracePlacement): { evidence: TraceEvidence; summary: TraceSummary } {
  const trace = parseTraceCsv(text);
  const { frequencyHz, levelDbm } = trace;
  let peak = 0;
  for (let k = 1; k < levelDbm.length; k++) if (levelDbm[k] > levelDbm[peak]) peak = k;
  const evidence: TraceEvidence = {
    source: 'trace',
    frequencyHz,
    levelDbm,
    carrierHz: placement.carrierHz,
    sideband: placement.sideband,
    ...(trace.rbwHz !== undefined && { rbwHz: trace.rbwHz }),
    ...(placement.referenceDbm !== undefined && { referenceDbm: placement.referenceDbm }),
  };
  return {
    evidence,
    summary: {
      source: 'trace',
      pointCount: frequencyHz.length,
      startHz: frequencyHz[0],
      stopHz: frequencyHz[frequencyHz.length - 1],
      rbwHz: trace.rbwHz ?? null,
      carrierHz: placement.carrierHz,
      sideband: placement.sideband,
      peak: { frequencyHz: frequencyHz[peak], levelDbm: levelDbm[peak] },
      plot: thinForPlot(frequencyHz, levelDbm),
    },
  };
}
