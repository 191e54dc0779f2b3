import { validationFailed } from '../http/problem';
import type { UploadFields, UploadFormat } from '../../shared/schemas/uploads';

/**
 * Refuses parameters that do not fit the file, instead of silently ignoring or overriding: a
 * sample rate is stated only for headerless cf32/ci16 (files with a header state their own, and
 * a second value could disagree), a reference level only for a trace (a capture measures its own
 * PEP and mean), a full-scale level only for a capture (trace levels are already dBm).
 *
 * @throws Problem 422 naming the field.
 */
export function checkUploadFields(format: UploadFormat, fields: UploadFields): void {
  const raw = format === 'cf32' || format === 'ci16';
  const fail = (field: string, message: string) => {
    throw validationFailed(`${message} Nothing was stored.`, [{ pointer: `/${field}`, message }]);
  };
  if (fields.sampleRateHz !== undefined && !raw) fail('sampleRateHz', `sampleRateHz applies to headerless cf32/ci16 samples; this ${format} file states its own rate.`);
  if (fields.sampleRateHz === undefined && raw) fail('sampleRateHz', 'sampleRateHz is required for headerless cf32/ci16 samples.');
  if (fields.referenceDbm !== undefined && format !== 'trace-csv') fail('referenceDbm', 'referenceDbm applies to spectrum traces; an I/Q capture measures its own PEP and mean power.');
  if (fields.fullScaleDbm !== undefined && format === 'trace-csv') fail('fullScaleDbm', 'fullScaleDbm applies to I/Q captures; trace levels are already in dBm.');
}
