import fs from 'node:fs';
import path from 'node:path';
import { errorLines, makeTempFolder, runCompiledCli } from './cli-process.test-support';

interface Truth {
  pepDbfs: number;
  meanPowerDbfs: number;
  carrierDbfs: number;
  imageRejectionDb: number;
  intermodProducts: Array<{ order: number; levelDbfs: number }>;
}

const TOLERANCE_DB = 0.3;

/** A canonical 44-byte RIFF/WAVE header (Microsoft RIFF WAVE layout) for stereo data bytes. */
function wavHeader(dataBytes: number, rateHz: number, format: 'float' | 'pcm16'): Buffer {
  const bits = format === 'float' ? 32 : 16;
  const header = Buffer.alloc(44);
  header.write('RIFF', 0, 'ascii');
  header.writeUInt32LE(36 + dataBytes, 4);
  header.write('WAVEfmt ', 8, 'ascii');
  header.writeUInt32LE(16, 16);
  header.writeUInt16LE(format === 'float' ? 3 : 1, 20);
  header.writeUInt16LE(2, 22);
  header.writeUInt32LE(rateHz, 24);
  header.writeUInt32LE(rateHz * 2 * (bits / 8), 28);
  header.writeUInt16LE(2 * (bits / 8), 32);
  header.writeUInt16LE(bits, 34);
  header.write('data', 36, 'ascii');
  header.writeUInt32LE(dataBytes, 40);
  return header;
}

describe('sidecheck analyze-iq (compiled CLI, synthesized captures)', () => {
  const temp = makeTempFolder('iq');
  const at = (name: string) => path.join(temp.folder, name);
  let truth: Truth;
  let reference: Record<string, unknown>;

  const synthesize = (name: string, extra: string[]) => {
    const run = runCompiledCli(['synthesize', '--out', at(name), '--json', ...extra]);
    expect(run.status).toBe(0);
    return JSON.parse(run.stdout) as { truth: Truth };
  };
  const analyze = (args: string[]) => {
    const run = runCompiledCli(['analyze-iq', ...args, '--json']);
    if (run.status !== 0) throw new Error(run.stderr);
    return JSON.parse(run.stdout) as Record<string, number | string | null> & {
      tones: Array<{ frequencyHz: number; levelDbfs: number }>;
    };
  };

  beforeAll(() => {
    // Two-tone test signal: 700 + 1900 Hz at -12 dBFS each, 1 degree quadrature error,
    // carrier 45 dB and IMD3/IMD5 32/42 dB below the nominal PEP, -95 dBFS noise.
    truth = synthesize('two-tone', [
      '--rate', '48000', '--duration', '2', '--tone', '700:-12', '--tone', '1900:-12',
      '--phase-error-deg', '1', '--carrier-leak-db', '45', '--imd3-db', '32', '--imd5-db', '42',
      '--noise-dbfs', '-95', '--seed', '5', '--center-hz', '2182000',
    ]).truth;
    reference = analyze([at('two-tone.sigmf-meta'), '--full-scale-dbm', '50']);
  }, 180_000);
  afterAll(() => temp.remove());

  it('measures a SigMF two-tone capture to within 0.3 dB of the synthesizer truth', () => {
    const r = reference;
    expect(r).toMatchObject({ sampleRateHz: 48000, sampleCount: 96000, sideband: 'usb' });
    expect(r.format).toBe('sigmf');
    expect(r.centerFrequencyHz).toBe(2182000);
    expect(Math.abs((r.pepDbfs as number) - truth.pepDbfs)).toBeLessThan(TOLERANCE_DB);
    expect(Math.abs((r.meanPowerDbfs as number) - truth.meanPowerDbfs)).toBeLessThan(TOLERANCE_DB);
    const belowPep = (levelDbfs: number) => truth.pepDbfs - levelDbfs;
    const within = (measured: unknown, expected: number) =>
      expect(Math.abs((measured as number) - expected)).toBeLessThan(TOLERANCE_DB);
    within(r.carrierSuppressionDb, belowPep(truth.carrierDbfs));
    const strongest = (order: number) =>
      Math.max(...truth.intermodProducts.filter((p) => p.order === order).map((p) => p.levelDbfs));
    within(r.imd3Db, belowPep(strongest(3)));
    within(r.imd5Db, belowPep(strongest(5)));
    // Phasing-method image relation, g = 1: IRR = cot^2(phi/2) = 41.18 dB for 1 degree.
    within(r.unwantedSidebandSuppressionDb, 41.18);
    for (const audioHz of [700, 1900]) {
      const tone = (r.tones as Array<{ frequencyHz: number; levelDbfs: number }>).find(
        (t) => Math.abs(t.frequencyHz - audioHz) < 2,
      );
      expect(tone).toBeDefined();
      expect(Math.abs(tone!.levelDbfs - -12)).toBeLessThan(TOLERANCE_DB);
    }
  });

  it('adds absolute levels when the full scale is given, and leaves them null otherwise', () => {
    const { pepDbm, pepDbfs, meanPowerDbm, meanPowerDbfs } = reference as Record<string, number>;
    expect(pepDbm).toBeCloseTo(pepDbfs + 50, 9);
    expect(meanPowerDbm).toBeCloseTo(meanPowerDbfs + 50, 9);
    const plain = analyze([at('two-tone.sigmf-meta')]);
    expect(plain.pepDbm).toBeNull();
    expect(plain.pepDbfs).toBe(reference.pepDbfs);
  });

  it('reads two equal tones at the levels of the published PEP and mean-power relations', () => {
    const tones = ['--tone', '1100:-10', '--tone', '1700:-10'];
    synthesize('equal', ['--rate', '48000', '--duration', '1', ...tones]);
    const r = analyze([at('equal.sigmf-meta'), '--full-scale-dbm', '0']);
    // Two tones of -10.00 dBm: PEP = -3.98 dBm (n^2 Pt), mean = -6.99 dBm (n Pt).
    expect(Math.abs((r.pepDbm as number) - -3.98)).toBeLessThan(0.05);
    expect(Math.abs((r.meanPowerDbm as number) - -6.99)).toBeLessThan(0.05);
  });

  it('gives the same answer from the .sigmf-data path, a raw cf32 file and a float WAV', () => {
    const fromData = analyze([at('two-tone.sigmf-data')]);
    expect(fromData.pepDbfs).toBe(reference.pepDbfs);
    const raw = analyze([at('two-tone.sigmf-data'), '--format', 'cf32', '--rate', '48000']);
    expect(raw).toMatchObject({ format: 'cf32', pepDbfs: reference.pepDbfs });
    expect(raw.imd3Db).toBe(reference.imd3Db);
    // Float WAV data is the same interleaved little-endian float32 I/Q as cf32_le.
    const data = fs.readFileSync(at('two-tone.sigmf-data'));
    const header = wavHeader(data.length, 48000, 'float');
    fs.writeFileSync(at('two-tone.wav'), Buffer.concat([header, data]));
    const wav = analyze([at('two-tone.wav')]);
    expect(wav).toMatchObject({ format: 'wav', datatype: 'cf32_le', sampleCount: 96000 });
    expect(wav.carrierSuppressionDb).toBe(reference.carrierSuppressionDb);
  });

  it('measures the same signal stored as ci16 (SigMF and 16-bit PCM WAV) within 0.3 dB', () => {
    synthesize('ci16', [
      '--rate', '48000', '--duration', '2', '--tone', '700:-12', '--tone', '1900:-12',
      '--phase-error-deg', '1', '--carrier-leak-db', '45', '--imd3-db', '32', '--imd5-db', '42',
      '--noise-dbfs', '-95', '--seed', '5', '--datatype', 'ci16_le',
    ]);
    const sigmf = analyze([at('ci16.sigmf-meta')]);
    const data = fs.readFileSync(at('ci16.sigmf-data'));
    fs.writeFileSync(at('ci16.wav'), Buffer.concat([wavHeader(data.length, 48000, 'pcm16'), data]));
    const wav = analyze([at('ci16.wav')]);
    for (const result of [sigmf, wav]) {
      const keys = ['pepDbfs', 'carrierSuppressionDb', 'imd3Db', 'imd5Db'];
      for (const key of [...keys, 'unwantedSidebandSuppressionDb']) {
        const difference = (result[key] as number) - (reference[key] as number);
        expect(Math.abs(difference)).toBeLessThan(TOLERANCE_DB);
      }
    }
    expect(wav.datatype).toBe('ci16_le');
  });

  it('detects a lower-sideband single tone', () => {
    synthesize('lsb', ['--rate', '48000', '--sideband', 'lsb', '--tone', '1000:-6']);
    const r = analyze([at('lsb.sigmf-meta')]);
    expect(r.sideband).toBe('lsb');
    expect(r.imd3Db).toBeNull();
    expect(r.imd5Db).toBeNull();
  });

  describe('bad files: exit 1, one stderr line naming the place', () => {
    const expectInputError = (args: string[], message: RegExp) => {
      const run = runCompiledCli(['analyze-iq', ...args, '--json']);
      expect(run.status).toBe(1);
      expect(run.stdout).toBe('');
      expect(errorLines(run)).toHaveLength(1);
      expect(errorLines(run)[0]).toMatch(message);
      expect(run.stderr).not.toMatch(/\n\s+at /);
    };

    it('a truncated dataset', () => {
      const data = fs.readFileSync(at('two-tone.sigmf-data'));
      fs.writeFileSync(at('cut.sigmf-data'), data.subarray(0, data.length - 3));
      fs.copyFileSync(at('two-tone.sigmf-meta'), at('cut.sigmf-meta'));
      const offset = data.length - 8; // the last whole-sample boundary before the cut
      const message = `cut\\.sigmf-data: .*byte offset ${offset}: data ends inside a sample`;
      expectInputError([at('cut.sigmf-meta')], new RegExp(message));
    });

    it('a NaN sample', () => {
      const data = Buffer.from(fs.readFileSync(at('two-tone.sigmf-data')));
      data.writeFloatLE(NaN, 8 * 1000 + 4);
      fs.writeFileSync(at('nan.sigmf-data'), data);
      fs.copyFileSync(at('two-tone.sigmf-meta'), at('nan.sigmf-meta'));
      expectInputError([at('nan.sigmf-meta')], /byte offset 8004: sample component is NaN/);
    });

    it('metadata with a real-valued datatype, on its line', () => {
      const original = fs.readFileSync(at('two-tone.sigmf-meta'), 'utf8');
      const meta = original.replace('"cf32_le"', '"rf32_le"');
      fs.writeFileSync(at('real.sigmf-meta'), meta);
      fs.copyFileSync(at('two-tone.sigmf-data'), at('real.sigmf-data'));
      const line = meta.split('\n').findIndex((l) => l.includes('core:datatype')) + 1;
      const message = `real\\.sigmf-meta: parseSigmfMeta: line ${line}, .*real-valued`;
      expectInputError([at('real.sigmf-meta')], new RegExp(message));
    });

    it('metadata without its dataset', () => {
      fs.copyFileSync(at('two-tone.sigmf-meta'), at('alone.sigmf-meta'));
      expectInputError([at('alone.sigmf-meta')], /alone\.sigmf-data is missing/);
    });

    it('a WAV whose data size lies', () => {
      const wav = Buffer.from(fs.readFileSync(at('two-tone.wav')));
      wav.writeUInt32LE(wav.readUInt32LE(40) + 800, 40);
      fs.writeFileSync(at('lying.wav'), wav);
      const message = /lying\.wav: parseWavHeader: byte offset 40: chunk "data" claims/;
      expectInputError([at('lying.wav')], message);
    });
  });

  it('refuses a wrong command line with exit 2', () => {
    const noRate = runCompiledCli(['analyze-iq', at('two-tone.sigmf-data'), '--format', 'cf32']);
    expect(noRate.status).toBe(2);
    expect(errorLines(noRate)).toEqual(['sidecheck: --rate HZ is required for a cf32 file']);
    const meta = at('two-tone.sigmf-meta');
    const rateForSigmf = runCompiledCli(['analyze-iq', meta, '--rate', '1000']);
    expect(rateForSigmf.status).toBe(2);
    const sideband = runCompiledCli(['analyze-iq', at('two-tone.sigmf-meta'), '--sideband', 'dsb']);
    const expected = 'sidecheck: --sideband must be one of usb, lsb, auto, got "dsb"';
    expect(errorLines(sideband)).toEqual([expected]);
    fs.writeFileSync(at('mystery.bin'), Buffer.from([1, 2, 3, 4]));
    expect(runCompiledCli(['analyze-iq', at('mystery.bin')]).status).toBe(2);
  });
});
