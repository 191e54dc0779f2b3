import { validationFailed, type FieldError } from '../http/problem';
import type { InstrumentBody } from '../../shared/schemas/instruments';

/**
 * What the schema cannot say about an instrument record: the calibration is not in the future (a
 * certificate reports work already done, common practice) and it falls due after it was done.
 * Throws a 422 listing every field at fault.
 */
export function checkInstrument(body: InstrumentBody, today: string): void {
  const errors: FieldError[] = [];
  if (body.calibratedOn > today) errors.push({ pointer: '/calibratedOn', message: `must not be after today (${today})` });
  if (body.calibrationDue <= body.calibratedOn) errors.push({ pointer: '/calibrationDue', message: `must be after the calibration date (${body.calibratedOn})` });
  if (errors.length) throw validationFailed(`The instrument has ${errors.length} problem${errors.length === 1 ? '' : 's'}: ${errors[0].pointer} ${errors[0].message}.`, errors);
}
