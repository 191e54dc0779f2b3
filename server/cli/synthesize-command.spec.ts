import fs from 'node:fs';
import path from 'node:path';
import { parseSigmfMeta } from '../../shared/import/parse-sigmf-meta';
import { errorLines, makeTempFolder, runCompiledCli } from './cli-process.test-support';

describe('sidecheck synthesize and self-validate (compiled CLI)', () => {
  const temp = makeTempFolder('synth');
  beforeAll(() => {
    expect(runCompiledCli(['--help']).status).toBe(0);
  }, 180_000);
  afterAll(() => temp.remove());

  it('writes a valid SigMF pair whose size matches the sample count', () => {
    const prefix = path.join(temp.folder, 'one');
    const args = ['--out', prefix, '--rate', '8000', '--samples', '1000', '--json'];
    const run = runCompiledCli(['synthesize', ...args]);
    expect(run.status).toBe(0);
    const result = JSON.parse(run.stdout);
    const meta = parseSigmfMeta(fs.readFileSync(`${prefix}.sigmf-meta`, 'utf8'));
    expect(meta).toMatchObject({ sampleRateHz: 8000, datatype: { name: 'cf32_le' } });
    expect(fs.statSync(`${prefix}.sigmf-data`).size).toBe(1000 * 8);
    // Default tone 1000 Hz at -10 dBFS: one tone, so PEP = mean = the tone power (n = 1).
    expect(result.truth.nominalPepDbfs).toBeCloseTo(-10, 9);
    expect(result.truth.meanPowerDbfs).toBeCloseTo(-10, 9);
  });

  it('refuses malformed tones and IMD without two tones', () => {
    const out = (name: string) => ['--out', path.join(temp.folder, name)];
    const bad = runCompiledCli(['synthesize', ...out('x'), '--tone', '1000']);
    expect(bad.status).toBe(2);
    const expected = 'sidecheck: --tone must be HZ:DBFS or HZ:DBFS:DEG with HZ > 0, got "1000"';
    expect(errorLines(bad)).toEqual([expected]);
    const imd = runCompiledCli(['synthesize', ...out('y'), '--imd3-db', '30']);
    expect(imd.status).toBe(1);
    expect(errorLines(imd)[0]).toMatch(/intermod products need two tones/);
  });

  it('self-validate prints a passing JSON record of expected vs measured', () => {
    const run = runCompiledCli(['self-validate', '--json']);
    expect(run.status).toBe(0);
    const record = JSON.parse(run.stdout);
    expect(record).toMatchObject({ clause: 'ISO/IEC 17025:2017 7.11.2', pass: true, failed: 0 });
    expect(record.results.length).toBeGreaterThan(10);
    for (const r of record.results) {
      expect(Object.keys(r)).toEqual(expect.arrayContaining(['expected', 'measured', 'pass']));
    }
  }, 60_000);
});
