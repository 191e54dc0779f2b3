import path from 'node:path';
import { createIqAnalyzer } from '../../shared/iq/analyze-iq';
import { ImportError } from '../../shared/import/import-error';
import { ENGINE_VERSION } from '../../shared/engine-version';
import { inputError } from './cli-error';
import { formatTable, toJsonLine } from './format-table';
import type { CliOutput } from './main';
import { openIqSource, type IqFormat } from './open-iq-source';
import { choiceOption, numberOption, parseCliArguments } from './parse-cli-arguments';
import { streamIqFile } from './stream-iq-file';

const SYNTAX = {
  command: 'analyze-iq',
  positional: ['file'],
  valueOptions: ['sideband', 'full-scale-dbm', 'format', 'rate', 'segment-length'],
  flagOptions: ['json', 'help'],
};

const HELP = `Usage: sidecheck analyze-iq FILE [--sideband usb|lsb|auto] [--full-scale-dbm DBM]
                            [--format sigmf|wav|cf32|ci16] [--rate HZ] [--segment-length N] [--json]
  Measures PEP, mean power, carrier and unwanted-sideband suppression, two-tone IMD (3rd and
  5th order, stronger product of each, dB below PEP), 99 % occupied bandwidth and the tones of
  a complex baseband recording. Levels are dBFS (full scale = 1.0); with --full-scale-dbm the
  absolute pepDbm and meanPowerDbm are added.
`;

/** The analysis as printed: stable field names for bench automation. */
export interface AnalyzeIqReport {
  file: string;
  format: IqFormat;
  datatype: string;
  sampleRateHz: number;
  sampleCount: number;
  centerFrequencyHz: number | null;
  sideband: string;
  pepDbfs: number;
  meanPowerDbfs: number;
  pepDbm: number | null;
  meanPowerDbm: number | null;
  carrierSuppressionDb: number;
  unwantedSidebandSuppressionDb: number | null;
  imd3Db: number | null;
  imd5Db: number | null;
  occupiedBandwidthHz: number;
  tones: Array<{ frequencyHz: number; levelDbfs: number }>;
  engineVersion: string;
}

/**
 * `analyze-iq`: streams a recording through the I/Q analyzer in fixed-size reads and prints one
 * JSON object (--json) or a table.
 */
export async function analyzeIqCommand(argv: string[], output: CliOutput): Promise<number> {
  if (argv.includes('--help')) {
    output.stdout(HELP);
    return 0;
  }
  const parsed = parseCliArguments(argv, SYNTAX);
  const sideband = choiceOption(parsed, 'sideband', ['usb', 'lsb', 'auto'] as const);
  const fullScaleDbm = numberOption(parsed, 'full-scale-dbm');
  const format = choiceOption(parsed, 'format', ['sigmf', 'wav', 'cf32', 'ci16'] as const);
  const rateHz = numberOption(parsed, 'rate', { min: Number.MIN_VALUE });
  const segmentLength = numberOption(parsed, 'segment-length', { min: 16, integer: true });
  const file = parsed.positional[0];

  const source = await openIqSource(file, { format, rateHz });
  const analyzer = createIqAnalyzer({
    sampleRateHz: source.sampleRateHz,
    ...(sideband !== undefined && { sideband }),
    ...(fullScaleDbm !== undefined && { fullScaleDbm }),
    ...(segmentLength !== undefined && { segmentLength }),
  });
  try {
    await streamIqFile(source, (i, q) => analyzer.push(i, q));
  } catch (error) {
    if (error instanceof ImportError) {
      throw inputError(`${path.basename(source.dataPath)}: ${error.message}`);
    }
    throw error;
  }
  const analysis = analyzer.finish();
  const report: AnalyzeIqReport = {
    file: path.basename(file),
    format: source.format,
    datatype: source.datatype.name,
    sampleRateHz: analysis.sampleRateHz,
    sampleCount: analysis.sampleCount,
    centerFrequencyHz: source.centerFrequencyHz,
    sideband: analysis.sideband,
    pepDbfs: analysis.pepDbfs,
    meanPowerDbfs: analysis.meanPowerDbfs,
    pepDbm: analysis.pepDbm,
    meanPowerDbm: analysis.meanPowerDbm,
    carrierSuppressionDb: analysis.carrierSuppressionDb,
    unwantedSidebandSuppressionDb: analysis.unwantedSidebandSuppressionDb,
    imd3Db: analysis.imd3Db,
    imd5Db: analysis.imd5Db,
    occupiedBandwidthHz: analysis.occupiedBandwidthHz,
    tones: analysis.tones.map(({ frequencyHz, levelDbfs }) => ({ frequencyHz, levelDbfs })),
    engineVersion: ENGINE_VERSION,
  };
  output.stdout(parsed.flags.has('json') ? toJsonLine(report) : formatReport(report));
  return 0;
}

function formatReport(r: AnalyzeIqReport): string {
  const tones = r.tones.map(
    (t) => `${t.frequencyHz.toFixed(1)} Hz @ ${t.levelDbfs.toFixed(2)} dBFS`,
  );
  return formatTable([
    ['file', `${r.file} (${r.format}, ${r.datatype})`],
    ['sample rate', r.sampleRateHz, 'Hz'],
    ['samples', String(r.sampleCount)],
    ['centre frequency', r.centerFrequencyHz, 'Hz'],
    ['sideband', r.sideband.toUpperCase()],
    ['PEP', r.pepDbfs, 'dBFS'],
    ['PEP (absolute)', r.pepDbm, 'dBm'],
    ['mean power', r.meanPowerDbfs, 'dBFS'],
    ['mean power (absolute)', r.meanPowerDbm, 'dBm'],
    ['carrier suppression', r.carrierSuppressionDb, 'dB below PEP'],
    ['unwanted sideband suppression', r.unwantedSidebandSuppressionDb, 'dB below PEP'],
    ['IMD3', r.imd3Db, 'dB below PEP'],
    ['IMD5', r.imd5Db, 'dB below PEP'],
    ['occupied bandwidth (99 %)', r.occupiedBandwidthHz, 'Hz'],
    ['tones', tones.length === 0 ? 'none' : tones.join('; ')],
  ]);
}
