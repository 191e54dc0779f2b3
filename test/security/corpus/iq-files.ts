/**
 * Hostile and malformed I/Q recordings: SigMF pairs, WAV files whose headers lie, raw cf32/ci16
 * of odd lengths, and mislabelled files. Built in memory from short valid captures made by the
 * reference synthesizer (one 1 kHz tone, 4096 samples at 48 kHz: 16 KiB as PCM 16, 32 KiB as
 * cf32). Offsets in the canonical 44-byte WAV header (Microsoft RIFF WAVE layout): RIFF size at 4,
 * fmt size 16, format tag 20, channels 22, sample rate 24, byte rate 28, block align 32, bits per
 * sample 34, data size 40. Sample sizes of SigMF datatypes from the SigMF specification.
 */
import { rawIq, sigmfPair, wavIq } from '../../../server/uploads/upload-files.test-support';
import type { HostileFile, HostilePart } from './hostile-file';
import { validTraceCsv } from './trace-csv-files';

const TONE = { sampleRateHz: 48_000, sampleCount: 4096, sideband: 'usb' as const, tones: [{ audioHz: 1000, levelDbfs: -6 }] };
const KB = 1024;

function iq(group: HostileFile['group'], label: string, file: HostilePart, options: { data?: HostilePart; fields?: Record<string, string>; expect?: HostileFile['expect'] } = {}): HostileFile {
  return { label: `${group}: ${label}`, group, file, ...(options.data && { data: options.data }), fields: options.fields ?? {}, caseKind: 'unwanted-sideband', expect: options.expect ?? 'refuse' };
}

/** A copy of `bytes` with a little-endian unsigned field of `width` bytes set at `offset`. */
function patched(bytes: Buffer, offset: number, value: number, width: 2 | 4): Buffer {
  const copy = Buffer.from(bytes);
  if (width === 2) copy.writeUInt16LE(value, offset);
  else copy.writeUInt32LE(value >>> 0, offset);
  return copy;
}

const PNG = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]), Buffer.alloc(200, 7)]);
const PDF = Buffer.from('%PDF-1.7\n1 0 obj << /Type /Catalog >> endobj\n%%EOF\n');
const GZIP = Buffer.from([0x1f, 0x8b, 0x08, 0, 0, 0, 0, 0, 0, 3, 1, 2, 3, 4, 5, 6]);
const ZIP = Buffer.concat([Buffer.from('PK\u0003\u0004', 'latin1'), Buffer.alloc(100, 1)]);
const ELF = Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1, 0]), Buffer.alloc(4088, 0x90)]);

function deepJson(levels: number): string {
  return '['.repeat(levels) + ']'.repeat(levels);
}

export async function iqFileCorpus(): Promise<HostileFile[]> {
  const wav16 = wavIq(TONE, 'pcm16').bytes;
  const wavFloat = wavIq(TONE, 'float32').bytes;
  const { meta, data } = await sigmfPair(TONE);
  const metaJson = JSON.parse(meta.toString('utf8')) as { global: Record<string, unknown>; captures: unknown[] };
  const cf32 = rawIq(TONE, 'cf32_le').bytes;
  const ci16 = rawIq(TONE, 'ci16_le').bytes;
  const metaPart = (bytes: Buffer | string): HostilePart => ({ bytes: Buffer.isBuffer(bytes) ? bytes : Buffer.from(bytes), name: 'capture.sigmf-meta' });
  const dataPart = (bytes: Buffer): HostilePart => ({ bytes, name: 'capture.sigmf-data' });
  const withGlobal = (global: Record<string, unknown>) => JSON.stringify({ ...metaJson, global: { ...metaJson.global, ...global } });
  const sigmf = (label: string, metaText: Buffer | string, samples: Buffer | null = data, expect: HostileFile['expect'] = 'refuse') =>
    iq('sigmf', label, metaPart(metaText), { ...(samples && { data: dataPart(samples) }), expect });
  const wav = (label: string, bytes: Buffer, expect: HostileFile['expect'] = 'refuse') => iq('wav', label, { bytes, name: 'capture.wav', contentType: 'audio/wav' }, { expect });
  const raw = (label: string, format: 'cf32' | 'ci16', bytes: Buffer, fields: Record<string, string> = { sampleRateHz: '48000' }, expect: HostileFile['expect'] = 'refuse') =>
    iq('raw-iq', label, { bytes, name: `capture.${format}` }, { fields: { format, ...fields }, expect });
  const nanSamples = Buffer.alloc(8 * 512);
  for (let k = 0; k < 1024; k++) nanSamples.writeFloatLE(NaN, 4 * k);
  const infSamples = Buffer.from(cf32.subarray(0, 8 * KB));
  infSamples.writeFloatLE(Infinity, 4096);

  const sigmfEntries: HostileFile[] = [
    sigmf('metadata without its data part', meta, null),
    sigmf('data length not a multiple of 8 bytes (cf32_le)', meta, data.subarray(0, data.length - 3)),
    sigmf('data of one byte', meta, Buffer.from([1])),
    sigmf('data of 7 bytes', meta, Buffer.alloc(7, 1)),
    sigmf('ci16_le data of odd length', withGlobal({ 'core:datatype': 'ci16_le' }), ci16.subarray(0, 4097)),
    sigmf('NaN samples', meta, nanSamples),
    sigmf('an infinite sample', meta, infSamples),
    sigmf('unknown datatype cf33_le', withGlobal({ 'core:datatype': 'cf33_le' })),
    sigmf('real datatype rf32_le', withGlobal({ 'core:datatype': 'rf32_le' })),
    sigmf('datatype empty', withGlobal({ 'core:datatype': '' })),
    sigmf('datatype a number', withGlobal({ 'core:datatype': 42 })),
    sigmf('datatype with SQL', withGlobal({ 'core:datatype': "cf32_le'; DROP TABLE uploads; --" })),
    sigmf('sample rate 0', withGlobal({ 'core:sample_rate': 0 })),
    sigmf('sample rate negative', withGlobal({ 'core:sample_rate': -48000 })),
    sigmf('sample rate as a string', withGlobal({ 'core:sample_rate': '48000' })),
    sigmf('sample rate 1e308', withGlobal({ 'core:sample_rate': 1e308 })),
    sigmf('sample rate 1e999 (Infinity after parsing)', withGlobal({ 'core:sample_rate': 48000 }).replace('48000', '1e999')),
    sigmf('sample rate as a bare NaN token', withGlobal({ 'core:sample_rate': 48000 }).replace('48000', 'NaN')),
    sigmf('sample rate of 5e-324 Hz', withGlobal({ 'core:sample_rate': 5e-324 })),
    sigmf('version missing', JSON.stringify({ ...metaJson, global: { ...metaJson.global, 'core:version': undefined } })),
    sigmf('global is an array', JSON.stringify({ ...metaJson, global: [] })),
    sigmf('captures not an array', JSON.stringify({ ...metaJson, captures: {} })),
    sigmf('no global member', JSON.stringify({ captures: [] })),
    sigmf('metadata nested 10,000 levels deep', `{"global": ${deepJson(10_000)}, "captures": []}`),
    sigmf('a capture nested 10,000 levels deep', JSON.stringify({ ...metaJson, captures: ['@'] }).replace('"@"', deepJson(10_000)), data, 'either'),
    sigmf('metadata that is a JSON string', '"global"'),
    sigmf('metadata truncated mid-object', meta.subarray(0, Math.floor(meta.length / 2))),
    sigmf('metadata empty', Buffer.alloc(0)),
    sigmf('metadata with a NUL byte', Buffer.concat([meta.subarray(0, 10), Buffer.from([0]), meta.subarray(10)])),
    sigmf('metadata with __proto__ keys', withGlobal({}).replace('{"global":{', '{"__proto__":{"polluted":"yes"},"global":{"__proto__":{"polluted":"yes"},"constructor":{"prototype":{"polluted":"yes"}},'), data, 'either'),
    sigmf('data part that is a WAV file', meta, wav16),
    { ...sigmf('data part that is text', meta, Buffer.from(validTraceCsv())), cliExpect: 'either' },
    sigmf('data part that is a PNG picture', meta, PNG, 'either'),
    sigmf('a capture whose frequency is 1e999', withGlobal({}).replace('"captures":[', '"captures":[{"core:sample_start":0,"core:frequency":1e999},'), data, 'either'),
    sigmf('data empty', meta, Buffer.alloc(0)),
  ];

  const wavEntries: HostileFile[] = [
    wav('RIFF size twice the file', patched(wav16, 4, wav16.length * 2, 4)),
    wav('RIFF size 0xFFFFFFFF', patched(wav16, 4, 0xffffffff, 4)),
    wav('RIFF size 0', patched(wav16, 4, 0, 4)),
    wav('fmt chunk size 0', patched(wav16, 16, 0, 4)),
    wav('fmt chunk size 0xFFFFFFFF', patched(wav16, 16, 0xffffffff, 4)),
    wav('fmt chunk size 15', patched(wav16, 16, 15, 4)),
    wav('format tag 0', patched(wav16, 20, 0, 2)),
    wav('format tag 2 (ADPCM)', patched(wav16, 20, 2, 2)),
    wav('format tag 0xFFFE without its extension', patched(wav16, 20, 0xfffe, 2)),
    wav('zero channels', patched(wav16, 22, 0, 2)),
    wav('one channel (no Q)', patched(wav16, 22, 1, 2)),
    wav('65535 channels', patched(wav16, 22, 65535, 2)),
    wav('sample rate 0', patched(wav16, 24, 0, 4)),
    wav('sample rate 0xFFFFFFFF', patched(wav16, 24, 0xffffffff, 4)),
    wav('sample rate 1 Hz', patched(wav16, 24, 1, 4)),
    wav('block align 0', patched(wav16, 32, 0, 2)),
    wav('block align 3', patched(wav16, 32, 3, 2)),
    wav('bits per sample 7', patched(wav16, 34, 7, 2)),
    wav('bits per sample 0', patched(wav16, 34, 0, 2)),
    wav('bits per sample 12', patched(wav16, 34, 12, 2)),
    wav('bits per sample 64 as PCM', patched(wav16, 34, 64, 2)),
    wav('data size beyond the file', patched(wav16, 40, wav16.length * 4, 4)),
    wav('data size 0xFFFFFFFF', patched(wav16, 40, 0xffffffff, 4)),
    wav('data size 0', patched(wav16, 40, 0, 4)),
    wav('data size 3 (not a whole frame)', patched(wav16, 40, 3, 4)),
    wav('truncated to 10 bytes', wav16.subarray(0, 10)),
    wav('truncated to 20 bytes', wav16.subarray(0, 20)),
    wav('truncated to the 44-byte header', wav16.subarray(0, 44)),
    wav('truncated one byte into the samples', wav16.subarray(0, 45)),
    wav('just "RIFF"', Buffer.from('RIFF')),
    wav('RIFX (big-endian) signature', Buffer.concat([Buffer.from('RIFX'), wav16.subarray(4)])),
    wav('RIFF of AVI', Buffer.concat([wav16.subarray(0, 8), Buffer.from('AVI '), wav16.subarray(12)])),
    wav('fmt chunk id misspelled', Buffer.concat([wav16.subarray(0, 12), Buffer.from('fmx '), wav16.subarray(16)])),
    wav('data chunk id misspelled (no data chunk)', Buffer.concat([wav16.subarray(0, 36), Buffer.from('dat@'), wav16.subarray(40)])),
    wav('a LIST chunk whose size runs past the end', Buffer.concat([wav16.subarray(0, 36), Buffer.from('LIST'), Buffer.from([0xff, 0xff, 0xff, 0x7f]), wav16.subarray(36)])),
    wav('float32 samples that are NaN', Buffer.concat([wavFloat.subarray(0, 44), Buffer.alloc(wavFloat.length - 44, 0xff)])),
    wav('all samples zero (silence)', Buffer.concat([wav16.subarray(0, 44), Buffer.alloc(wav16.length - 44)])),
    wav('byte rate that disagrees with the rate', patched(wav16, 28, 12345, 4), 'either'),
  ];

  const rawEntries: HostileFile[] = [
    ...[1, 3, 7, 4097, 8 * KB + 5].map((n) => raw(`cf32 of ${n} bytes (not a multiple of 8)`, 'cf32', cf32.subarray(0, n))),
    ...[1, 3, 4095].map((n) => raw(`ci16 of ${n} bytes (not a multiple of 4)`, 'ci16', ci16.subarray(0, n))),
    raw('cf32 of one sample', 'cf32', cf32.subarray(0, 8)),
    raw('cf32 all NaN', 'cf32', nanSamples),
    raw('cf32 with an infinite sample', 'cf32', infSamples),
    raw('cf32 all zero', 'cf32', Buffer.alloc(8 * KB)),
    raw('cf32 without a sample rate', 'cf32', cf32, {}),
    raw('sample rate 0', 'cf32', cf32, { sampleRateHz: '0' }),
    raw('sample rate -48000', 'cf32', cf32, { sampleRateHz: '-48000' }),
    raw('sample rate NaN', 'cf32', cf32, { sampleRateHz: 'NaN' }),
    raw('sample rate Infinity', 'cf32', cf32, { sampleRateHz: 'Infinity' }),
    raw('sample rate 1e999', 'cf32', cf32, { sampleRateHz: '1e999' }),
    raw('sample rate 1e308', 'cf32', cf32, { sampleRateHz: '1e308' }),
    raw('sample rate 0x10', 'cf32', cf32, { sampleRateHz: '0x10' }),
    raw('sample rate with SQL', 'cf32', cf32, { sampleRateHz: "48000' OR 1=1 --" }),
    raw('full scale NaN', 'cf32', cf32, { sampleRateHz: '48000', fullScaleDbm: 'NaN' }),
    raw('sideband in SQL', 'cf32', cf32, { sampleRateHz: '48000', sideband: "usb'; DROP TABLE runs; --" }),
    { ...raw('an unknown field __proto__', 'cf32', cf32, JSON.parse('{"sampleRateHz": "48000", "__proto__": "polluted"}') as Record<string, string>), cliExpect: 'either' },
    raw('an executable sent as cf32', 'cf32', ELF, { sampleRateHz: '48000' }, 'either'),
  ];

  const mislabelled: HostileFile[] = [
    iq('mislabelled', 'a WAV sent as CSV (name and Content-Type)', { bytes: wav16, name: 'trace.csv', contentType: 'text/csv' }),
    iq('mislabelled', 'a WAV with format=trace-csv', { bytes: wav16, name: 'capture.wav' }, { fields: { format: 'trace-csv' } }),
    iq('mislabelled', 'a PNG sent as SigMF metadata', { bytes: PNG, name: 'capture.sigmf-meta', contentType: 'application/json' }, { data: dataPart(data) }),
    iq('mislabelled', 'a PNG with format=sigmf', { bytes: PNG, name: 'picture.png', contentType: 'image/png' }, { fields: { format: 'sigmf' } }),
    iq('mislabelled', 'a CSV trace named .wav', { bytes: Buffer.from(validTraceCsv()), name: 'capture.wav', contentType: 'audio/wav' }),
    { ...iq('mislabelled', 'a CSV trace with format=cf32', { bytes: Buffer.from(validTraceCsv()), name: 'trace.cf32' }, { fields: { format: 'cf32', sampleRateHz: '48000' } }), cliExpect: 'either' },
    iq('mislabelled', 'SigMF metadata named .csv', { bytes: meta, name: 'capture.csv', contentType: 'text/csv' }, { data: dataPart(data) }),
    iq('mislabelled', 'a PDF named .csv', { bytes: PDF, name: 'trace.csv', contentType: 'text/csv' }),
    iq('mislabelled', 'gzip bytes named .csv', { bytes: GZIP, name: 'trace.csv.gz' }),
    iq('mislabelled', 'a ZIP named .sigmf-meta', { bytes: ZIP, name: 'capture.sigmf-meta' }, { data: dataPart(data) }),
    iq('mislabelled', 'raw cf32 without a format field', { bytes: cf32, name: 'capture.bin' }),
    iq('mislabelled', 'the SigMF data part sent as the main file', { bytes: data, name: 'capture.sigmf-data' }),
    { ...iq('mislabelled', 'a WAV with Content-Type text/csv only', { bytes: wav16, name: 'capture', contentType: 'text/csv' }), cliExpect: 'either' },
    iq('mislabelled', 'an unknown format field', { bytes: wav16, name: 'capture.wav' }, { fields: { format: 'mp3' } }),
  ];

  return [...sigmfEntries, ...wavEntries, ...rawEntries, ...mislabelled];
}
