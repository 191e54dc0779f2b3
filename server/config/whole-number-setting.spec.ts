import { wholeNumberSetting } from './whole-number-setting';

/** Settings are read at start-up: a wrong value stops the process with the variable's name (common practice). */
describe('wholeNumberSetting', () => {
  it('takes the fallback when unset or empty, else the number', () => {
    expect(wholeNumberSetting({}, 'PORT', 4610, { min: 0 })).toBe(4610);
    expect(wholeNumberSetting({ PORT: '' }, 'PORT', 4610, { min: 0 })).toBe(4610);
    expect(wholeNumberSetting({ PORT: '8080' }, 'PORT', 4610, { min: 0 })).toBe(8080);
    expect(wholeNumberSetting({ N: '19' }, 'N', 10, { min: 0, max: 19 })).toBe(19);
  });

  it('refuses what is not a whole number within the range, naming the variable and its bounds', () => {
    expect(() => wholeNumberSetting({ PORT: '80.5' }, 'PORT', 1, { min: 0 })).toThrow('config: PORT must be a whole number, got "80.5"');
    expect(() => wholeNumberSetting({ PORT: 'http' }, 'PORT', 1, { min: 0 })).toThrow(/PORT must be a whole number/);
    expect(() => wholeNumberSetting({ MAX: '0' }, 'MAX', 1, { min: 1 })).toThrow('config: MAX must be a whole number above 0, got "0"');
    expect(() => wholeNumberSetting({ N: '20' }, 'N', 10, { min: 0, max: 19 })).toThrow('config: N must be a whole number from 0 to 19, got "20"');
    expect(() => wholeNumberSetting({ N: '-1' }, 'N', 10, { min: 0, max: 19 })).toThrow(/from 0 to 19/);
    expect(() => wholeNumberSetting({ N: '9007199254740993' }, 'N', 1, { min: 0 })).toThrow(/whole number/);
  });
});
