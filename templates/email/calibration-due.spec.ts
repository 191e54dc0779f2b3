import { calibrationDueEmail, type CalibrationDueInstrument } from './calibration-due';

const meter: CalibrationDueInstrument = { name: 'RF power meter', model: 'PM-20', serialNumber: 'PM-0007', calibrationDue: '2026-12-20', overdue: false };
const analyser: CalibrationDueInstrument = { name: 'Spectrum analyser 1', model: 'SA-3', serialNumber: 'SA-0101', calibrationDue: '2026-11-30', overdue: true };
const base = { adminName: 'Ada Admin', labName: 'Harbour RF Lab', equipmentUrl: 'http://127.0.0.1:4610/equipment' };

describe('calibrationDueEmail', () => {
  it('lists each instrument with its serial number and due date, and links to the register', () => {
    const mail = calibrationDueEmail({ ...base, instruments: [meter, analyser] });
    expect(mail.subject).toBe('Calibration overdue at Harbour RF Lab: 2 instruments');
    expect(mail.text).toContain('RF power meter, PM-20, s/n PM-0007: due 2026-12-20');
    expect(mail.text).toContain('Spectrum analyser 1, SA-3, s/n SA-0101: overdue, was due 2026-11-30');
    expect(mail.text).toContain('http://127.0.0.1:4610/equipment');
    expect(mail.html).toContain('href="http://127.0.0.1:4610/equipment"');
    expect(mail.html).toContain('s/n PM-0007: due 2026-12-20');
  });

  it('names a single instrument in the subject, and says "due soon" when none is overdue', () => {
    const mail = calibrationDueEmail({ ...base, instruments: [meter] });
    expect(mail.subject).toBe('Calibration due soon at Harbour RF Lab: RF power meter (s/n PM-0007)');
    expect(mail.text).toContain('One instrument of Harbour RF Lab falls due');
  });
});
