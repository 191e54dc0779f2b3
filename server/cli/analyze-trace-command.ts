import fs from 'node:fs/promises';
import path from 'node:path';
import { occupiedBandwidthFromTrace } from '../../shared/bandwidth/occupied-bandwidth';
import { parseTraceCsv } from '../../shared/import/parse-trace-csv';
import { checkEmissionMask } from '../../shared/mask/check-emission-mask';
import { inFile, usageError } from './cli-error';
import { formatTable, toJsonLine } from './format-table';
import type { CliOutput } from './main';
import { numberOption, parseCliArguments, stringOption } from './parse-cli-arguments';
import { readMaskFile } from './read-mask-file';

const SYNTAX = {
  command: 'analyze-trace',
  positional: ['file.csv'],
  valueOptions: ['mask', 'center-hz', 'reference-dbm'],
  flagOptions: ['json', 'help'],
};

const HELP = `Usage: sidecheck analyze-trace FILE.csv --mask MASK.json --center-hz HZ
                               --reference-dbm DBM [--json]
  Checks a spectrum trace against a symmetric emission mask and measures its 99 % occupied
  bandwidth. The mask's relative levels are added to --reference-dbm (the measured PEP or mean
  power, as the mask's "reference" says). Exit 0 whether the trace passes or fails the mask;
  read "verdict".
`;

/**
 * `analyze-trace`: mask check plus occupied bandwidth of a CSV trace. JSON fields: verdict,
 * worstMarginDb (min of limit - level; negative = over), worstFrequencyHz, occupiedBandwidthHz,
 * occupiedLowerHz, occupiedUpperHz, pointCount (points compared), traceLength, rbwHz, reference,
 * centerHz, referenceDbm, segments.
 */
export async function analyzeTraceCommand(argv: string[], output: CliOutput): Promise<number> {
  if (argv.includes('--help')) {
    output.stdout(HELP);
    return 0;
  }
  const parsed = parseCliArguments(argv, SYNTAX);
  const maskFile = stringOption(parsed, 'mask');
  const centerHz = numberOption(parsed, 'center-hz');
  const referenceDbm = numberOption(parsed, 'reference-dbm');
  if (maskFile === undefined || centerHz === undefined || referenceDbm === undefined) {
    throw usageError('analyze-trace: --mask, --center-hz and --reference-dbm are required');
  }
  const file = parsed.positional[0];
  const mask = await readMaskFile(maskFile);
  const text = await fs.readFile(file, 'utf8');
  const trace = inFile(file, () => parseTraceCsv(text));
  const check = checkEmissionMask(trace, mask, { centerHz, referenceDbm });
  const { frequencyHz, levelDbm, rbwHz } = trace;
  const obw = occupiedBandwidthFromTrace(frequencyHz, levelDbm);
  const result = {
    file: path.basename(file),
    verdict: check.verdict,
    worstMarginDb: check.worstMarginDb,
    worstFrequencyHz: check.worstFrequencyHz,
    occupiedBandwidthHz: obw.bandwidthHz,
    occupiedLowerHz: obw.lowerHz,
    occupiedUpperHz: obw.upperHz,
    pointCount: check.pointCount,
    traceLength: frequencyHz.length,
    rbwHz: rbwHz ?? null,
    reference: check.reference,
    centerHz,
    referenceDbm,
    segments: check.segments,
  };
  if (parsed.flags.has('json')) {
    output.stdout(toJsonLine(result));
    return 0;
  }
  output.stdout(
    formatTable([
      ['file', result.file],
      ['verdict', result.verdict.toUpperCase()],
      ['worst margin', result.worstMarginDb, 'dB'],
      ['at', result.worstFrequencyHz, 'Hz'],
      ['occupied bandwidth (99 %)', result.occupiedBandwidthHz, 'Hz'],
      ['points compared', String(result.pointCount)],
      ['reference', `${referenceDbm} dBm (${result.reference})`],
    ]),
  );
  output.stdout('\nsegment (offset Hz)          limit dB re ref   points   worst margin dB\n');
  for (const s of check.segments) {
    const span = `${s.fromOffsetHz} .. ${s.toOffsetHz === Infinity ? 'inf' : s.toOffsetHz}`;
    const limit = `${s.fromRelDb} .. ${s.toRelDb}`;
    const worst = Number.isNaN(s.worstMarginDb) ? 'n/a' : s.worstMarginDb.toFixed(2);
    const points = String(s.pointCount);
    output.stdout(`${span.padEnd(29)}${limit.padEnd(18)}${points.padEnd(9)}${worst}\n`);
  }
  return 0;
}
