import { levelToDbm, normalizeUnit } from './trace-units';

describe('levelToDbm', () => {
  // dBm = 10 log10(P / 1 mW) (definition); dBW = dBm - 30; 60 dBuV into 50 ohm = -46.99 dBm
  // (dBuV = dBm + 107 at 50 ohm, to 0.01 dB: 10 log10(1e-12 / 50 / 1e-3) = -106.99).
  it.each([
    [-20, 'dbm', -20, 12],
    [-30, 'dbw', 0, 12],
    [60, 'dbuv', -46.99, 2],
    [107, 'dbuv', 0.01, 2],
    [1, 'w', 30, 12],
    [0.1, 'w', 20, 12],
    [1, 'mw', 0, 12],
    [1e-3, 'mw', -30, 12],
  ] as const)('%d %s is %d dBm', (value, unit, dbm, digits) => {
    expect(levelToDbm(value, unit)).toBeCloseTo(dbm, digits);
  });

  it('gives NaN for linear powers that have no dBm value', () => {
    expect(levelToDbm(0, 'w')).toBeNaN();
    expect(levelToDbm(-1, 'mw')).toBeNaN();
  });
});

describe('normalizeUnit', () => {
  it.each([
    [' dBµV ', 'dbuv'],
    ['dBμV', 'dbuv'],
    ['dB(uV)', 'dbuv'],
    ['dBmicroVolt', 'dbuv'],
    ['MHz', 'mhz'],
    ['d B m', 'dbm'],
  ])('%j -> %j', (unit, normalized) => {
    expect(normalizeUnit(unit)).toBe(normalized);
  });
});
