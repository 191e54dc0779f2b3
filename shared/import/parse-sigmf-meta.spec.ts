import fc from 'fast-check';
import { ImportError } from './import-error';
import { parseSigmfMeta } from './parse-sigmf-meta';

// Field names and rules: SigMF specification v1.x, core namespace (global, captures, annotations).
function meta(global: object, captures: object[] = [{ 'core:sample_start': 0 }]): string {
  const base = { 'core:version': '1.0.0', 'core:datatype': 'cf32_le', 'core:sample_rate': 192000 };
  return JSON.stringify({ global: { ...base, ...global }, captures, annotations: [] }, null, 2);
}

function errorOf(text: string): ImportError {
  try {
    parseSigmfMeta(text);
  } catch (error) {
    if (error instanceof ImportError) return error;
    throw error;
  }
  throw new Error('expected an ImportError');
}

describe('parseSigmfMeta', () => {
  it('reads the core fields and ignores annotations and other namespaces', () => {
    const text = meta(
      { 'core:datatype': 'ci16_le', 'core:description': 'two-tone', 'my:gain': 3 },
      [
        { 'core:sample_start': 0, 'core:frequency': 2182000 },
        { 'core:sample_start': 96000 },
      ],
    );
    const parsed = parseSigmfMeta(text);
    expect(parsed.datatype.name).toBe('ci16_le');
    expect(parsed.sampleRateHz).toBe(192000);
    expect(parsed.description).toBe('two-tone');
    expect(parsed.captures).toEqual([
      { sampleStart: 0, frequencyHz: 2182000 },
      { sampleStart: 96000, frequencyHz: null },
    ]);
  });

  it('accepts a byte-order mark before the JSON', () => {
    expect(parseSigmfMeta('\ufeff' + meta({})).version).toBe('1.0.0');
  });

  it('names the line of a JSON syntax error', () => {
    const text = '{\n  "global": {\n    "core:datatype": "cf32_le",\n    "core:sample_rate": ,\n';
    expect(errorOf(text)).toMatchObject({ line: 4, column: 25 });
    expect(errorOf(text).message).toMatch(/^parseSigmfMeta: line 4, column 25: not valid JSON/);
  });

  it.each([
    [{ 'core:datatype': 'rf32_le' }, /real-valued/],
    [{ 'core:datatype': 'cf32' }, /not a SigMF complex datatype/],
    [{ 'core:sample_rate': -1 }, /core:sample_rate/],
    [{ 'core:sample_rate': '48000' }, /core:sample_rate/],
    [{ 'core:version': 1 }, /core:version/],
    [{ 'core:num_channels': 2 }, /multi-channel/],
  ])('refuses global %j on the line of that key', (global, message) => {
    const text = meta(global);
    const key = Object.keys(global)[0];
    const expectedLine = text.split('\n').findIndex((line) => line.includes(`"${key}"`)) + 1;
    const error = errorOf(text);
    expect(error.message).toMatch(message);
    expect(error.line).toBe(expectedLine);
  });

  it('points at the capture that is wrong, not at the first one', () => {
    const text = meta({}, [
      { 'core:sample_start': 0 },
      { 'core:sample_start': 100 },
      { 'core:sample_start': 50 },
    ]);
    const lines = text.split('\n');
    const third = lines.findIndex((line) => line.includes('"core:sample_start": 50')) + 1;
    expect(errorOf(text)).toMatchObject({ line: third });
    expect(errorOf(meta({}, [{ 'core:sample_start': 1.5 }])).message).toMatch(/whole number/);
    expect(errorOf(meta({}, [{ 'core:sample_start': 0, 'core:frequency': 'x' }])).message).toMatch(
      /core:frequency/,
    );
    expect(errorOf(meta({}, [{ 'core:sample_start': 0, 'core:header_bytes': 8 }])).message).toMatch(
      /not supported/,
    );
  });

  it('refuses documents without global or captures', () => {
    expect(errorOf('[]').message).toMatch(/JSON object/);
    expect(errorOf('{"captures": []}').message).toMatch(/"global"/);
    expect(errorOf(JSON.stringify({ global: JSON.parse(meta({})).global })).message).toMatch(
      /"captures"/,
    );
  });

  it('never throws anything but ImportError on arbitrary text (fuzz)', () => {
    const nearlyValid = fc
      .tuple(fc.nat(), fc.string({ maxLength: 3 }))
      .map(([at, insert]) => {
        const text = meta({});
        const k = at % text.length;
        return text.slice(0, k) + insert + text.slice(k + 1);
      });
    fc.assert(
      fc.property(fc.oneof(fc.string(), fc.json(), nearlyValid), (text) => {
        try {
          parseSigmfMeta(text);
        } catch (error) {
          expect(error).toBeInstanceOf(ImportError);
        }
      }),
      { seed: 1157, numRuns: 1000 },
    );
  });
});
