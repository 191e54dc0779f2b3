/**
 * Files for the upload tests, made in the test from known truth: traces written from chosen
 * lines, I/Q captures from the reference synthesizer (shared/dsp/synthesizer.ts) encoded with the
 * command line's own encoder and SigMF writer (server/cli). Also a request helper for multipart
 * uploads and a listing of the storage folder, to prove a refused upload stored nothing.
 */
import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { Express } from 'express';
import { createSsbSignalStream } from '../../shared/dsp/synthesizer';
import type { SsbSignalSpec, SsbTruth } from '../../shared/dsp/ssb-signal-spec';
import { encodeIqChunk, type WritableDatatype } from '../cli/encode-iq-chunk';
import { writeSigmfPair } from '../cli/write-sigmf-pair';

export const CARRIER_HZ = 2_182_000;
export const db = (p: number) => 10 * Math.log10(p);
/** "dB below PEP" as the synthesizer knows it: against the sampled noiseless crest. */
export const belowCrestDb = (truth: SsbTruth, powerLinear: number) => db(truth.pepLinear / powerLinear);

/** A trace CSV: `frequency_hz,level_dbm`, from carrier + fromHz to carrier + toHz in stepHz, at floorDbm with lines. */
export function traceCsv(options: { fromHz: number; toHz: number; stepHz: number; floorDbm: number; lines: [offsetHz: number, levelDbm: number][]; rbwHz?: number }): Buffer {
  const rows = [`# RBW: ${options.rbwHz ?? 30} Hz`, 'frequency_hz,level_dbm'];
  for (let offset = options.fromHz; offset <= options.toHz; offset += options.stepHz) {
    const line = options.lines.find(([at]) => at === offset);
    rows.push(`${CARRIER_HZ + offset},${line ? line[1] : options.floorDbm}`);
  }
  return Buffer.from(rows.join('\n') + '\n');
}

/** Every chunk of a synthesized capture, and its truth. */
function synthesize(spec: SsbSignalSpec) {
  const stream = createSsbSignalStream(spec, { chunkLength: 1 << 16 });
  const chunks: { i: Float32Array; q: Float32Array }[] = [];
  for (let c = stream.next(); c; c = stream.next()) chunks.push(c);
  return { chunks, truth: stream.truth() };
}

/** A SigMF pair (metadata text and dataset bytes) written by the command line's SigMF writer. */
export async function sigmfPair(spec: SsbSignalSpec, options: { datatype?: WritableDatatype; centerHz?: number } = {}) {
  const { chunks, truth } = synthesize(spec);
  const folder = await fs.mkdtemp(path.join(os.tmpdir(), 'sidecheck-sigmf-'));
  try {
    let k = 0;
    const written = await writeSigmfPair(path.join(folder, 'capture'), { sampleRateHz: spec.sampleRateHz, datatype: options.datatype ?? 'cf32_le', description: 'test capture', centerFrequencyHz: options.centerHz ?? CARRIER_HZ }, () => chunks[k++] ?? null);
    return { meta: await fs.readFile(written.metaPath), data: await fs.readFile(written.dataPath), truth };
  } finally {
    await fs.rm(folder, { recursive: true, force: true });
  }
}

/** Interleaved samples with no header (cf32_le or ci16_le), as an SDR host writes them. */
export function rawIq(spec: SsbSignalSpec, datatype: WritableDatatype) {
  const { chunks, truth } = synthesize(spec);
  return { bytes: Buffer.concat(chunks.map((c) => encodeIqChunk(c.i, c.q, datatype))), truth };
}

/**
 * A two-channel I/Q WAV file: the canonical 44-byte RIFF/WAVE header (Microsoft RIFF WAVE layout:
 * RIFF size at byte 4, fmt chunk at 12, data size at 40) and the samples, I left, Q right.
 */
export function wavIq(spec: SsbSignalSpec, encoding: 'pcm16' | 'float32') {
  const { bytes, truth } = rawIq(spec, encoding === 'pcm16' ? 'ci16_le' : 'cf32_le');
  const bits = encoding === 'pcm16' ? 16 : 32;
  const header = Buffer.alloc(44);
  header.write('RIFF', 0, 'ascii');
  header.writeUInt32LE(36 + bytes.length, 4);
  header.write('WAVEfmt ', 8, 'ascii');
  header.writeUInt32LE(16, 16);
  header.writeUInt16LE(encoding === 'pcm16' ? 1 : 3, 20);
  header.writeUInt16LE(2, 22);
  header.writeUInt32LE(spec.sampleRateHz, 24);
  header.writeUInt32LE(spec.sampleRateHz * 2 * (bits / 8), 28);
  header.writeUInt16LE(2 * (bits / 8), 32);
  header.writeUInt16LE(bits, 34);
  header.write('data', 36, 'ascii');
  header.writeUInt32LE(bytes.length, 40);
  return { bytes: Buffer.concat([header, bytes]), truth };
}

export interface UploadPart {
  bytes: Buffer;
  name: string;
  contentType?: string;
}

/** A multipart POST with files and text fields, as a signed-in person or with an API key. */
export function postFiles(app: Express, url: string, auth: { token?: string; apiKey?: string; org?: string }, parts: { file?: UploadPart; data?: UploadPart; fields?: Record<string, string | number> }) {
  let r = request(app).post(`/api${url}`);
  if (auth.token) r = r.set('Authorization', `Bearer ${auth.token}`);
  if (auth.apiKey) r = r.set('X-Api-Key', auth.apiKey);
  if (auth.org) r = r.set('X-Organization-Id', auth.org);
  for (const [name, value] of Object.entries(parts.fields ?? {})) r = r.field(name, String(value));
  for (const field of ['file', 'data'] as const) {
    const part = parts[field];
    // form-data keeps a `filepath` as given (a `filename` would be cut to its last segment), so a
    // name with folders in it reaches the server as a hostile client would send it.
    if (part) r = r.attach(field, part.bytes, { filepath: part.name, contentType: part.contentType ?? 'application/octet-stream' } as unknown as { filename: string });
  }
  return r;
}

/** Every file under the storage folder (relative paths, sorted); empty folders do not count. */
export async function storedFiles(dataDir: string): Promise<string[]> {
  const entries = await fs.readdir(dataDir, { recursive: true, withFileTypes: true }).catch(() => []);
  return entries.filter((e) => e.isFile()).map((e) => path.relative(dataDir, path.join(e.parentPath, e.name))).sort();
}
