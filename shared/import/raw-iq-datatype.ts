import { sigmfDatatypeFromName, type SigmfDatatype } from './sigmf-datatype';

/** Short names accepted for headerless files, and the SigMF type each stands for. */
const RAW_ALIASES: Record<string, string> = { cf32: 'cf32_le', ci16: 'ci16_le' };

/**
 * The decoding description of a headerless interleaved I/Q file. Such a file carries no sample
 * rate or type, so both come from the user; `cf32` means cf32_le and `ci16` means ci16_le (the
 * byte order of every common SDR host), and any SigMF complex name (`ci16_be`, `cu8`...) is
 * accepted too.
 *
 * @param format `cf32`, `ci16` or a SigMF complex datatype name.
 * @param sampleRateHz the rate the user states, finite and > 0.
 * @throws RangeError starting with "rawIqDatatype" for an unknown format or a bad rate (these are
 *   options, not file contents).
 * @example rawIqDatatype('ci16', 192000)
 * // { datatype: { name: 'ci16_le', bytesPerSample: 4, ... }, sampleRateHz: 192000 }
 */
export function rawIqDatatype(
  format: string,
  sampleRateHz: number,
): { datatype: SigmfDatatype; sampleRateHz: number } {
  const datatype = sigmfDatatypeFromName(RAW_ALIASES[format] ?? format);
  if (datatype === undefined) {
    const hint = 'use cf32, ci16 or a SigMF complex type';
    throw new RangeError(`rawIqDatatype: unknown I/Q format "${format}" (${hint})`);
  }
  if (!Number.isFinite(sampleRateHz) || sampleRateHz <= 0) {
    const detail = `sample rate must be a finite number of hertz > 0, got ${sampleRateHz}`;
    throw new RangeError(`rawIqDatatype: ${detail}`);
  }
  return { datatype, sampleRateHz };
}
