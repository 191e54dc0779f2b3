/** Storage type of one I or Q component. */
export type SampleComponentType = 'f32' | 'f64' | 'i32' | 'i16' | 'i8' | 'u32' | 'u16' | 'u8';

/**
 * A complex sample format in SigMF notation, with the mapping to full scale 1.0:
 * `value = (raw - offset) * scale`.
 */
export interface SigmfDatatype {
  /** Canonical SigMF name, for example `cf32_le`, `ci16_le`, `cu8`. */
  name: string;
  componentType: SampleComponentType;
  bytesPerComponent: 1 | 2 | 4 | 8;
  /** Bytes of one complex sample (I then Q). */
  bytesPerSample: number;
  littleEndian: boolean;
  isFloat: boolean;
  offset: number;
  scale: number;
}

const COMPONENT_BYTES: Record<SampleComponentType, 1 | 2 | 4 | 8> = {
  f32: 4,
  f64: 8,
  i32: 4,
  i16: 2,
  i8: 1,
  u32: 4,
  u16: 2,
  u8: 1,
};

// SigMF core:datatype grammar (SigMF specification v1.x, "Dataset Format"): complex/real, then
// the component type, then _le/_be for every type wider than one byte.
const DATATYPE_PATTERN = /^(c|r)(f32|f64|i32|i16|i8|u32|u16|u8)(?:_(le|be))?$/;

/**
 * Reads a SigMF `core:datatype` string into a decoding description, or `undefined` when it is
 * not a complex type this library decodes (real-valued types, unknown names, missing or
 * superfluous endianness).
 *
 * Normalization to full scale 1.0 (our choice, stated so captures compare across formats):
 * floats are taken as they are; signed integers of N bits are divided by 2^(N-1) (ci16: v/32768,
 * so -32768 maps to exactly -1); unsigned integers are centred on the midpoint of their code range
 * (cu8: (v - 127.5)/127.5, the usual RTL-SDR convention: no code is exactly zero, and both end
 * codes map to +/-1).
 *
 * @param name the datatype string, e.g. `ci16_le`; case-sensitive as in the specification.
 * @returns the description, or undefined.
 * @example sigmfDatatypeFromName('cu8')
 * // { name: 'cu8', bytesPerSample: 2, offset: 127.5, scale: 1 / 127.5, ... }
 */
export function sigmfDatatypeFromName(name: string): SigmfDatatype | undefined {
  const match = DATATYPE_PATTERN.exec(name);
  if (match === null || match[1] !== 'c') return undefined;
  const componentType = match[2] as SampleComponentType;
  const bytesPerComponent = COMPONENT_BYTES[componentType];
  const endian = match[3];
  if ((bytesPerComponent === 1) !== (endian === undefined)) return undefined;
  const isFloat = componentType[0] === 'f';
  const bits = bytesPerComponent * 8;
  let offset = 0;
  let scale = 1;
  if (componentType[0] === 'i') scale = 1 / 2 ** (bits - 1);
  if (componentType[0] === 'u') {
    offset = (2 ** bits - 1) / 2;
    scale = 1 / offset;
  }
  return {
    name,
    componentType,
    bytesPerComponent,
    bytesPerSample: 2 * bytesPerComponent,
    littleEndian: endian !== 'be',
    isFloat,
    offset,
    scale,
  };
}

/** True when the SigMF datatype is real-valued (`rf32_le`, `ri16_le`...): valid SigMF, not I/Q. */
export function isRealSigmfDatatype(name: string): boolean {
  const match = DATATYPE_PATTERN.exec(name);
  return match !== null && match[1] === 'r';
}
