import path from 'node:path';
import { createSsbSignalStream } from '../../shared/dsp/synthesizer';
import type { IntermodSpec, SsbSignalSpec, SsbToneSpec } from '../../shared/dsp/ssb-signal-spec';
import { usageError } from './cli-error';
import { formatTable, toJsonLine } from './format-table';
import type { CliOutput } from './main';
import { choiceOption, numberOption, parseCliArguments, stringOption } from './parse-cli-arguments';
import { ssbTruthReport } from './ssb-truth-report';
import { writeSigmfPair } from './write-sigmf-pair';

const SYNTAX = {
  command: 'synthesize',
  positional: [],
  valueOptions: [
    'out', 'rate', 'duration', 'samples', 'sideband', 'tone', 'imbalance-db', 'phase-error-deg',
    'carrier-leak-db', 'imd3-db', 'imd5-db', 'noise-dbfs', 'seed', 'datatype', 'center-hz',
  ],
  flagOptions: ['json', 'help'],
};

const HELP = `Usage: sidecheck synthesize --out PREFIX [options]
  Writes PREFIX.sigmf-meta and PREFIX.sigmf-data: a phasing-method SSB signal at complex
  baseband (carrier at 0 Hz) whose contents are known exactly; --json prints that truth.
  --rate HZ                 sample rate (default 48000)
  --duration S | --samples N  length (default 1 s)
  --sideband usb|lsb        (default usb)
  --tone HZ:DBFS[:DEG]      an audio tone and the level of its RF tone; repeat for two-tone
                            (default one tone 1000:-10)
  --imbalance-db DB         Q gain relative to I          --phase-error-deg DEG  quadrature error
  --carrier-leak-db DB      residual carrier, dB below PEP (default none)
  --imd3-db DB, --imd5-db DB  3rd/5th-order products, dB below PEP (two tones needed)
  --noise-dbfs DBFS         total complex white noise power   --seed N (default 1)
  --datatype cf32_le|ci16_le  (default cf32_le)   --center-hz HZ  core:frequency of the capture
`;

function parseTone(text: string): SsbToneSpec {
  const match = /^([0-9.eE+]+):([-+0-9.eE]+)(?::([-+0-9.eE]+))?$/.exec(text);
  const fields = (match?.slice(1) ?? []).map((v) => (v === undefined ? 0 : Number(v)));
  const [audioHz, levelDbfs, phaseDeg] = fields;
  if (match === null || ![audioHz, levelDbfs, phaseDeg].every(Number.isFinite) || audioHz <= 0) {
    throw usageError(`--tone must be HZ:DBFS or HZ:DBFS:DEG with HZ > 0, got "${text}"`);
  }
  return { audioHz, levelDbfs, phaseDeg };
}

/** Builds the synthesizer's spec from the command line (exported for self-validate's reuse). */
export function signalSpecFromArguments(argv: string[]): {
  spec: SsbSignalSpec;
  out: string;
  datatype: 'cf32_le' | 'ci16_le';
  centerHz?: number;
  json: boolean;
} {
  const parsed = parseCliArguments(argv, SYNTAX);
  const out = stringOption(parsed, 'out');
  if (out === undefined) throw usageError('synthesize: --out PREFIX is required');
  const sampleRateHz = numberOption(parsed, 'rate', { min: 1 }) ?? 48000;
  const duration = numberOption(parsed, 'duration', { min: 0 });
  const samples = numberOption(parsed, 'samples', { min: 1, integer: true });
  if (duration !== undefined && samples !== undefined) {
    throw usageError('synthesize: give --duration or --samples, not both');
  }
  const sampleCount = samples ?? Math.round((duration ?? 1) * sampleRateHz);
  if (sampleCount < 1) throw usageError('synthesize: the capture would hold no samples');
  const intermod: IntermodSpec[] = [];
  const imd3 = numberOption(parsed, 'imd3-db');
  const imd5 = numberOption(parsed, 'imd5-db');
  if (imd3 !== undefined) intermod.push({ order: 3, belowPepDb: imd3 });
  if (imd5 !== undefined) intermod.push({ order: 5, belowPepDb: imd5 });
  const noiseDbfs = numberOption(parsed, 'noise-dbfs');
  const carrierLeak = numberOption(parsed, 'carrier-leak-db');
  const spec: SsbSignalSpec = {
    sampleRateHz,
    sampleCount,
    sideband: choiceOption(parsed, 'sideband', ['usb', 'lsb'] as const) ?? 'usb',
    tones: (parsed.values.get('tone') ?? ['1000:-10']).map(parseTone),
    amplitudeImbalanceDb: numberOption(parsed, 'imbalance-db') ?? 0,
    phaseErrorDeg: numberOption(parsed, 'phase-error-deg') ?? 0,
    ...(carrierLeak !== undefined && { carrierLeakBelowPepDb: carrierLeak }),
    ...(intermod.length > 0 && { intermod }),
    ...(noiseDbfs !== undefined && {
      noise: { powerDbfs: noiseDbfs, seed: numberOption(parsed, 'seed', { integer: true }) ?? 1 },
    }),
  };
  const datatype = choiceOption(parsed, 'datatype', ['cf32_le', 'ci16_le'] as const) ?? 'cf32_le';
  const centerHz = numberOption(parsed, 'center-hz');
  const json = parsed.flags.has('json');
  return { spec, out, datatype, ...(centerHz !== undefined && { centerHz }), json };
}

/** `synthesize`: writes a reference SigMF pair and prints its truth. */
export async function synthesizeCommand(argv: string[], output: CliOutput): Promise<number> {
  if (argv.includes('--help')) {
    output.stdout(HELP);
    return 0;
  }
  const { spec, out, datatype, centerHz, json } = signalSpecFromArguments(argv);
  const stream = createSsbSignalStream(spec);
  const tones = spec.tones.map((t) => `${t.audioHz} Hz @ ${t.levelDbfs} dBFS`).join(', ');
  const written = await writeSigmfPair(
    out,
    {
      sampleRateHz: spec.sampleRateHz,
      datatype,
      description: `sidecheck reference ${spec.sideband.toUpperCase()} signal: ${tones}`,
      ...(centerHz !== undefined && { centerFrequencyHz: centerHz }),
    },
    () => stream.next(),
  );
  const truth = ssbTruthReport(stream.truth());
  const result = {
    meta: written.metaPath,
    data: written.dataPath,
    datatype,
    sampleRateHz: spec.sampleRateHz,
    sampleCount: written.sampleCount,
    sideband: spec.sideband,
    truth,
  };
  if (json) {
    output.stdout(toJsonLine(result));
  } else {
    output.stdout(
      formatTable([
        ['wrote', `${path.basename(written.metaPath)} + ${path.basename(written.dataPath)}`],
        ['samples', `${written.sampleCount} at ${spec.sampleRateHz} Hz (${datatype})`],
        ['nominal PEP', truth.nominalPepDbfs, 'dBFS'],
        ['mean power', truth.meanPowerDbfs, 'dBFS'],
        ['image rejection', truth.imageRejectionDb, 'dB'],
      ]),
    );
  }
  return 0;
}
