import { peakOffsetBins } from './peak-interpolation';

describe('peakOffsetBins', () => {
  it.each([-0.4, -0.17, 0, 0.25, 0.49])('is exact for a sampled Gaussian (δ = %f)', (delta) => {
    // ln of a Gaussian is a parabola, so the three-point vertex is exact (Smith, SASP 2011).
    const g = (k: number): number => Math.exp(-((k - delta) ** 2) / 1.7);
    expect(peakOffsetBins(g(-1), g(0), g(1), 'gaussian')).toBeCloseTo(delta, 12);
  });

  it.each([-0.3, 0.1, 0.45])('is exact for a sampled parabola in linear form (δ = %f)', (delta) => {
    const p = (k: number): number => 10 - (k - delta) ** 2;
    expect(peakOffsetBins(p(-1), p(0), p(1), 'parabolic')).toBeCloseTo(delta, 12);
  });

  it('gives 0 for none, flat tops, zero neighbours in log form and non-finite input', () => {
    expect(peakOffsetBins(1, 2, 1.5, 'none')).toBe(0);
    expect(peakOffsetBins(2, 2, 2, 'parabolic')).toBe(0);
    expect(peakOffsetBins(0, 2, 1, 'gaussian')).toBe(0);
    expect(peakOffsetBins(NaN, 2, 1, 'parabolic')).toBe(0);
  });

  it('stays within ±0.5 bin for a true peak and clamps when b is not the peak', () => {
    expect(peakOffsetBins(0, 1.0001, 1, 'parabolic')).toBeLessThanOrEqual(0.5);
    expect(peakOffsetBins(3, 2, 0, 'parabolic')).toBe(-0.5); // unclamped vertex at −1.5
  });
});
