import type { ReportResult } from './report-document';
import { differenceUnit, formatCoverageFactor, resultRowCells, RESULT_COLUMNS } from './result-row';
import { VERDICT_LABELS, verdictLabel } from './verdict-label';

const base: ReportResult = {
  testName: 'Carrier suppression',
  testPoint: '2182 kHz',
  value: 46.314,
  unit: 'dB',
  limit: '\u2265 40 dB below PEP',
  margin: 6.314,
  expandedUncertainty: 1.2061,
  coverageFactor: 2,
  verdict: 'pass',
};

describe('resultRowCells', () => {
  it('prints value, limit, signed margin and U with k in the row unit', () => {
    expect(resultRowCells(base)).toEqual([
      'Carrier suppression',
      '2182 kHz',
      '46.31 dB',
      '\u2265 40 dB below PEP',
      '+6.31 dB',
      '\u00b11.21 dB (k = 2)',
      'Pass',
    ]);
    expect(resultRowCells(base)).toHaveLength(RESULT_COLUMNS.length);
  });

  it('uses one decimals count per row, from the value', () => {
    const obw = { ...base, value: 2376, unit: 'Hz', margin: 624, expandedUncertainty: 40 };
    expect(resultRowCells(obw).slice(2, 6)).toEqual([
      '2376 Hz',
      base.limit,
      '+624 Hz',
      '\u00b140 Hz (k = 2)',
    ]);
  });

  it('writes a negative margin with a true minus sign, and dashes for missing numbers', () => {
    const failing = { ...base, value: 38.5, margin: -1.5, verdict: 'fail' as const };
    expect(resultRowCells(failing)[4]).toBe('\u22121.50 dB');
    const empty = {
      ...base,
      value: null,
      margin: null,
      expandedUncertainty: null,
      coverageFactor: null,
      verdict: 'not-evaluated' as const,
    };
    expect(resultRowCells(empty).slice(2)).toEqual([
      '\u2014',
      base.limit,
      '\u2014',
      '\u2014',
      'Not evaluated',
    ]);
  });

  it('drops the reference of a "dB re X" unit for margin and U (a level difference is plain dB)', () => {
    const imd = {
      ...base,
      value: -31.02,
      unit: 'dB re PEP',
      margin: 2.5,
      expandedUncertainty: 1.5,
    };
    expect(resultRowCells(imd).slice(2, 6)).toEqual([
      '\u221231.02 dB re PEP',
      base.limit,
      '+2.50 dB',
      '\u00b11.50 dB (k = 2)',
    ]);
    expect([differenceUnit('dB re mean'), differenceUnit('dBm'), differenceUnit('Hz')]).toEqual([
      'dB',
      'dBm',
      'Hz',
    ]);
  });

  it('marks notes and external providers (ISO/IEC 17025:2017 7.8.2.1 p)', () => {
    expect(resultRowCells({ ...base, externalProvider: 'Brackwater EMC' }, 2)[1]).toBe(
      '2182 kHz [2] (external: Brackwater EMC)',
    );
  });

  it('prints k without trailing zeros', () => {
    expect(
      [formatCoverageFactor(2), formatCoverageFactor(1.96), formatCoverageFactor(2.0001)],
    ).toEqual([
      '2',
      '1.96',
      '2',
    ]);
  });
});

describe('verdictLabel', () => {
  it('uses the ILAC-G8:09/2019 terms in words', () => {
    expect(VERDICT_LABELS).toEqual({
      pass: 'Pass',
      'conditional-pass': 'Conditional pass',
      'conditional-fail': 'Conditional fail',
      fail: 'Fail',
      'not-evaluated': 'Not evaluated',
    });
    expect(() => verdictLabel('maybe' as 'pass')).toThrow(/^verdictLabel: unknown verdict/);
  });
});
