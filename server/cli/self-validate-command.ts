import { createSsbSignalStream } from '../../shared/dsp/synthesizer';
import { ENGINE_VERSION } from '../../shared/engine-version';
import { createIqAnalyzer } from '../../shared/iq/analyze-iq';
import { createIqSampleDecoder } from '../../shared/import/iq-sample-decoder';
import { sigmfDatatypeFromName } from '../../shared/import/sigmf-datatype';
import { encodeIqChunk } from './encode-iq-chunk';
import { toJsonLine } from './format-table';
import type { CliOutput } from './main';
import { parseCliArguments } from './parse-cli-arguments';
import { ssbTruthReport } from './ssb-truth-report';
import { VALIDATION_CASES, type ValidationCase } from './validation-cases';

const SYNTAX = {
  command: 'self-validate',
  positional: [],
  valueOptions: [],
  flagOptions: ['json', 'help'],
};

/** One line of the validation record. */
export interface ValidationResult {
  case: string;
  quantity: string;
  unit: string;
  expected: number | string | null;
  measured: number | string | null;
  tolerance: number;
  source: string;
  pass: boolean;
}

/**
 * Runs one case the way a file would be: synthesize in chunks, encode to the case's sample
 * format, decode with the importer, analyze; then compare every check.
 */
function runCase(validation: ValidationCase): ValidationResult[] {
  const stream = createSsbSignalStream(validation.spec, { chunkLength: 40000 });
  const decoder = createIqSampleDecoder(sigmfDatatypeFromName(validation.datatype)!);
  const analyzer = createIqAnalyzer({
    sampleRateHz: validation.spec.sampleRateHz,
    ...(validation.fullScaleDbm !== undefined && { fullScaleDbm: validation.fullScaleDbm }),
  });
  for (let chunk = stream.next(); chunk !== null; chunk = stream.next()) {
    const decoded = decoder.push(encodeIqChunk(chunk.i, chunk.q, validation.datatype));
    analyzer.push(decoded.i, decoded.q);
  }
  decoder.finish();
  const analysis = analyzer.finish();
  return validation.checks(ssbTruthReport(stream.truth())).map((c) => {
    const measured = c.measured(analysis);
    const pass =
      typeof c.expected === 'number' && typeof measured === 'number'
        ? Math.abs(measured - c.expected) <= c.tolerance
        : measured === c.expected;
    const { quantity, unit, expected, tolerance, source } = c;
    return { case: validation.name, quantity, unit, expected, measured, tolerance, source, pass };
  });
}

/** `self-validate`: the validation record; exit 1 when any check fails. */
export async function selfValidateCommand(argv: string[], output: CliOutput): Promise<number> {
  if (argv.includes('--help')) {
    output.stdout('Usage: sidecheck self-validate [--json]\n');
    return 0;
  }
  const parsed = parseCliArguments(argv, SYNTAX);
  const results = VALIDATION_CASES.flatMap(runCase);
  const failed = results.filter((r) => !r.pass).length;
  const record = {
    record: 'sidecheck software validation',
    clause: 'ISO/IEC 17025:2017 7.11.2',
    engineVersion: ENGINE_VERSION,
    node: process.version,
    date: new Date().toISOString(),
    passed: results.length - failed,
    failed,
    pass: failed === 0,
    results,
  };
  if (parsed.flags.has('json')) {
    output.stdout(toJsonLine(record));
  } else {
    const show = (v: number | string | null) => (typeof v === 'number' ? v.toFixed(3) : String(v));
    output.stdout(`Software validation, engine ${ENGINE_VERSION} (ISO/IEC 17025:2017 7.11.2)\n`);
    for (const r of results) {
      const expected = `expected ${show(r.expected).padStart(9)}`;
      const measured = `measured ${show(r.measured).padStart(9)}`;
      const verdict = r.pass ? 'PASS' : 'FAIL';
      const tolerance = `±${r.tolerance} ${r.unit}`.trimEnd();
      const quantity = r.quantity.padEnd(30);
      output.stdout(`${verdict}  ${quantity} ${expected}  ${measured}  ${tolerance}\n`);
    }
    output.stdout(`${record.passed} passed, ${failed} failed\n`);
  }
  return failed === 0 ? 0 : 1;
}
