/**
 * Engine benchmark (not a test): throughput of the measurement engine on this machine, beside an
 * independent numpy/scipy version of the same work (bench/engine_reference.py).
 *
 *   node node_modules/tsx/dist/cli.mjs bench/engine.ts [--quick]
 *
 * Workloads: a 100,001-point emission-mask check, the 99 % occupied bandwidth of that trace, a
 * Welch PSD of 1.92 M complex samples, and the whole `sidecheck analyze-iq` process on a 10 s
 * capture at 192 kS/s (SigMF cf32_le, synthesized once into a temp folder) timed from outside,
 * against `python3 bench/engine_reference.py analyze` timed the same way. Each at 1x, 10x and
 * 100x input where that fits in about a minute. Prints a table, then one JSON line.
 * The targets are ours (TARGETS below); the mask target comes from the product brief.
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { occupiedBandwidthFromTrace } from '../shared/bandwidth/occupied-bandwidth';
import { welchPsd } from '../shared/dsp/welch';
import { checkEmissionMask } from '../shared/mask/check-emission-mask';
import type { EmissionMask } from '../shared/mask/emission-mask';
import { defaultSegmentLength } from '../shared/iq/default-segment-length';

const ROOT = path.resolve(__dirname, '..');
const QUICK = process.argv.includes('--quick');
const CAPTURE_RATE_HZ = 192_000;
/** The analyzer's own segment length at 192 kS/s, used by both sides so they do the same work. */
const SEGMENT_LENGTH = defaultSegmentLength(CAPTURE_RATE_HZ);
const CAPTURE_SECONDS = 10;

/** Throughput targets, units per second (analyze-iq: seconds of capture per second). */
const TARGETS = {
  mask: { value: 50e6, unit: 'points/s' },
  obw: { value: 20e6, unit: 'points/s' },
  welch: { value: 10e6, unit: 'samples/s' },
  analyzeIq: { value: 20, unit: 'capture-s/s' },
} as const;

type Workload = keyof typeof TARGETS;
interface Row {
  workload: Workload;
  size: number;
  items: number;
  oursSeconds: number | null;
  theirsSeconds: number | null;
  note?: string;
}

// The mask of 47 CFR 80.211(a) for a 3 kHz authorized bandwidth at 100 W, as offsets from the
// assigned frequency (the numbers only shape the workload here).
const MASK: EmissionMask = {
  reference: 'mean',
  vertices: [[0, 0], [1500, 0], [1500, -28], [4500, -28], [4500, -35], [7500, -35], [7500, -63]],
};

/** xorshift32: a fixed pseudo-random sequence so every run times the same data. */
function random(seed: number): () => number {
  let s = seed >>> 0 || 1;
  return () => {
    s ^= s << 13;
    s >>>= 0;
    s ^= s >>> 17;
    s ^= s << 5;
    s >>>= 0;
    return s / 4294967296;
  };
}

function bestOf(repeats: number, action: () => void): number {
  let best = Infinity;
  for (let k = 0; k < repeats; k++) {
    const start = process.hrtime.bigint();
    action();
    best = Math.min(best, Number(process.hrtime.bigint() - start) / 1e9);
  }
  return best;
}

function makeTrace(points: number): { frequencyHz: Float64Array; levelDbm: Float64Array } {
  const next = random(points);
  const frequencyHz = new Float64Array(points);
  const levelDbm = new Float64Array(points);
  for (let k = 0; k < points; k++) {
    frequencyHz[k] = 2_170_000 + (24_000 * k) / (points - 1);
    levelDbm[k] = -60 + 20 * (next() - 0.5);
  }
  return { frequencyHz, levelDbm };
}

function microBenchmarks(sizes: number[]): Row[] {
  const rows: Row[] = [];
  for (const size of sizes) {
    const points = 100_001 * size;
    const trace = makeTrace(points);
    const repeats = size === 1 ? 20 : size === 10 ? 5 : 2;
    const options = { centerHz: 2_182_000, referenceDbm: 0 };
    checkEmissionMask(trace, MASK, options); // warm the JIT before timing
    const mask = bestOf(repeats, () => checkEmissionMask(trace, MASK, options));
    const { frequencyHz, levelDbm } = trace;
    const obw = bestOf(repeats, () => occupiedBandwidthFromTrace(frequencyHz, levelDbm));
    rows.push({ workload: 'mask', size, items: points, oursSeconds: mask, theirsSeconds: null });
    rows.push({ workload: 'obw', size, items: points, oursSeconds: obw, theirsSeconds: null });
    const samples = 1_920_000 * size;
    if (size > 10) {
      const note = 'skipped: 192 M samples need > 1.5 GB';
      rows.push({ workload: 'welch', size, items: samples, ...NOT_RUN, note });
      continue;
    }
    const next = random(size + 11);
    const i = Float32Array.from({ length: samples }, () => next() - 0.5);
    const q = Float32Array.from({ length: samples }, () => next() - 0.5);
    const welchOptions = { sampleRateHz: CAPTURE_RATE_HZ, segmentLength: SEGMENT_LENGTH };
    const welch = bestOf(size === 1 ? 3 : 1, () => welchPsd(i, q, welchOptions));
    rows.push({ workload: 'welch', size, items: samples, oursSeconds: welch, theirsSeconds: null });
  }
  return rows;
}

function run(command: string, args: string[]): { seconds: number; stdout: string } {
  const start = process.hrtime.bigint();
  const result = spawnSync(command, args, { cwd: ROOT, encoding: 'utf8', maxBuffer: 1 << 26 });
  const seconds = Number(process.hrtime.bigint() - start) / 1e9;
  if (result.status !== 0) {
    const line = `${command} ${args.join(' ')}`;
    throw new Error(`${line} exited ${result.status}: ${result.stderr.trim()}`);
  }
  return { seconds, stdout: result.stdout };
}

const NOT_RUN = { oursSeconds: null, theirsSeconds: null };
const CLI = [path.join(ROOT, 'scripts', 'run-cli.js')];
const PYTHON_REFERENCE = path.join(ROOT, 'bench', 'engine_reference.py');

function processBenchmarks(sizes: number[], folder: string): Row[] {
  run(process.execPath, [...CLI, '--help']); // compile once, outside the timings
  const rows: Row[] = [];
  for (const size of sizes) {
    const seconds = CAPTURE_SECONDS * size;
    const samples = CAPTURE_RATE_HZ * seconds;
    if (size > 10) {
      const note = `skipped: a ${((samples * 8) / 1e9).toFixed(1)} GB capture file`;
      rows.push({ workload: 'analyzeIq', size, items: seconds, ...NOT_RUN, note });
      continue;
    }
    const prefix = path.join(folder, `two-tone-${seconds}s`);
    const signal = ['--tone', '700:-12', '--tone', '1900:-12', '--noise-dbfs', '-90'];
    const length = ['--rate', String(CAPTURE_RATE_HZ), '--duration', String(seconds)];
    run(process.execPath, [...CLI, 'synthesize', '--out', prefix, ...length, ...signal]);
    const meta = `${prefix}.sigmf-meta`;
    const repeats = size === 1 ? 3 : 1;
    let ours = Infinity;
    let theirs = Infinity;
    for (let k = 0; k < repeats; k++) {
      ours = Math.min(ours, run(process.execPath, [...CLI, 'analyze-iq', meta, '--json']).seconds);
      const args = [PYTHON_REFERENCE, 'analyze', meta, '--segment', String(SEGMENT_LENGTH)];
      theirs = Math.min(theirs, run('python3', args).seconds);
    }
    const timing = { oursSeconds: ours, theirsSeconds: theirs };
    rows.push({ workload: 'analyzeIq', size, items: seconds, ...timing });
  }
  return rows;
}

function referenceMicro(sizes: number[]): Map<string, number> {
  const args = [PYTHON_REFERENCE, 'micro', '--sizes', sizes.join(',')];
  const output = run('python3', [...args, '--segment', String(SEGMENT_LENGTH)]).stdout;
  type Timing = { size: number; maskSeconds: number; obwSeconds: number; welchSeconds?: number };
  const report = JSON.parse(output) as { results: Timing[] };
  const times = new Map<string, number>();
  for (const r of report.results) {
    times.set(`mask:${r.size}`, r.maskSeconds);
    times.set(`obw:${r.size}`, r.obwSeconds);
    if (r.welchSeconds !== undefined) times.set(`welch:${r.size}`, r.welchSeconds);
  }
  return times;
}

function format(value: number | null, digits = 3): string {
  if (value === null) return '-';
  if (value >= 1e6) return `${(value / 1e6).toFixed(1)} M`;
  return value.toFixed(digits);
}

function main(): void {
  const sizes = QUICK ? [1, 10] : [1, 10, 100];
  const folder = fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-bench-'));
  try {
    const theirs = referenceMicro(sizes);
    const rows = microBenchmarks(sizes).map((row) => ({
      ...row,
      theirsSeconds: theirs.get(`${row.workload}:${row.size}`) ?? null,
    }));
    rows.push(...processBenchmarks(sizes, folder));
    report(rows);
  } finally {
    fs.rmSync(folder, { recursive: true, force: true });
  }
}

function report(rows: Row[]): void {
  const cpu = os.cpus()[0]?.model ?? 'cpu';
  console.log(`Sidecheck engine benchmark: ${os.cpus().length} x ${cpu}, node ${process.version}`);
  const table: string[][] = [
    ['workload', 'size', 'items', 'ours s', 'numpy s', 'ours/theirs', 'ours rate', 'target'].concat(
      ['growth', ''],
    ),
  ];
  const json = rows.map((row) => {
    const base = rows.find((r) => r.workload === row.workload && r.size === 1);
    const ours = row.oursSeconds;
    const rate = ours === null ? null : row.items / ours;
    const ratio = ours !== null && row.theirsSeconds !== null ? ours / row.theirsSeconds : null;
    const growth = ours !== null && base?.oursSeconds ? ours / base.oursSeconds : null;
    const target = TARGETS[row.workload];
    const meetsTarget = rate === null ? null : rate >= target.value;
    const verdict = meetsTarget === null ? '' : meetsTarget ? ' ok' : ' MISS';
    table.push([
      row.workload,
      `${row.size}x`,
      String(row.items),
      format(ours, 4),
      format(row.theirsSeconds, 4),
      format(ratio, 2),
      `${format(rate, 1)} ${target.unit}`,
      `>= ${format(target.value, 0)}${verdict}`,
      growth === null ? '-' : `${growth.toFixed(1)}x`,
      row.note ?? '',
    ]);
    const { value, unit } = target;
    return { ...row, oursRate: rate, rateUnit: unit, target: value, meetsTarget, ratio, growth };
  });
  const widths = table[0].map((_, c) => Math.max(...table.map((cells) => cells[c].length)));
  for (const cells of table) {
    const padded = cells.map((cell, c) =>
      c === 0 || c === 9 ? cell.padEnd(widths[c]) : cell.padStart(widths[c]),
    );
    console.log(padded.join('  ').trimEnd());
  }
  const cpus = os.cpus().length;
  console.log(JSON.stringify({ bench: 'engine', node: process.version, cpus, rows: json }));
}

main();
