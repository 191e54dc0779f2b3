import fs from 'node:fs/promises';
import path from 'node:path';
import { detectFileKind } from '../../shared/import/detect-file-kind';
import { parseSigmfMeta } from '../../shared/import/parse-sigmf-meta';
import { parseWavHeader } from '../../shared/import/parse-wav-header';
import { rawIqDatatype } from '../../shared/import/raw-iq-datatype';
import type { SigmfDatatype } from '../../shared/import/sigmf-datatype';
import { inFile, inputError, usageError } from './cli-error';

/** Where the samples of a recording are and how to decode them. */
export interface IqSource {
  format: 'sigmf' | 'wav' | 'cf32' | 'ci16';
  dataPath: string;
  datatype: SigmfDatatype;
  sampleRateHz: number;
  dataOffset: number;
  dataLengthBytes: number;
  /** RF centre of the first capture (SigMF core:frequency), when the file says. */
  centerFrequencyHz: number | null;
}

export type IqFormat = IqSource['format'];
const HEAD_BYTES = 64 * 1024;

/**
 * Works out how to read an I/Q recording from its name, first bytes and the user's options.
 * `.sigmf-meta` (or its `.sigmf-data`) -> SigMF pair; RIFF/WAVE -> WAV; raw cf32/ci16 needs
 * `--format` and `--rate`. A stated rate for a file that carries its own is a usage error, not
 * a silent override.
 */
export async function openIqSource(
  file: string,
  options: { format?: IqFormat; rateHz?: number },
): Promise<IqSource> {
  const head = await readHead(file);
  const detected = detectFileKind(file, head).kind;
  const format = options.format ?? guessFormat(detected, file);
  if (format !== 'cf32' && format !== 'ci16' && options.rateHz !== undefined) {
    const detail = `${format} files state their rate`;
    throw usageError(`--rate applies to headerless cf32/ci16 files; ${detail}`);
  }
  if (format === 'sigmf') return openSigmf(file);
  const { size } = await fs.stat(file);
  if (format === 'wav') {
    const header = inFile(file, () => parseWavHeader(head, size));
    const { dataOffset, dataLengthBytes, datatype, sampleRateHz } = header;
    return {
      format,
      dataPath: file,
      datatype,
      sampleRateHz,
      dataOffset,
      dataLengthBytes,
      centerFrequencyHz: null,
    };
  }
  if (options.rateHz === undefined) throw usageError(`--rate HZ is required for a ${format} file`);
  const { datatype, sampleRateHz } = rawIqDatatype(format, options.rateHz);
  return {
    format,
    dataPath: file,
    datatype,
    sampleRateHz,
    dataOffset: 0,
    dataLengthBytes: size,
    centerFrequencyHz: null,
  };
}

function guessFormat(detected: string, file: string): IqFormat {
  if (detected === 'sigmf-meta' || detected === 'sigmf-data') return 'sigmf';
  if (detected === 'wav') return 'wav';
  if (detected === 'raw-cf32') return 'cf32';
  if (detected === 'raw-ci16') return 'ci16';
  if (detected === 'sigmf-archive') {
    throw inputError(`${file}: SigMF archives (.sigmf) must be unpacked first`);
  }
  const hint = 'give --format sigmf|wav|cf32|ci16 (and --rate for raw)';
  throw usageError(`${file}: cannot tell the format; ${hint}`);
}

async function openSigmf(file: string): Promise<IqSource> {
  const base = file.replace(/\.sigmf-(meta|data)$/, '');
  const metaPath = `${base}.sigmf-meta`;
  const dataPath = `${base}.sigmf-data`;
  let metaText: string;
  try {
    metaText = await fs.readFile(metaPath, 'utf8');
  } catch (error) {
    if ((error as { code?: unknown }).code !== 'ENOENT') throw error;
    const missing = path.basename(metaPath);
    throw inputError(`${path.basename(file)}: a SigMF recording is read from its metadata, and ${missing} is missing`);
  }
  const meta = inFile(metaPath, () => parseSigmfMeta(metaText));
  let size: number;
  try {
    size = (await fs.stat(dataPath)).size;
  } catch {
    const missing = path.basename(dataPath);
    throw inputError(`${path.basename(metaPath)}: its dataset ${missing} is missing`);
  }
  return {
    format: 'sigmf',
    dataPath,
    datatype: meta.datatype,
    sampleRateHz: meta.sampleRateHz,
    dataOffset: 0,
    dataLengthBytes: size,
    centerFrequencyHz: meta.captures[0]?.frequencyHz ?? null,
  };
}

async function readHead(file: string): Promise<Uint8Array> {
  const handle = await fs.open(file, 'r');
  try {
    const buffer = new Uint8Array(HEAD_BYTES);
    const { bytesRead } = await handle.read(buffer, 0, HEAD_BYTES, 0);
    return buffer.subarray(0, bytesRead);
  } finally {
    await handle.close();
  }
}
