import fs from 'node:fs';
import path from 'node:path';
import { errorLines, makeTempFolder, runCompiledCli } from './cli-process.test-support';

// Mask shaped like 47 CFR 80.211(a) for a 3 kHz authorized bandwidth (steps at 50 %, 150 %,
// 250 %); the limits here only need to be known, not official. Expected margins below are
// worked by hand from the mask definition: margin = (reference + relDb) - level.
const MASK = {
  reference: 'pep',
  vertices: [[0, 0], [1500, 0], [1500, -28], [4500, -28], [4500, -35], [7500, -35], [7500, -43]],
};
const CENTER_HZ = 2_182_000;
const REFERENCE_DBM = 40;

/** Bins every 10 Hz centred on odd 5 Hz offsets; a flat 0 dBm band from +300 to +2700 Hz. */
function traceCsv(spur?: { offsetHz: number; levelDbm: number }): string {
  const lines = ['# synthetic trace', 'frequency_hz,level_dbm'];
  for (let offsetHz = -9995; offsetHz <= 9995; offsetHz += 10) {
    let level = offsetHz > 300 && offsetHz < 2700 ? 0 : -300;
    if (spur !== undefined && offsetHz === spur.offsetHz) level = spur.levelDbm;
    lines.push(`${CENTER_HZ + offsetHz},${level}`);
  }
  return lines.join('\n') + '\n';
}

describe('sidecheck analyze-trace (compiled CLI)', () => {
  const temp = makeTempFolder('trace');
  const file = (name: string, text: string) => {
    const full = path.join(temp.folder, name);
    fs.writeFileSync(full, text);
    return full;
  };
  const maskFile = file('mask.json', JSON.stringify(MASK));
  const args = (csv: string, mask = maskFile) => [
    'analyze-trace', csv, '--mask', mask, '--center-hz', String(CENTER_HZ),
    '--reference-dbm', String(REFERENCE_DBM), '--json',
  ];

  beforeAll(() => {
    expect(runCompiledCli(['--help']).status).toBe(0); // builds once, outside the timed tests
  }, 180_000);
  afterAll(() => temp.remove());

  it('passes a flat 300-2700 Hz band and reports its 99 % occupied bandwidth', () => {
    const run = runCompiledCli(args(file('pass.csv', traceCsv())));
    expect(run.status).toBe(0);
    const result = JSON.parse(run.stdout);
    // Worst point: the band beyond the 1500 Hz step sits at 0 dBm under a 40 - 28 = 12 dBm limit;
    // the lowest such bin is at +1505 Hz.
    expect(result).toMatchObject({ verdict: 'pass', pointCount: 2000 });
    expect(result.worstFrequencyHz).toBe(CENTER_HZ + 1505);
    expect(result.worstMarginDb).toBeCloseTo(12, 9);
    // RR 1.153 definition, 0.5 % of the power outside each limit: a flat 2400 Hz band -> 2376 Hz.
    expect(result.occupiedBandwidthHz).toBeCloseTo(2376, 3);
  });

  it('fails a spur 2 dB over the 35 dB step and names its frequency', () => {
    const spur = { offsetHz: -5005, levelDbm: REFERENCE_DBM - 35 + 2 };
    const run = runCompiledCli(args(file('fail.csv', traceCsv(spur))));
    expect(run.status).toBe(0);
    const result = JSON.parse(run.stdout);
    expect(result.verdict).toBe('fail');
    expect(result.worstMarginDb).toBeCloseTo(-2, 9);
    expect(result.worstFrequencyHz).toBe(CENTER_HZ - 5005);
  });

  it('prints a readable table without --json', () => {
    const run = runCompiledCli(args(file('table.csv', traceCsv())).filter((a) => a !== '--json'));
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/verdict\s+PASS/);
    expect(run.stdout).toMatch(/worst margin\s+12\.00 dB/);
  });

  it('reports a bad CSV number with its line and column on one stderr line, exit 1', () => {
    const run = runCompiledCli(args(file('bad.csv', 'frequency_hz,level_dbm\n1,2\n2,abc\n')));
    expect(run.status).toBe(1);
    expect(run.stdout).toBe('');
    expect(errorLines(run)).toEqual([
      'sidecheck: bad.csv: parseTraceCsv: line 3, column 2: level "abc" is not a number',
    ]);
  });

  it('refuses a mask that breaks the schema or is not JSON, exit 1', () => {
    const csv = file('ok.csv', traceCsv());
    const over = { reference: 'pep', vertices: [[0, 0], [100, 3]] };
    const positive = file('positive.json', JSON.stringify(over));
    const run = runCompiledCli(args(csv, positive));
    expect(run.status).toBe(1);
    expect(errorLines(run)).toHaveLength(1);
    expect(run.stderr).toMatch(/positive\.json: \/vertices\/1\/1 must be <= 0/);
    const misspelt = file('typo.json', JSON.stringify({ ...MASK, referense: 1 }));
    const typo = runCompiledCli(args(csv, misspelt));
    expect(typo.stderr).toMatch(/unknown member "referense"/);
    // The stray "]" after "[[0, 0]," is character 23 of line 3.
    const brokenText = '{\n  "reference": "pep",\n  "vertices": [[0, 0],]\n}';
    const broken = runCompiledCli(args(csv, file('broken.json', brokenText)));
    expect(broken.status).toBe(1);
    expect(broken.stderr).toMatch(/broken\.json: line 3, column 23: not valid JSON/);
  });

  it('treats missing options as usage errors (exit 2) and a missing file as input (exit 1)', () => {
    const noMask = runCompiledCli(['analyze-trace', 'x.csv', '--center-hz', '1']);
    expect(noMask.status).toBe(2);
    expect(errorLines(noMask)).toHaveLength(1);
    const withUnit = args('x.csv').map((a) => (a === String(CENTER_HZ) ? '2MHz' : a));
    const badNumber = runCompiledCli(withUnit);
    expect(badNumber.status).toBe(2);
    expect(badNumber.stderr).toMatch(/--center-hz must be a number, got "2MHz"/);
    const missing = runCompiledCli(args(path.join(temp.folder, 'nope.csv')));
    expect(missing.status).toBe(1);
    expect(missing.stderr).toMatch(/ENOENT/);
    expect(missing.stderr).not.toMatch(/\n\s+at /);
  });
});
