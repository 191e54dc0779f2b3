/**
 * The command line (`sidecheck analyze-trace` / `analyze-iq`) against the hostile-file corpus
 * (test/security/corpus): every file the product must refuse makes the command exit non-zero
 * with one clear line on stderr ("sidecheck: ..."), no stack trace and no JavaScript internals
 * (TypeError texts, "internal error"); nothing crashes or hangs. Most of the corpus goes through
 * the CLI's own entry (runCli, in-process, the function scripts/run-cli.js calls); a handful
 * runs as real processes through scripts/run-cli.js (what `npm run -s sidecheck` runs), with a timeout.
 */
import fs from 'node:fs';
import path from 'node:path';
import { runCli } from '../../server/cli/main';
import { errorLines, makeTempFolder, runCompiledCli } from '../../server/cli/cli-process.test-support';
import { hostileFiles, TRACE_CARRIER_HZ, validTraceCsv, type HostileFile } from './corpus';
import { rawIq } from '../../server/uploads/upload-files.test-support';

jest.setTimeout(300_000);

/** Longest an in-process run may take before it counts as a hang (common practice: generous on a busy machine). */
const HANG_MS = 30_000;
/** Texts that give away an unexpected JavaScript error rather than a message about the input. */
const INTERNALS = /internal error|Cannot read propert|is not a function|is not iterable|undefined|Invalid array length|Maximum call stack|Unexpected token|^\s+at /m;

const MASK = { reference: 'pep', vertices: [[0, 0], [1500, -25], [4000, -35]] };
/** Hostile mask files for analyze-trace (with a valid trace): each must be refused the same way. */
const HOSTILE_MASKS: { label: string; text: string }[] = [
  { label: 'not JSON', text: '{"reference": "pep", vertices: []}' },
  { label: 'empty', text: '' },
  { label: 'bare NaN in a vertex', text: '{"reference":"pep","vertices":[[0,NaN]]}' },
  { label: '1e999 offset (Infinity)', text: '{"reference":"pep","vertices":[[1e999,-30]]}' },
  { label: 'positive limit', text: '{"reference":"pep","vertices":[[0,10]]}' },
  { label: '10,000 levels of nesting', text: `{"reference":"pep","vertices":${'['.repeat(10_000)}${']'.repeat(10_000)}}` },
  { label: '__proto__ key', text: '{"reference":"pep","vertices":[[0,0]],"__proto__":{"polluted":"yes"}}' },
  { label: 'unknown reference', text: '{"reference":"peak","vertices":[[0,0]]}' },
  { label: 'vertices a string', text: '{"reference":"pep","vertices":"0,0"}' },
  { label: 'a JSON array', text: '[]' },
];

const temp = makeTempFolder('hostile-cli');
afterAll(() => temp.remove());

interface Prepared {
  entry: HostileFile;
  argv: string[];
}

/** Writes each corpus file under a plain name keeping its extension, and builds the command for it. */
function prepare(entries: HostileFile[]): Prepared[] {
  const maskPath = path.join(temp.folder, 'mask.json');
  fs.writeFileSync(maskPath, JSON.stringify(MASK));
  return entries.map((entry, k) => {
    const base = path.join(temp.folder, `f${String(k).padStart(3, '0')}`);
    const ext = /\.(csv|wav|sigmf-meta|sigmf-data|cf32|ci16|bin|png|gz)$/i.exec(entry.file.name)?.[0] ?? '.bin';
    const file = base + ext;
    fs.writeFileSync(file, entry.file.bytes);
    if (entry.data) fs.writeFileSync(`${base}.sigmf-data`, entry.data.bytes);
    if (ext === '.csv') {
      return { entry, argv: ['analyze-trace', file, '--mask', maskPath, '--center-hz', String(TRACE_CARRIER_HZ), '--reference-dbm', entry.fields.referenceDbm ?? '40', '--json'] };
    }
    const argv = ['analyze-iq', file, '--json'];
    const { format, sampleRateHz, fullScaleDbm, sideband } = entry.fields;
    if (format !== undefined) argv.push('--format', format);
    if (sampleRateHz !== undefined) argv.push('--rate', sampleRateHz);
    if (fullScaleDbm !== undefined) argv.push('--full-scale-dbm', fullScaleDbm);
    if (sideband !== undefined) argv.push('--sideband', sideband);
    return { entry, argv };
  });
}

async function runInProcess(argv: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  let timer: NodeJS.Timeout | undefined;
  const hang = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`no answer within ${HANG_MS} ms`)), HANG_MS);
  });
  try {
    const code = await Promise.race([runCli(argv, { stdout: (text) => void (stdout += text), stderr: (text) => void (stderr += text) }), hang]);
    return { code, stdout, stderr };
  } finally {
    clearTimeout(timer);
  }
}

/** What is wrong with a refusal's stderr, or null when it is one clear line. */
function badRefusal(code: number, stderr: string): string | null {
  const lines = stderr.split('\n').filter((line) => line !== '');
  if (code === 0) return 'exit 0';
  if (lines.length !== 1) return `${lines.length} lines on stderr`;
  if (!lines[0].startsWith('sidecheck: ')) return 'stderr does not start with "sidecheck: "';
  if (INTERNALS.test(lines[0])) return 'stderr shows a JavaScript internal error';
  if (lines[0].length < 25) return 'message too short to act on';
  return null;
}

test('analyze-trace and analyze-iq refuse every hostile file with one clear line and a non-zero exit (in-process)', async () => {
  const entries = (await hostileFiles()).filter((e) => e.group !== 'file-name');
  const prepared = prepare(entries);
  const failures: { input: string; problem: string; stderr: string }[] = [];
  let refused = 0;
  for (const { entry, argv } of prepared) {
    let run;
    try {
      run = await runInProcess(argv);
    } catch (error) {
      failures.push({ input: entry.label, problem: 'crashed or hung', stderr: (error as Error).stack ?? String(error) });
      continue;
    }
    if ((entry.cliExpect ?? entry.expect) === 'either' && run.code === 0) continue;
    const problem = badRefusal(run.code, run.stderr);
    if (problem) failures.push({ input: entry.label, problem, stderr: run.stderr.slice(0, 300) });
    else refused++;
  }
  console.log(`hostile-cli: ${prepared.length} corpus files through runCli, ${refused} refused with one line`);
  expect(failures).toEqual([]);
  expect(({} as Record<string, unknown>).polluted).toBeUndefined();
});

test(`analyze-trace refuses ${HOSTILE_MASKS.length} hostile mask files the same way (in-process)`, async () => {
  const trace = path.join(temp.folder, 'valid.csv');
  const { validTraceCsv } = await import('./corpus');
  fs.writeFileSync(trace, validTraceCsv());
  const failures: { input: string; problem: string; stderr: string }[] = [];
  for (const [k, mask] of HOSTILE_MASKS.entries()) {
    const maskPath = path.join(temp.folder, `mask-${k}.json`);
    fs.writeFileSync(maskPath, mask.text);
    const run = await runInProcess(['analyze-trace', trace, '--mask', maskPath, '--center-hz', String(TRACE_CARRIER_HZ), '--reference-dbm', '40']);
    const problem = badRefusal(run.code, run.stderr);
    if (problem) failures.push({ input: mask.label, problem, stderr: run.stderr.slice(0, 300) });
  }
  expect(failures).toEqual([]);
  expect(({} as Record<string, unknown>).polluted).toBeUndefined();
});

test('hostile command-line values (NaN, 1e999, negative or absurd rates and lengths, folders and devices as files) exit non-zero with one line (in-process)', async () => {
  const trace = path.join(temp.folder, 'args.csv');
  const capture = path.join(temp.folder, 'args.cf32');
  const mask = path.join(temp.folder, 'args-mask.json');
  fs.writeFileSync(trace, validTraceCsv());
  fs.writeFileSync(capture, rawIq({ sampleRateHz: 48_000, sampleCount: 4096, sideband: 'usb', tones: [{ audioHz: 1000, levelDbfs: -6 }] }, 'cf32_le').bytes);
  fs.writeFileSync(mask, JSON.stringify(MASK));
  const iq = (...extra: string[]) => ['analyze-iq', capture, '--format', 'cf32', ...extra];
  const tr = (center: string, reference: string, ...extra: string[]) => ['analyze-trace', trace, '--mask', mask, '--center-hz', center, '--reference-dbm', reference, ...extra];
  const cases: [string, string[]][] = [
    ['rate NaN', iq('--rate', 'NaN')],
    ['rate 1e999', iq('--rate', '1e999')],
    ['rate negative', iq('--rate', '-48000')],
    ['rate 5e-324 Hz', iq('--rate', '5e-324')],
    ['rate 1e308 Hz', iq('--rate', '1e308')],
    ['rate missing for raw samples', iq()],
    ['segment length 1e12', iq('--rate', '48000', '--segment-length', '1e12')],
    ['segment length 3', iq('--rate', '48000', '--segment-length', '3')],
    ['full scale 1e999', iq('--rate', '48000', '--full-scale-dbm', '1e999')],
    ['sideband with a quote', iq('--rate', '48000', '--sideband', "usb'")],
    ['format mp3', ['analyze-iq', capture, '--format', 'mp3']],
    ['a folder as the capture', ['analyze-iq', temp.folder, '--format', 'cf32', '--rate', '48000']],
    ['/dev/null as the capture', ['analyze-iq', '/dev/null', '--format', 'cf32', '--rate', '48000']],
    ['a file that does not exist', ['analyze-iq', path.join(temp.folder, 'none.cf32'), '--format', 'cf32', '--rate', '48000']],
    ['centre 1e999', tr('1e999', '40')],
    ['reference NaN', tr(String(TRACE_CARRIER_HZ), 'NaN')],
    ['/etc/passwd as the mask', ['analyze-trace', trace, '--mask', '/etc/passwd', '--center-hz', String(TRACE_CARRIER_HZ), '--reference-dbm', '40']],
    ['a folder as the trace', ['analyze-trace', temp.folder, '--mask', mask, '--center-hz', String(TRACE_CARRIER_HZ), '--reference-dbm', '40']],
    ['an unknown option', tr(String(TRACE_CARRIER_HZ), '40', '--bogus')],
    ['two files', ['analyze-trace', trace, trace, '--mask', mask, '--center-hz', String(TRACE_CARRIER_HZ), '--reference-dbm', '40']],
    ['an unknown command', ['analyse-everything', trace]],
  ];
  const failures: { input: string; problem: string; stderr: string }[] = [];
  for (const [label, argv] of cases) {
    const run = await runInProcess(argv);
    const problem = badRefusal(run.code, run.stderr);
    if (problem) failures.push({ input: label, problem, stderr: run.stderr.slice(0, 300) });
  }
  console.log(`hostile-cli: ${cases.length} hostile command lines`);
  expect(failures).toEqual([]);
});

test('as a real process (scripts/run-cli.js, as `npm run -s sidecheck` runs it): a handful exit non-zero with one line, within a timeout', async () => {
  const all = (await hostileFiles()).filter((e) => e.expect === 'refuse');
  const pick = ['trace: level "1e999"', 'trace: a megabyte-long number', 'sigmf: metadata nested 10,000 levels deep', 'sigmf: data length not a multiple of 8 bytes (cf32_le)', 'wav: bits per sample 7', 'wav: data size beyond the file', 'raw-iq: cf32 of 3 bytes (not a multiple of 8)'];
  const chosen = pick.map((label) => all.find((e) => e.label === label)!);
  expect(chosen.every(Boolean)).toBe(true);
  const prepared = prepare(chosen);
  for (const { entry, argv } of prepared) {
    // Generous: the first run may compile the command line (dist/cli) first.
    const run = runCompiledCli(argv, 180_000);
    const lines = errorLines(run);
    expect({ input: entry.label, status: run.status, lines: lines.length, internals: INTERNALS.test(run.stderr) }).toEqual({ input: entry.label, status: 1, lines: 1, internals: false });
    expect(lines[0]).toMatch(/^sidecheck: /);
  }
});
