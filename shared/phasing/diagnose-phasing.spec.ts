import { diagnosePhasing } from './diagnose-phasing';
import { imageRejectionDb, imageRejectionSmallErrorDb } from './image-rejection';

describe('diagnosePhasing', () => {
  it('a 35.16 dB reading is 2° alone (common practice worked value) and misses 40 dB', () => {
    const d = diagnosePhasing({ measuredSuppressionDb: 35.16, requiredDb: 40 });
    expect(d.meetsRequirement).toBe(false);
    expect(d.phaseErrorAloneDeg).toBeCloseTo(2, 2);
    expect(
      imageRejectionDb({ amplitudeImbalanceDb: d.amplitudeImbalanceAloneDb, phaseErrorDeg: 0 }),
    ).toBeCloseTo(35.16, 6);
    expect(d.explanation).toMatch(/does not meet the required 40\.00 dB/);
    expect(d.explanation).toMatch(/2\.00° alone/);
  });

  it('40 dB needs about ≤ 0.1 dB and ≤ 0.8° (common practice), and the pair reaches 40 dB', () => {
    const d = diagnosePhasing({ measuredSuppressionDb: 41, requiredDb: 40 });
    expect(d.meetsRequirement).toBe(true);
    expect(d.tolerancePair.amplitudeImbalanceDb).toBeGreaterThan(0.09);
    expect(d.tolerancePair.amplitudeImbalanceDb).toBeLessThan(0.13);
    expect(d.tolerancePair.phaseErrorDeg).toBeGreaterThan(0.75);
    expect(d.tolerancePair.phaseErrorDeg).toBeLessThan(0.85);
    // independent path: the small-error form also gives ≈ 40 dB for the pair
    expect(imageRejectionSmallErrorDb(d.tolerancePair)).toBeCloseTo(40, 1);
    expect(d.tolerancePairRejectionDb).toBeCloseTo(40, 1);
    expect(d.explanation).toMatch(/Hilbert/);
  });

  it('an infinite reading is explained by no error at all', () => {
    const d = diagnosePhasing({ measuredSuppressionDb: Infinity, requiredDb: 50 });
    expect(d.phaseErrorAloneDeg).toBe(0);
    expect(d.amplitudeImbalanceAloneDb).toBe(0);
    expect(d.meetsRequirement).toBe(true);
  });

  it('throws with the function name', () => {
    expect(() => diagnosePhasing({ measuredSuppressionDb: -3, requiredDb: 40 })).toThrow(
      /^diagnosePhasing: measuredSuppressionDb/,
    );
    expect(() => diagnosePhasing({ measuredSuppressionDb: NaN, requiredDb: 40 })).toThrow(
      RangeError,
    );
    expect(() => diagnosePhasing({ measuredSuppressionDb: 30, requiredDb: 0 })).toThrow(
      /requiredDb/,
    );
    expect(() => diagnosePhasing({ measuredSuppressionDb: 30, requiredDb: Infinity })).toThrow(
      /requiredDb/,
    );
  });
});
