import fc from 'fast-check';
import { detectFileKind } from './detect-file-kind';

const text = (s: string) => new TextEncoder().encode(s);

describe('detectFileKind', () => {
  it('recognises WAV by its RIFF/WAVE signature whatever the name', () => {
    const head = text('RIFF\x24\x00\x00\x00WAVEfmt ');
    expect(detectFileKind('upload.bin', head).kind).toBe('wav');
  });

  it('recognises SigMF metadata by content or by name', () => {
    const meta = text('  {"global": {"core:datatype": "cf32_le"}');
    expect(detectFileKind('x.json', meta).kind).toBe('sigmf-meta');
    expect(detectFileKind('x.sigmf-meta', text('{"captures": []')).kind).toBe('sigmf-meta');
  });

  it('recognises a trace CSV after comment lines', () => {
    const csv = text('# sweep\nfrequency_hz;level_dbm\n1;2\n');
    expect(detectFileKind('t.txt', csv).kind).toBe('trace-csv');
  });

  it('tells binary I/Q by name only and tar archives by ustar at 257', () => {
    const binary = new Uint8Array([0, 1, 2, 250, 3]);
    expect(detectFileKind('a.sigmf-data', binary).kind).toBe('sigmf-data');
    expect(detectFileKind('a.CF32', binary).kind).toBe('raw-cf32');
    expect(detectFileKind('a.cs16', binary).kind).toBe('raw-ci16');
    expect(detectFileKind('a.dat', binary).kind).toBe('unknown');
    const tar = new Uint8Array(512);
    tar.set(text('ustar'), 257);
    expect(detectFileKind('rec.sigmf', tar).kind).toBe('sigmf-archive');
  });

  it('never throws on arbitrary bytes and names (fuzz)', () => {
    fc.assert(
      fc.property(fc.string(), fc.uint8Array({ maxLength: 600 }), (name, bytes) => {
        expect(typeof detectFileKind(name, bytes).reason).toBe('string');
      }),
      { seed: 257, numRuns: 500 },
    );
  });
});
