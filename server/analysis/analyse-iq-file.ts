import { createIqAnalyzer, type IqAnalysis } from '../../shared/iq/analyze-iq';
import type { IqEvidence } from '../../shared/evaluation/evaluate-trace';
import { openIqSource, type IqFormat } from '../cli/open-iq-source';
import { streamIqFile } from '../cli/stream-iq-file';
import { importFailure } from './import-failure';
import { finiteOrNull, thinForPlot, type PlotSeries } from './plot-points';

/** What is kept of a capture: every figure of the I/Q analysis, and the PSD thinned for the chart. */
export interface IqSummary {
  source: 'iq';
  format: IqFormat;
  datatype: string;
  sampleRateHz: number;
  sampleCount: number;
  /** RF frequency of the capture's 0 Hz (the carrier): SigMF core:frequency, else as given. */
  centerHz: number | null;
  /** Every scalar of the analysis and the tones; a carrier of no power is stored as null. */
  figures: Omit<IqAnalysis, 'psd' | 'sampleRateHz' | 'sampleCount' | 'carrierSuppressionDb'> & { carrierSuppressionDb: number | null };
  /** x: offset from the carrier (Hz), y: PSD (dBFS/Hz), min/max per bucket. */
  plot: PlotSeries;
}

/**
 * Streams an I/Q recording through the shared analyzer with the command line's own readers
 * (openIqSource, streamIqFile): fixed 1 MiB reads into one buffer, so memory stays bounded, and
 * an await between reads, so a long capture (1.92 M samples take about 0.2 s here) lets the
 * server answer other requests meanwhile. `filePath` is the placed main file (file.sigmf-meta,
 * file.wav, file.cf32 or file.ci16); a SigMF dataset lies beside it as file.sigmf-data.
 *
 * @throws ImportProblem (422) with the part and byte offset of bad data (truncated, NaN samples,
 *   a lying header); analysisFailed (422) for a capture without signal or too short.
 */
export async function analyseIqFile(filePath: string, options: { format: IqFormat; sampleRateHz?: number; sideband: 'usb' | 'lsb' | 'auto'; fullScaleDbm?: number; centerHz?: number }): Promise<{ evidence: IqEvidence; summary: IqSummary }> {
  const dataPart = options.format === 'sigmf' ? 'data' : 'file';
  let analysis: IqAnalysis;
  let source;
  try {
    source = await openIqSource(filePath, { format: options.format, ...(options.sampleRateHz !== undefined && { rateHz: options.sampleRateHz }) });
    const analyzer = createIqAnalyzer({ sampleRateHz: source.sampleRateHz, sideband: options.sideband, ...(options.fullScaleDbm !== undefined && { fullScaleDbm: options.fullScaleDbm }) });
    await streamIqFile(source, (i, q) => analyzer.push(i, q));
    analysis = analyzer.finish();
  } catch (error) {
    importFailure(error, dataPart);
  }
  const { psd, sampleRateHz, sampleCount, ...figures } = analysis;
  const evidence: IqEvidence = {
    source: 'iq',
    carrierSuppressionDb: analysis.carrierSuppressionDb,
    unwantedSidebandSuppressionDb: analysis.unwantedSidebandSuppressionDb,
    imd3Db: analysis.imd3Db,
    imd5Db: analysis.imd5Db,
    occupiedBandwidthHz: analysis.occupiedBandwidthHz,
  };
  return {
    evidence,
    summary: {
      source: 'iq',
      format: options.format,
      datatype: source.datatype.name,
      sampleRateHz,
      sampleCount,
      centerHz: source.centerFrequencyHz ?? options.centerHz ?? null,
      figures: { ...figures, carrierSuppressionDb: finiteOrNull(figures.carrierSuppressionDb) },
      plot: thinForPlot(psd.frequencyHz, psd.psdDbfsPerHz),
    },
  };
}
