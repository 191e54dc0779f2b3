import fc from 'fast-check';
import { hzToPpm, ppmToHz } from './ppm';

describe('ppm ↔ Hz', () => {
  it('20 Hz at 16.42 MHz is 1.218 ppm (common practice arithmetic)', () => {
    expect(hzToPpm(20, 16.42e6)).toBeCloseTo(1.218, 3);
  });

  it('1 ppm of 10 MHz is 10 Hz and the sign is kept (definition)', () => {
    expect(ppmToHz(1, 10e6)).toBeCloseTo(10, 12);
    expect(hzToPpm(-5, 5e6)).toBeCloseTo(-1, 12);
  });

  it('round-trips (property, seeded)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e4, max: 1e4, noNaN: true }),
        fc.double({ min: 1e3, max: 3e10, noNaN: true }),
        (offsetHz, frequencyHz) => {
          expect(ppmToHz(hzToPpm(offsetHz, frequencyHz), frequencyHz)).toBeCloseTo(offsetHz, 6);
        },
      ),
      { seed: 7, numRuns: 200 },
    );
  });

  it('throws on a zero or negative frequency and on non-finite values', () => {
    expect(() => hzToPpm(1, 0)).toThrow(/^hzToPpm: frequencyHz/);
    expect(() => hzToPpm(NaN, 1e6)).toThrow(/^hzToPpm: offsetHz/);
    expect(() => ppmToHz(1, -1)).toThrow(/^ppmToHz: frequencyHz/);
    expect(() => ppmToHz(Infinity, 1e6)).toThrow(RangeError);
  });
});
