import { frequencyErrorHz, frequencyErrorPpm } from './frequency-error';
import { checkFrequencyTolerance } from './frequency-tolerance';
import { j3eCarrierFrequencyHz } from './j3e-carrier-frequency';

describe('frequency error and tolerance', () => {
  it('error = measured − nominal, and 20 Hz at 16.42 MHz is 1.218 ppm (common practice)', () => {
    expect(frequencyErrorHz({ measuredHz: 2_182_012, nominalHz: 2_182_000 })).toBe(12);
    expect(frequencyErrorHz({ measuredHz: 2_181_990, nominalHz: 2_182_000 })).toBe(-10);
    expect(frequencyErrorPpm({ measuredHz: 16_420_020, nominalHz: 16_420_000 })).toBeCloseTo(
      1.218,
      3,
    );
  });

  it('J3E carrier = RF tone − audio tone for USB, + for LSB (common practice)', () => {
    expect(j3eCarrierFrequencyHz({ rfToneHz: 2_183_000, audioToneHz: 1000, sideband: 'usb' })).toBe(
      2_182_000,
    );
    expect(j3eCarrierFrequencyHz({ rfToneHz: 7_099_000, audioToneHz: 1000, sideband: 'lsb' })).toBe(
      7_100_000,
    );
  });

  it('maritime SSB 20 Hz tolerance, 47 CFR 80.209 (published): 20 Hz passes, 20.5 Hz fails', () => {
    expect(checkFrequencyTolerance({ errorHz: -20, toleranceHz: 20 })).toEqual({
      pass: true,
      marginHz: 0,
      absoluteErrorHz: 20,
    });
    const r = checkFrequencyTolerance({ errorHz: 20.5, toleranceHz: 20 });
    expect(r.pass).toBe(false);
    expect(r.marginHz).toBe(-0.5);
  });

  it('a full chain: counted tone → carrier → error → verdict', () => {
    const carrierHz = j3eCarrierFrequencyHz({
      rfToneHz: 4_126_012,
      audioToneHz: 1000,
      sideband: 'usb',
    });
    const errorHz = frequencyErrorHz({ measuredHz: carrierHz, nominalHz: 4_125_000 });
    expect(errorHz).toBe(12);
    expect(checkFrequencyTolerance({ errorHz, toleranceHz: 20 }).marginHz).toBe(8);
  });

  it('throws with the function name', () => {
    expect(() => frequencyErrorHz({ measuredHz: NaN, nominalHz: 1 })).toThrow(
      /^frequencyErrorHz: /,
    );
    expect(() => frequencyErrorPpm({ measuredHz: 1, nominalHz: 0 })).toThrow(
      /^frequencyErrorPpm: nominalHz/,
    );
    expect(() =>
      j3eCarrierFrequencyHz({ rfToneHz: 1e6, audioToneHz: 0, sideband: 'usb' }),
    ).toThrow(/^j3eCarrierFrequencyHz: audioToneHz/);
    expect(() =>
      j3eCarrierFrequencyHz({ rfToneHz: 1e6, audioToneHz: 1, sideband: 'dsb' as 'usb' }),
    ).toThrow(/sideband/);
    expect(() => checkFrequencyTolerance({ errorHz: 1, toleranceHz: -1 })).toThrow(
      /^checkFrequencyTolerance: toleranceHz/,
    );
    expect(() => checkFrequencyTolerance({ errorHz: Infinity, toleranceHz: 1 })).toThrow(
      RangeError,
    );
  });
});
