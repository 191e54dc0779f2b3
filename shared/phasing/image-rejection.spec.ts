import fc from 'fast-check';
import {
  amplitudeImbalanceForSuppressionDb,
  imageRejectionDb,
  imageRejectionSmallErrorDb,
  phaseErrorForSuppressionDeg,
} from './image-rejection';

describe('imageRejectionDb (phasing-method relation, published)', () => {
  it.each([
    // [imbalance dB, phase °, IRR dB] — worked values, common practice
    [0, 1, 41.18],
    [0, 2, 35.16],
    [0.1, 0, 44.8],
    [0.1, 1, 39.61],
    [0.5, 2, 29.46],
  ])('%p dB and %p° → %p dB', (amplitudeImbalanceDb, phaseErrorDeg, db) => {
    expect(imageRejectionDb({ amplitudeImbalanceDb, phaseErrorDeg })).toBeCloseTo(db, 1);
    expect(Math.abs(imageRejectionDb({ amplitudeImbalanceDb, phaseErrorDeg }) - db)).toBeLessThan(
      0.011,
    );
  });

  it('g = 1 reduces to cot²(φ/2) (published special case)', () => {
    for (const deg of [0.3, 1, 5, 30, 89]) {
      const half = (deg * Math.PI) / 360;
      expect(imageRejectionDb({ amplitudeImbalanceDb: 0, phaseErrorDeg: deg })).toBeCloseTo(
        10 * Math.log10(1 / Math.tan(half) ** 2),
        9,
      );
    }
  });

  it('matches the direct formula (1 + 2g cos φ + g²)/(1 − 2g cos φ + g²) for larger errors', () => {
    const g = 10 ** (3 / 20);
    const phi = (20 * Math.PI) / 180;
    const wanted = 1 + 2 * g * Math.cos(phi) + g * g;
    const direct = 10 * Math.log10(wanted / (1 - 2 * g * Math.cos(phi) + g * g));
    expect(imageRejectionDb({ amplitudeImbalanceDb: 3, phaseErrorDeg: 20 })).toBeCloseTo(
      direct,
      10,
    );
  });

  it('agrees with the small-error form 4/(ε² + θ²) within its error order (property, seeded)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -0.5, max: 0.5, noNaN: true }),
        fc.double({ min: -2, max: 2, noNaN: true }),
        (amplitudeImbalanceDb, phaseErrorDeg) => {
          fc.pre(Math.abs(amplitudeImbalanceDb) > 1e-3 || Math.abs(phaseErrorDeg) > 1e-2);
          const errors = { amplitudeImbalanceDb, phaseErrorDeg };
          // leading neglected terms: 20·log10(1 + |ε|/2) for amplitude, ≈ 0.73·θ² dB for phase
          const epsilon = Math.abs(10 ** (amplitudeImbalanceDb / 20) - 1);
          const theta = (phaseErrorDeg * Math.PI) / 180;
          const boundDb = 20 * Math.log10(1 + epsilon / 2) * 1.05 + theta ** 2 + 1e-9;
          expect(
            Math.abs(imageRejectionDb(errors) - imageRejectionSmallErrorDb(errors)),
          ).toBeLessThan(boundDb);
        },
      ),
      { seed: 1173, numRuns: 500 },
    );
  });

  it('agrees with the small-error form to 0.005 dB for very small errors', () => {
    const errors = { amplitudeImbalanceDb: 0.01, phaseErrorDeg: 0.05 };
    expect(imageRejectionDb(errors)).toBeCloseTo(imageRejectionSmallErrorDb(errors), 2);
    expect(Math.abs(imageRejectionDb(errors) - imageRejectionSmallErrorDb(errors))).toBeLessThan(
      0.005,
    );
  });

  it('the sign of either error does not matter, and perfect balance is infinite rejection', () => {
    const a = imageRejectionDb({ amplitudeImbalanceDb: 0.3, phaseErrorDeg: 1.5 });
    expect(imageRejectionDb({ amplitudeImbalanceDb: -0.3, phaseErrorDeg: 1.5 })).toBeCloseTo(a, 10);
    expect(imageRejectionDb({ amplitudeImbalanceDb: 0.3, phaseErrorDeg: -1.5 })).toBeCloseTo(a, 10);
    expect(imageRejectionDb({ amplitudeImbalanceDb: 0, phaseErrorDeg: 0 })).toBe(Infinity);
    expect(imageRejectionSmallErrorDb({ amplitudeImbalanceDb: 0, phaseErrorDeg: 0 })).toBe(
      Infinity,
    );
  });

  it('throws on non-finite errors or |phase| ≥ 180°', () => {
    expect(() => imageRejectionDb({ amplitudeImbalanceDb: NaN, phaseErrorDeg: 0 })).toThrow(
      /^imageRejectionDb: amplitudeImbalanceDb/,
    );
    expect(() => imageRejectionDb({ amplitudeImbalanceDb: 0, phaseErrorDeg: 180 })).toThrow(
      /within ±180°/,
    );
    expect(() =>
      imageRejectionSmallErrorDb({ amplitudeImbalanceDb: 0, phaseErrorDeg: Infinity }),
    ).toThrow(
      /^imageRejectionSmallErrorDb: /,
    );
  });
});

describe('single-error bounds', () => {
  it('invert the worked values: 41.18 dB ↔ 1°, 35.16 dB ↔ 2°, 44.80 dB ↔ 0.1 dB (common practice)', () => {
    expect(phaseErrorForSuppressionDeg(41.18)).toBeCloseTo(1, 2);
    expect(phaseErrorForSuppressionDeg(35.16)).toBeCloseTo(2, 2);
    expect(amplitudeImbalanceForSuppressionDb(44.8)).toBeCloseTo(0.1, 3);
  });

  it('round-trip through imageRejectionDb (property, seeded)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 90, noNaN: true }), (suppressionDb) => {
        const phaseErrorDeg = phaseErrorForSuppressionDeg(suppressionDb);
        expect(imageRejectionDb({ amplitudeImbalanceDb: 0, phaseErrorDeg })).toBeCloseTo(
          suppressionDb,
          7,
        );
        const amplitudeImbalanceDb = amplitudeImbalanceForSuppressionDb(suppressionDb);
        expect(imageRejectionDb({ amplitudeImbalanceDb, phaseErrorDeg: 0 })).toBeCloseTo(
          suppressionDb,
          7,
        );
      }),
      { seed: 90, numRuns: 300 },
    );
  });

  it('0 dB means 90° or infinite imbalance; infinite suppression means no error', () => {
    expect(phaseErrorForSuppressionDeg(0)).toBeCloseTo(90, 12);
    expect(amplitudeImbalanceForSuppressionDb(0)).toBe(Infinity);
    expect(phaseErrorForSuppressionDeg(Infinity)).toBe(0);
    expect(amplitudeImbalanceForSuppressionDb(Infinity)).toBe(0);
  });

  it('throws on a negative or NaN suppression', () => {
    expect(() => phaseErrorForSuppressionDeg(-1)).toThrow(/^phaseErrorForSuppressionDeg: /);
    expect(() => amplitudeImbalanceForSuppressionDb(NaN)).toThrow(
      /^amplitudeImbalanceForSuppressionDb: /,
    );
  });
});
