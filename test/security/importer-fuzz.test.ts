/**
 * Fuzzing the importers (shared/import) with fast-check, beyond the per-importer fuzz in
 * shared/import/*.spec.ts (which checks only the error's class on arbitrary input): here the
 * inputs are structured mutations of valid files (a field replaced by a hostile token, rows
 * dropped, repeated or swapped, header fields overwritten with extreme values, truncation,
 * injected NaN/Infinity samples) as well as arbitrary bytes, and every refusal must be the
 * importer's own ImportError WITH a location (line for text, byte offset for binary) — never a
 * TypeError/RangeError from deep inside. Results that come back must be sound: finite, ascending
 * frequencies; a WAV data range inside the file; a positive finite sample rate; finite samples.
 * Seeds are fixed, so a failure replays.
 */
import fc from 'fast-check';
import { ImportError } from '../../shared/import/import-error';
import { parseTraceCsv } from '../../shared/import/parse-trace-csv';
import { parseSigmfMeta } from '../../shared/import/parse-sigmf-meta';
import { parseWavHeader } from '../../shared/import/parse-wav-header';
import { createIqSampleDecoder } from '../../shared/import/iq-sample-decoder';
import { sigmfDatatypeFromName } from '../../shared/import/sigmf-datatype';
import { validTraceRows } from './corpus/trace-csv-files';

/** Runs `parse`; a thrown error must be an ImportError that says where. */
function refusalOrResult<T>(parse: () => T, where: 'line' | 'byteOffset'): T | null {
  try {
    return parse();
  } catch (error) {
    expect(error).toBeInstanceOf(ImportError);
    const location = (error as ImportError)[where];
    if (location === undefined) throw new Error(`ImportError without a ${where}: ${(error as Error).message}`);
    expect(Number.isInteger(location) && location >= 0).toBe(true);
    return null;
  }
}

const HOSTILE_TOKENS = ['NaN', 'Infinity', '-Infinity', '1e999', '-1e999', '', ' ', ',', ';', '\t', '"', '""', '\u0000', '\ufeff', '0x1F', '1e', '--1', '1,5', '١', '\u202e9', '#', '9'.repeat(400), '1e-400', '-0', '+.5', 'null', 'undefined', '[object Object]'];
const token = fc.constantFrom(...HOSTILE_TOKENS);

describe('parseTraceCsv', () => {
  const header = 'frequency_hz,level_dbm';
  const rows = validTraceRows().slice(0, 40);
  /** The valid trace with 1-4 edits: a field replaced by a token, a row dropped, repeated or swapped, text cut short. */
  const mutated = fc
    .array(
      fc.oneof(
        fc.tuple(fc.constant('field' as const), fc.nat(rows.length - 1), fc.nat(1), token),
        fc.tuple(fc.constant('drop' as const), fc.nat(rows.length - 1)),
        fc.tuple(fc.constant('repeat' as const), fc.nat(rows.length - 1)),
        fc.tuple(fc.constant('swap' as const), fc.nat(rows.length - 1), fc.nat(rows.length - 1)),
        fc.tuple(fc.constant('insert' as const), fc.nat(rows.length - 1), fc.string({ maxLength: 30 })),
      ),
      { minLength: 1, maxLength: 4 },
    )
    .chain((edits) =>
      fc.tuple(fc.constant(edits), fc.oneof(fc.constant<number | null>(null), fc.nat(2000))).map(([list, cut]) => {
        const out = [...rows];
        for (const edit of list) {
          const at = Math.min(edit[1], out.length - 1);
          if (out.length === 0) break;
          if (edit[0] === 'field') {
            const fields = out[at].split(',');
            fields[edit[2]] = edit[3];
            out[at] = fields.join(',');
          } else if (edit[0] === 'drop') out.splice(at, 1);
          else if (edit[0] === 'repeat') out.splice(at, 0, out[at]);
          else if (edit[0] === 'swap') [out[at], out[Math.min(edit[2], out.length - 1)]] = [out[Math.min(edit[2], out.length - 1)], out[at]];
          else out.splice(at, 0, edit[2]);
        }
        const text = `${header}\n${out.join('\n')}\n`;
        return cut === null ? text : text.slice(0, cut);
      }),
    );
  const bytesAsText = fc.uint8Array({ maxLength: 400 }).map((b) => Buffer.from(b).toString('utf8'));

  it('returns a sound trace or an ImportError with a line, for mutated and arbitrary input (property)', () => {
    fc.assert(
      fc.property(fc.oneof(mutated, bytesAsText, fc.string({ unit: 'binary', maxLength: 300 }), token.map((t) => `${header}\n${t}`), token.map((t) => `# RBW: ${t} Hz\n${header}\n${rows.join('\n')}\n`), token.map((t) => `frequency_hz,level_dbm,rbw_hz\n1000,-20,${t}\n2000,-30,${t}\n`)), (text) => {
        const trace = refusalOrResult(() => parseTraceCsv(text), 'line');
        if (trace === null) return;
        expect(trace.frequencyHz.length).toBe(trace.levelDbm.length);
        expect(trace.frequencyHz.length).toBeGreaterThanOrEqual(2);
        for (let k = 0; k < trace.frequencyHz.length; k++) {
          expect(Number.isFinite(trace.frequencyHz[k]) && Number.isFinite(trace.levelDbm[k])).toBe(true);
          if (k > 0) expect(trace.frequencyHz[k]).toBeGreaterThan(trace.frequencyHz[k - 1]);
        }
        if (trace.rbwHz !== undefined) expect(Number.isFinite(trace.rbwHz) && trace.rbwHz > 0).toBe(true);
      }),
      { seed: 8_2026, numRuns: 3000 },
    );
  });
});

describe('parseSigmfMeta', () => {
  const valid = { global: { 'core:version': '1.0.0', 'core:datatype': 'cf32_le', 'core:sample_rate': 48000, 'core:description': 'fuzz' }, captures: [{ 'core:sample_start': 0, 'core:frequency': 2182000 }], annotations: [] };
  const hostileJson = fc.constantFrom('NaN', 'Infinity', '1e999', '-1e999', '1e308', '-0', '0', '5e-324', '""', '"cf32_le\\u0000"', 'null', 'true', '[]', '{}', '"48000"', '[' .repeat(3000) + ']'.repeat(3000), '{"__proto__":{"polluted":1}}', '-48000', '"ci16_le"', '"rf32_le"', '"cu8"');
  const paths: string[][] = [['global', 'core:version'], ['global', 'core:datatype'], ['global', 'core:sample_rate'], ['captures', '0', 'core:sample_start'], ['captures', '0', 'core:frequency'], ['captures', '0'], ['captures'], ['global'], ['annotations']];
  const PLACE = '"@@FUZZ@@"';
  const mutated = fc.tuple(fc.constantFrom(...paths), hostileJson, fc.boolean(), fc.oneof(fc.constant<number | null>(null), fc.nat(400))).map(([where, raw, remove, cut]) => {
    const copy = structuredClone(valid) as Record<string, unknown>;
    let target = copy as Record<string, unknown>;
    for (const key of where.slice(0, -1)) target = target[key] as Record<string, unknown>;
    if (remove) delete target[where[where.length - 1]];
    else target[where[where.length - 1]] = '@@FUZZ@@';
    const text = JSON.stringify(copy, null, 1).replace(PLACE, raw);
    return cut === null ? text : text.slice(0, cut);
  });

  it('returns sound metadata or an ImportError with a line, for mutated and arbitrary input (property)', () => {
    expect(Object.prototype.hasOwnProperty.call(Object.prototype, 'polluted')).toBe(false);
    fc.assert(
      fc.property(fc.oneof(mutated, fc.string({ unit: 'binary', maxLength: 200 }), fc.json()), (text) => {
        const meta = refusalOrResult(() => parseSigmfMeta(text), 'line');
        if (meta === null) return;
        expect(Number.isFinite(meta.sampleRateHz) && meta.sampleRateHz > 0).toBe(true);
        expect(meta.datatype.bytesPerSample).toBeGreaterThan(0);
      }),
      { seed: 3_2026, numRuns: 2000 },
    );
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });
});

describe('parseWavHeader', () => {
  /** A canonical 44-byte PCM-16 stereo header (Microsoft RIFF WAVE layout) and 64 frames. */
  function validWav(): Uint8Array {
    const data = 64 * 4;
    const b = Buffer.alloc(44 + data);
    b.write('RIFF', 0, 'ascii');
    b.writeUInt32LE(36 + data, 4);
    b.write('WAVEfmt ', 8, 'ascii');
    b.writeUInt32LE(16, 16);
    b.writeUInt16LE(1, 20);
    b.writeUInt16LE(2, 22);
    b.writeUInt32LE(48000, 24);
    b.writeUInt32LE(48000 * 4, 28);
    b.writeUInt16LE(4, 32);
    b.writeUInt16LE(16, 34);
    b.write('data', 36, 'ascii');
    b.writeUInt32LE(data, 40);
    return new Uint8Array(b);
  }
  const FIELDS: [offset: number, width: 2 | 4][] = [[4, 4], [16, 4], [20, 2], [22, 2], [24, 4], [28, 4], [32, 2], [34, 2], [40, 4]];
  const extreme = fc.oneof(fc.constantFrom(0, 1, 2, 3, 7, 8, 12, 24, 32, 64, 0xfffe, 0xffff, 0x7fffffff, 0xffffffff), fc.nat());
  const mutated = fc.tuple(fc.array(fc.tuple(fc.constantFrom(...FIELDS), extreme), { minLength: 1, maxLength: 3 }), fc.oneof(fc.constant<number | null>(null), fc.nat(300))).map(([edits, cut]) => {
    const bytes = Buffer.from(validWav());
    for (const [[offset, width], value] of edits) {
      if (width === 2) bytes.writeUInt16LE(value & 0xffff, offset);
      else bytes.writeUInt32LE(value >>> 0, offset);
    }
    return new Uint8Array(cut === null ? bytes : bytes.subarray(0, cut));
  });

  it('returns a header whose data lies inside the file, or an ImportError with a byte offset (property)', () => {
    fc.assert(
      fc.property(fc.oneof(mutated, fc.uint8Array({ maxLength: 120 })), fc.oneof(fc.constant(0), fc.nat(1 << 20)), (bytes, extra) => {
        for (const fileLength of [bytes.length, bytes.length + extra]) {
          const header = refusalOrResult(() => parseWavHeader(bytes, fileLength), 'byteOffset');
          if (header === null) continue;
          expect(header.dataOffset + header.dataLengthBytes).toBeLessThanOrEqual(fileLength);
          expect(Number.isFinite(header.sampleRateHz) && header.sampleRateHz > 0).toBe(true);
          expect(header.dataLengthBytes % header.datatype.bytesPerSample).toBe(0);
        }
      }),
      { seed: 7_2026, numRuns: 3000 },
    );
  });
});

describe('I/Q sample decoder', () => {
  it('refuses a NaN or infinite sample injected anywhere with the byte offset of that sample, whatever the chunking (property)', () => {
    const names = ['cf32_le', 'cf32_be', 'cf64_le'];
    fc.assert(
      fc.property(fc.constantFrom(...names), fc.integer({ min: 1, max: 64 }), fc.nat(), fc.constantFrom(NaN, Infinity, -Infinity), fc.array(fc.nat(2000), { maxLength: 5 }), (name, samples, at, bad, rawCuts) => {
        const datatype = sigmfDatatypeFromName(name)!;
        const width = datatype.bytesPerSample / 2;
        const bytes = Buffer.alloc(samples * datatype.bytesPerSample);
        const component = at % (samples * 2);
        const write = (value: number, offset: number) => (width === 4 ? (name.endsWith('be') ? bytes.writeFloatBE(value, offset) : bytes.writeFloatLE(value, offset)) : bytes.writeDoubleLE(value, offset));
        for (let k = 0; k < samples * 2; k++) write(k === component ? bad : 0.25, k * width);
        const cuts = [...new Set(rawCuts.map((c) => c % (bytes.length + 1)))].sort((a, b) => a - b);
        const decoder = createIqSampleDecoder(datatype);
        let caught: unknown;
        try {
          let from = 0;
          for (const cut of [...cuts, bytes.length]) {
            decoder.push(new Uint8Array(bytes.subarray(from, cut)));
            from = cut;
          }
          decoder.finish();
        } catch (error) {
          caught = error;
        }
        expect(caught).toBeInstanceOf(ImportError);
        const sampleStart = Math.floor(component / 2) * datatype.bytesPerSample;
        expect((caught as ImportError).byteOffset).toBeGreaterThanOrEqual(sampleStart);
        expect((caught as ImportError).byteOffset).toBeLessThan(sampleStart + datatype.bytesPerSample);
      }),
      { seed: 5_2026, numRuns: 500 },
    );
  });
});
