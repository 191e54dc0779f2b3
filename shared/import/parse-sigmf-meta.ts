import { ImportError } from './import-error';
import { jsonSyntaxErrorOffset } from './json-syntax-error-offset';
import { isRealSigmfDatatype, sigmfDatatypeFromName, type SigmfDatatype } from './sigmf-datatype';
import { jsonKeyPosition, lineColumnAt } from './text-position';

/** One SigMF capture segment: where it starts in the dataset and the RF centre it was taken at. */
export interface SigmfCapture {
  sampleStart: number;
  /** `core:frequency` in Hz, or null when the file does not give it. */
  frequencyHz: number | null;
}

/** What this library needs from a `.sigmf-meta` file. */
export interface SigmfMeta {
  version: string;
  datatype: SigmfDatatype;
  sampleRateHz: number;
  captures: SigmfCapture[];
  description: string | null;
}

const NAME = 'parseSigmfMeta';
type JsonObject = Record<string, unknown>;

/**
 * Parses and validates the text of a SigMF metadata file (SigMF specification v1.x, core
 * namespace): `global.core:version` (string), `global.core:datatype` (a complex type, see
 * `sigmfDatatypeFromName`), `global.core:sample_rate` (finite, > 0, Hz), optional
 * `global.core:num_channels` (must be 1), `captures[]` with `core:sample_start` (integer >= 0,
 * strictly ascending) and optional `core:frequency` (finite, Hz). Annotations and other
 * namespaces are ignored. Captures with `core:header_bytes` are refused (not supported).
 *
 * Bad input: throws ImportError with the line and column of the JSON syntax error or of the
 * offending key. A leading byte-order mark is accepted.
 *
 * @example
 * parseSigmfMeta(`{"global": {"core:version": "1.0.0", "core:datatype": "cf32_le",
 *   "core:sample_rate": 48000}, "captures": [{"core:sample_start": 0, "core:frequency": 2182000}],
 *   "annotations": []}`)
 * // { version: '1.0.0', datatype: { name: 'cf32_le', ... }, sampleRateHz: 48000,
 * //   captures: [{ sampleStart: 0, frequencyHz: 2182000 }], description: null }
 */
export function parseSigmfMeta(text: string): SigmfMeta {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  let root: unknown;
  try {
    root = JSON.parse(body);
  } catch {
    const offset = jsonSyntaxErrorOffset(body) ?? 0;
    throw new ImportError(NAME, 'not valid JSON', lineColumnAt(body, offset));
  }
  type Search = { from?: number; occurrence?: number };
  const fail = (key: string, detail: string, search: Search = {}): never => {
    // A missing member is reported where its object starts ("global"), else at the top.
    const position = jsonKeyPosition(body, key, search) ?? jsonKeyPosition(body, 'global') ?? { line: 1, column: 1 };
    const location = { line: position.line, column: position.column };
    throw new ImportError(NAME, detail, location);
  };
  if (!isObject(root)) {
    throw new ImportError(NAME, 'the file must hold a JSON object with "global" and "captures"', {
      line: 1,
      column: 1,
    });
  }
  const global = root['global'];
  if (!isObject(global)) return fail('global', '"global" must be an object');

  const version = global['core:version'];
  if (typeof version !== 'string') {
    return fail('core:version', '"core:version" (string) is required');
  }

  const datatypeName = global['core:datatype'];
  if (typeof datatypeName !== 'string') {
    return fail('core:datatype', '"core:datatype" (string) is required');
  }
  const datatype = sigmfDatatypeFromName(datatypeName);
  if (datatype === undefined) {
    const why = isRealSigmfDatatype(datatypeName)
      ? 'is real-valued; I/Q analysis needs a complex type (cf32_le, ci16_le, cu8, ...)'
      : 'is not a SigMF complex datatype (expected e.g. cf32_le, ci16_le, ci8, cu8)';
    return fail('core:datatype', `"core:datatype" "${datatypeName}" ${why}`);
  }

  const sampleRateHz = global['core:sample_rate'];
  if (typeof sampleRateHz !== 'number' || !Number.isFinite(sampleRateHz) || sampleRateHz <= 0) {
    const detail = '"core:sample_rate" must be a number of samples per second > 0';
    return fail('core:sample_rate', detail);
  }
  const channels = global['core:num_channels'];
  if (channels !== undefined && channels !== 1) {
    const detail = '"core:num_channels" must be 1 (multi-channel files are not supported)';
    return fail('core:num_channels', detail);
  }
  const rawDescription = global['core:description'];
  const description = typeof rawDescription === 'string' ? rawDescription : null;

  const rawCaptures = root['captures'];
  if (!Array.isArray(rawCaptures)) return fail('captures', '"captures" must be an array');
  const captures: SigmfCapture[] = [];
  // Point at the capture's own key: search after "captures", skipping earlier captures' keys.
  const capturesFrom = jsonKeyPosition(body, 'captures')?.offset ?? 0;
  let frequenciesSeen = 0;
  for (const [index, capture] of rawCaptures.entries()) {
    const where = `captures[${index}]`;
    const at = (occurrence: number) => ({ from: capturesFrom, occurrence });
    if (!isObject(capture)) return fail('captures', `${where} must be an object`);
    const sampleStart = capture['core:sample_start'];
    if (typeof sampleStart !== 'number' || !Number.isSafeInteger(sampleStart) || sampleStart < 0) {
      const detail = `${where} "core:sample_start" must be a whole number >= 0`;
      return fail('core:sample_start', detail, at(index));
    }
    const previous = captures[captures.length - 1];
    if (previous !== undefined && sampleStart <= previous.sampleStart) {
      const detail = `${where} "core:sample_start" must be above the previous capture's`;
      return fail('core:sample_start', detail, at(index));
    }
    const frequencyHz = capture['core:frequency'];
    const badFrequency = typeof frequencyHz !== 'number' || !Number.isFinite(frequencyHz);
    if (frequencyHz !== undefined && badFrequency) {
      const detail = `${where} "core:frequency" must be a number of hertz`;
      return fail('core:frequency', detail, at(frequenciesSeen));
    }
    if (frequencyHz !== undefined) frequenciesSeen++;
    if (capture['core:header_bytes'] !== undefined && capture['core:header_bytes'] !== 0) {
      return fail('core:header_bytes', `${where} "core:header_bytes" is not supported`, at(0));
    }
    captures.push({ sampleStart, frequencyHz: frequencyHz ?? null });
  }
  return { version, datatype, sampleRateHz, captures, description };
}

function isObject(value: unknown): value is JsonObject {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}
