import fs from 'node:fs/promises';
import { parseTraceCsv } from '../../shared/import/parse-trace-csv';
import type { TraceEvidence } from '../../shared/evaluation/evaluate-trace';
import { importFailure } from './import-failure';
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

/**
 * Reads a spectrum-analyzer trace CSV (shared parseTraceCsv: units from the header, strictly
 * ascending frequencies) and returns the evidence the evaluation needs plus the summary kept with
 * the upload. The CSV is parsed whole, which is why its size has its own, smaller limit.
 *
 * @throws ImportProblem (422) naming the line and column of the first bad field.
 */
export async function analyseTraceFile(filePath: string, placement: { carrierHz: number; sideband: 'usb' | 'lsb'; referenceDbm?: number }): Promise<{ evidence: TraceEvidence; summary: TraceSummary }> {
  const text = await fs.readFile(filePath, 'utf8');
  let trace;
  try {
    trace = parseTraceCsv(text);
  } catch (error) {
    importFailure(error, 'file');
  }
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
