/**
 * The text fields sent beside an uploaded trace or I/Q capture (multipart/form-data), and those
 * of the manufacturer's pre-check. Multipart fields arrive as text: the server turns numeric text
 * into numbers and lower-cases `sideband` first (see server/uploads/upload-fields.ts), then
 * validates against these schemas, so the client's forms and the server agree on the bounds.
 */
import { uuid } from './common';

/** How the bytes are to be read; for headerless cf32/ci16 the rate must be given too. */
export const UPLOAD_FORMATS = ['trace-csv', 'sigmf', 'wav', 'cf32', 'ci16'] as const;
export type UploadFormat = (typeof UPLOAD_FORMATS)[number];

export interface UploadFields {
  /** The format the sender says the file has; the bytes must agree (else 415). */
  format?: UploadFormat;
  /** Sample rate of a headerless cf32/ci16 capture, Hz (files with a header state their own). */
  sampleRateHz?: number;
  /** Carrier frequency on the trace's axis, or RF frequency of a capture's 0 Hz; default: the test case's. */
  centerHz?: number;
  /** Measured reference level of an emission-mask trace (mean power or PEP, as the rule set says), dBm. */
  referenceDbm?: number;
  /** The level that 0 dBFS of a capture corresponds to, dBm. */
  fullScaleDbm?: number;
  /** Sideband of the emission; default: the test case's ('auto' lets the I/Q analysis find it). */
  sideband?: 'usb' | 'lsb' | 'auto';
}

const uploadFieldProperties = {
  format: { enum: UPLOAD_FORMATS },
  sampleRateHz: { type: 'number', exclusiveMinimum: 0, maximum: 1e9 },
  centerHz: { type: 'number', minimum: -1e11, maximum: 1e11 },
  referenceDbm: { type: 'number', minimum: -200, maximum: 120 },
  fullScaleDbm: { type: 'number', minimum: -200, maximum: 120 },
  sideband: { enum: ['usb', 'lsb', 'auto'] },
} as const;

export const uploadFieldsSchema = {
  type: 'object',
  additionalProperties: false,
  properties: uploadFieldProperties,
} as const;

export interface PrecheckFields extends UploadFields {
  /** A built-in sample rule set to check against. */
  ruleSetId: string;
}

export const precheckFieldsSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['ruleSetId'],
  properties: { ...uploadFieldProperties, ruleSetId: uuid },
} as const;

/** The fields that carry numbers (converted from text before validation). */
export const NUMERIC_UPLOAD_FIELDS = ['sampleRateHz', 'centerHz', 'referenceDbm', 'fullScaleDbm'] as const;

/** The notice every pre-check answer carries. */
export const PRECHECK_NOTICE = 'Engineering pre-check: not an accredited result and cannot become a report';
