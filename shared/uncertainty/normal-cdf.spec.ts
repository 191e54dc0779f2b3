import { falseAcceptProbability } from './false-accept-probability';
import { normalCdf } from './normal-cdf';

/** erf by its Maclaurin series (independent path; accurate to ~1e-15 for |x| ≤ 3). */
function erfSeries(x: number): number {
  let term = x;
  let sum = x;
  for (let n = 1; n < 200; n++) {
    term *= (-x * x) / n;
    sum += term / (2 * n + 1);
  }
  return (2 / Math.sqrt(Math.PI)) * sum;
}

describe('normalCdf (Abramowitz & Stegun 7.1.26, |error| ≤ 7.5e-8)', () => {
  it.each([
    // standard normal table values (A&S Table 26.1, published)
    [0, 0.5],
    [-0.5, 0.308537538725987],
    [-1, 0.158655253931457],
    [-2, 0.0227501319481792],
    [-3, 0.00134989803163009],
    [1.96, 0.97500210485178],
    [1.6448536269514722, 0.95],
    [2.5758293035489, 0.995],
  ])('Φ(%p) = %p', (z, p) => {
    expect(Math.abs(normalCdf(z) - p)).toBeLessThan(7.5e-8);
  });

  it('agrees with a Maclaurin-series erf over −4…4 within the stated bound', () => {
    for (let z = -4; z <= 4; z += 0.01) {
      const reference = 0.5 * (1 + erfSeries(z / Math.SQRT2));
      expect(Math.abs(normalCdf(z) - reference)).toBeLessThan(7.5e-8);
    }
  });

  it('is symmetric, Φ(−z) = 1 − Φ(z), and handles ±Infinity', () => {
    for (const z of [0.1, 0.7, 1.3, 2.2, 4.5]) {
      expect(normalCdf(-z) + normalCdf(z)).toBeCloseTo(1, 15);
    }
    expect(normalCdf(Infinity)).toBe(1);
    expect(normalCdf(-Infinity)).toBe(0);
    expect(() => normalCdf(NaN)).toThrow(/^normalCdf: /);
  });
});

describe('falseAcceptProbability (ILAC-G8:09/2019, JCGM 106:2012 specific risk)', () => {
  const lower = { limit: 40, direction: 'at-least' as const, expandedUncertainty: 1.21 };

  it('at the acceptance limit TL + U with k = 2 the risk is 2.28 % (common practice check)', () => {
    expect(falseAcceptProbability({ ...lower, value: 41.21 })).toBeCloseTo(0.0228, 4);
  });

  it('is 50 % on the limit, and mirrors for an upper limit', () => {
    expect(falseAcceptProbability({ ...lower, value: 40 })).toBeCloseTo(0.5, 7);
    const upper = { limit: -13, direction: 'at-most' as const, expandedUncertainty: 1.21 };
    expect(falseAcceptProbability({ ...upper, value: -14.21 })).toBeCloseTo(0.0228, 4);
  });

  it('uses the stated coverage factor: TL + U at k = 1 is Φ(−1) = 15.87 %', () => {
    const atK1 = { ...lower, value: 41, expandedUncertainty: 1, coverageFactor: 1 };
    expect(falseAcceptProbability(atK1)).toBeCloseTo(0.1587, 4);
  });

  it('throws on zero uncertainty or bad input', () => {
    const base = { ...lower, value: 41 };
    expect(() => falseAcceptProbability({ ...base, expandedUncertainty: 0 })).toThrow(
      /^falseAcceptProbability: expandedUncertainty/,
    );
    expect(() => falseAcceptProbability({ ...base, value: NaN })).toThrow(RangeError);
    expect(() => falseAcceptProbability({ ...base, coverageFactor: 0 })).toThrow(/coverageFactor/);
    const badDirection = { ...base, direction: 'x' as 'at-most' };
    expect(() => falseAcceptProbability(badDirection)).toThrow(/direction/);
  });
});
