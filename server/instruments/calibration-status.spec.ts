import { addDaysIso, calibrationStatus, todayIso } from './calibration-status';

describe('calibrationStatus', () => {
  // The 30-day window is common practice; day arithmetic checked against the Gregorian calendar
  // (December has 31 days, 2028 is a leap year).
  it.each([
    ['2026-11-30', '2026-12-01', 'overdue'], // one day past due
    ['2026-12-01', '2026-12-01', 'due-soon'], // due today: still in calibration today
    ['2026-12-31', '2026-12-01', 'due-soon'], // exactly 30 days away
    ['2027-01-01', '2026-12-01', 'valid'], // 31 days away
    ['2028-03-30', '2028-02-29', 'due-soon'], // 30 days after 29 Feb 2028
    ['2028-03-31', '2028-02-29', 'valid'],
  ])('due %s seen on %s is %s', (due, today, expected) => {
    expect(calibrationStatus(due, today)).toBe(expected);
  });

  it.each(['2026-02-30', '2026-1-01', 'tomorrow', ''])('refuses the non-date %j with a RangeError naming the function', (bad) => {
    expect(() => calibrationStatus(bad, '2026-12-01')).toThrow(/^calibrationStatus: /);
    expect(() => calibrationStatus('2026-12-01', bad)).toThrow(RangeError);
  });
});

describe('addDaysIso and todayIso', () => {
  it('crosses month and year ends in UTC (Gregorian calendar)', () => {
    expect(addDaysIso('2026-12-01', 30)).toBe('2026-12-31');
    expect(addDaysIso('2026-12-31', 1)).toBe('2027-01-01');
    expect(addDaysIso('2028-03-01', -1)).toBe('2028-02-29');
    expect(() => addDaysIso('2026-12-01', 0.5)).toThrow(/^addDaysIso: /);
  });

  it('reads the UTC calendar date, not the local one', () => {
    expect(todayIso(new Date('2026-12-01T23:59:59-05:00'))).toBe('2026-12-02');
  });
});
