import { FormControl, FormGroup } from '@angular/forms';
import { calibratedNotAfterToday, dueAfterCalibration, todayUtc } from './calibration-dates';

// The rules are the server's (server/instruments/instrument-checks.ts); the dates are invented.
describe('calibration date validators', () => {
  it('takes the UTC calendar date as today, as the server does', () => {
    // 23:30 UTC on 5 December is already 6 December east of Greenwich; the server still says the 5th.
    expect(todayUtc(new Date('2026-12-05T23:30:00Z'))).toBe('2026-12-05');
  });

  it('refuses a calibration after today, and accepts today and earlier', () => {
    const check = calibratedNotAfterToday(() => '2026-12-05');
    expect(check(new FormControl('2026-12-06'))).toEqual({ afterToday: { today: '2026-12-05' } });
    expect(check(new FormControl('2026-12-05'))).toBeNull();
    expect(check(new FormControl('2025-12-05'))).toBeNull();
    expect(check(new FormControl(''))).toBeNull();
  });

  it('asks for today at each check, so a form left open over midnight judges by the new day', () => {
    let today = '2026-12-05';
    const control = new FormControl('2026-12-06', calibratedNotAfterToday(() => today));
    expect(control.valid).toBe(false);
    today = '2026-12-06';
    control.updateValueAndValidity();
    expect(control.valid).toBe(true);
  });

  it('wants the due date after the calibration date; the same day is refused', () => {
    const form = new FormGroup({ calibratedOn: new FormControl('2026-01-10'), calibrationDue: new FormControl('2026-01-10', dueAfterCalibration()) });
    // A control is first validated before it has a parent, so it judges again once in the form.
    form.controls.calibrationDue.updateValueAndValidity();
    expect(form.controls.calibrationDue.errors).toEqual({ dueNotAfterCalibration: { calibratedOn: '2026-01-10' } });
    form.controls.calibrationDue.setValue('2026-01-09');
    expect(form.controls.calibrationDue.errors).toEqual({ dueNotAfterCalibration: { calibratedOn: '2026-01-10' } });
    form.controls.calibrationDue.setValue('2027-01-10');
    expect(form.controls.calibrationDue.errors).toBeNull();
    form.controls.calibratedOn.setValue(null);
    form.controls.calibrationDue.updateValueAndValidity();
    expect(form.controls.calibrationDue.errors).toBeNull();
  });
});
