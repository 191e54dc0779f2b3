import { classifyTraceColumn } from './trace-column';

describe('classifyTraceColumn', () => {
  it.each([
    ['frequency_hz', { role: 'frequency', unit: 'hz', hzPerUnit: 1 }],
    ['Frequency (MHz)', { role: 'frequency', unit: 'mhz', hzPerUnit: 1e6 }],
    ['"freq [kHz]"', { role: 'frequency', unit: 'khz', hzPerUnit: 1e3 }],
    ['GHz', { role: 'frequency', unit: 'ghz', hzPerUnit: 1e9 }],
    ['level_dbm', { role: 'level', unit: 'dbm' }],
    ['Level (dBµV)', { role: 'level', unit: 'dbuv' }],
    ['power W', { role: 'level', unit: 'w' }],
    ['amplitude-mW', { role: 'level', unit: 'mw' }],
    ['dBW', { role: 'level', unit: 'dbw' }],
    ['rbw_hz', { role: 'rbw', unit: 'hz', hzPerUnit: 1 }],
    ['RBW (kHz)', { role: 'rbw', unit: 'khz', hzPerUnit: 1e3 }],
    ['frequency', { role: 'unitless', quantity: 'frequency' }],
    ['level (dBm/Hz)', { role: 'unitless', quantity: 'level' }],
    ['rbw', { role: 'unitless', quantity: 'rbw' }],
    ['index', { role: 'other' }],
    ['time_s', { role: 'other' }],
  ])('%j', (cell, expected) => {
    expect(classifyTraceColumn(cell)).toEqual(expected);
  });
});
