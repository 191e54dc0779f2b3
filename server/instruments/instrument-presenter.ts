import type { Instrument } from '../db/models';
import type { InstrumentContribution } from '../../shared/schemas/instruments';
import { calibrationStatus } from './calibration-status';

/** An instrument as the API shows it, with its calibration status on `today` (YYYY-MM-DD, UTC). */
export function presentInstrument(i: Instrument, today: string) {
  return {
    id: i.id,
    name: i.name,
    model: i.model,
    serialNumber: i.serialNumber,
    calibratedOn: i.calibratedOn,
    calibrationDue: i.calibrationDue,
    calibrationStatus: calibrationStatus(i.calibrationDue, today),
    certificateRef: i.certificateRef,
    contributions: i.contributions as InstrumentContribution[],
    createdAt: i.createdAt.toISOString(),
    updatedAt: i.updatedAt.toISOString(),
  };
}

/** The record as audited: the stored fields only, without the day-dependent status. */
export function auditedInstrument(i: Instrument) {
  return {
    id: i.id,
    name: i.name,
    model: i.model,
    serialNumber: i.serialNumber,
    calibratedOn: i.calibratedOn,
    calibrationDue: i.calibrationDue,
    certificateRef: i.certificateRef,
    contributions: i.contributions as InstrumentContribution[],
  };
}
