import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';

/**
 * The browser's side of the server's instrument checks (server/instruments/instrument-checks.ts):
 * a calibration is not dated after today (a certificate reports work already done, common
 * practice), and it falls due after the day it was done. Dates are ISO YYYY-MM-DD, which compare
 * correctly as strings; "today" is the UTC date, as the server judges it (todayIso in
 * server/instruments/calibration-status.ts).
 */

/** Today's date in UTC as YYYY-MM-DD, the calendar the server uses. */
export function todayUtc(now: Date = new Date()): string {
  return now.toISOString().slice(0, 10);
}

/**
 * A date not after `today()` (asked at each validation, so a form left open past midnight UTC
 * judges by the new day). Error: `{ afterToday: { today } }`. An empty value is left to `required`.
 * @example calibratedNotAfterToday(() => '2026-12-05')(new FormControl('2026-12-06')); // { afterToday: { today: '2026-12-05' } }
 */
export function calibratedNotAfterToday(today: () => string = () => todayUtc()): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const value = control.value as string | null;
    if (!value) return null;
    const t = today();
    return value > t ? { afterToday: { today: t } } : null;
  };
}

/**
 * For the due date: later than the sibling control `calibratedOnName` (the same day is refused, as
 * the server does). Error: `{ dueNotAfterCalibration: { calibratedOn } }`. The form must re-run it
 * when the calibration date changes (see InstrumentFormPage); a control's first check runs before
 * it has a parent and so passes, which is why values are set after the form is built.
 * @example dueAfterCalibration() on { calibratedOn: '2026-01-10', calibrationDue: '2026-01-10' } // { dueNotAfterCalibration: { calibratedOn: '2026-01-10' } }
 */
export function dueAfterCalibration(calibratedOnName = 'calibratedOn'): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const due = control.value as string | null;
    const calibratedOn = control.parent?.get(calibratedOnName)?.value as string | null | undefined;
    if (!due || !calibratedOn) return null;
    return due > calibratedOn ? null : { dueNotAfterCalibration: { calibratedOn } };
  };
}
