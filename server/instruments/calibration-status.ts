/**
 * Calibration status of an instrument on a given day. ISO/IEC 17025:2017 6.4.7 (calibration
 * programme) and 6.4.9 (equipment out of service), clause wording from memory: equipment past its
 * calibration is not used. The 30-day warning window is common practice (time to book the
 * calibration laboratory).
 */
import type { CalibrationStatus } from '../../shared/schemas/instruments';

/** Days before the due date from which an instrument shows as 'due-soon' (common practice). */
export const CALIBRATION_DUE_SOON_DAYS = 30;

const DAY_MS = 86_400_000;
const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;

function parseIsoDate(fn: string, name: string, dateIso: string): number {
  const ms = ISO_DATE.test(dateIso) ? Date.parse(`${dateIso}T00:00:00Z`) : NaN;
  if (!Number.isFinite(ms) || new Date(ms).toISOString().slice(0, 10) !== dateIso) throw new RangeError(`${fn}: ${name} must be a calendar date YYYY-MM-DD, got '${dateIso}'`);
  return ms;
}

/** Today's date in UTC as YYYY-MM-DD (the server runs and stores dates in UTC). */
export function todayIso(now: Date = new Date()): string {
  return now.toISOString().slice(0, 10);
}

/**
 * The calendar date `days` after `dateIso` (negative goes back), in UTC.
 * Bad input: RangeError starting with the function name.
 * @example addDaysIso('2026-12-01', 30); // '2026-12-31'
 */
export function addDaysIso(dateIso: string, days: number): string {
  if (!Number.isInteger(days)) throw new RangeError(`addDaysIso: days must be a whole number, got ${days}`);
  return new Date(parseIsoDate('addDaysIso', 'dateIso', dateIso) + days * DAY_MS).toISOString().slice(0, 10);
}

/**
 * 'overdue' once today is after the due date (the due date itself is still in calibration),
 * 'due-soon' when the due date is at most CALIBRATION_DUE_SOON_DAYS away, else 'valid'.
 * ISO dates compare correctly as strings once validated.
 * Bad input: RangeError starting with the function name.
 * @example calibrationStatus('2026-12-20', '2026-12-01'); // 'due-soon'
 */
export function calibrationStatus(calibrationDueIso: string, today: string): CalibrationStatus {
  parseIsoDate('calibrationStatus', 'calibrationDueIso', calibrationDueIso);
  parseIsoDate('calibrationStatus', 'today', today);
  if (calibrationDueIso < today) return 'overdue';
  if (calibrationDueIso <= addDaysIso(today, CALIBRATION_DUE_SOON_DAYS)) return 'due-soon';
  return 'valid';
}
