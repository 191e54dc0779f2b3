import { WINDOW_COEFFICIENTS, windowCoefficients, type WindowName } from './window';
import { windowMetrics } from './window-metrics';

// Reference windows: scipy.signal.get_window(name, 8) (periodic, fftbins=True), SciPy 1.17.1,
// an independent implementation of the same published coefficients.
const SCIPY_8: Record<WindowName, number[]> = {
  hann: [
    0, 0.14644660940672627, 0.5, 0.8535533905932737, 1, 0.8535533905932737, 0.5,
    0.14644660940672627,
  ],
  flattop: [
    -4.2105100000000128e-4, -2.6872193286334545e-2, -5.4736840000000002e-2, 4.4413535728633452e-1,
    1.000000003, 4.4413535728633452e-1, -5.4736840000000002e-2, -2.6872193286334545e-2,
  ],
  blackmanharris: [
    6.0000000000001025e-5, 2.1735837018679628e-2, 2.1747000000000008e-1, 6.9576416298132038e-1, 1,
    6.9576416298132038e-1, 2.1747000000000008e-1, 2.1735837018679628e-2,
  ],
};

describe('windowCoefficients', () => {
  it.each(Object.keys(SCIPY_8) as WindowName[])('matches scipy get_window(%s, 8)', (name) => {
    const w = windowCoefficients(name, 8);
    SCIPY_8[name].forEach((v, k) => expect(w[k]).toBeCloseTo(v, 14));
  });

  it('is periodic: the 2N-point window at even points is the N-point one (definition)', () => {
    const long = windowCoefficients('blackmanharris', 2048);
    const short = windowCoefficients('blackmanharris', 1024);
    short.forEach((v, k) => expect(long[2 * k]).toBeCloseTo(v, 14));
  });

  it('publishes the flat-top coefficients of D’Antona & Ferrero 2006 (MATLAB flattopwin)', () => {
    expect(WINDOW_COEFFICIENTS.flattop).toEqual([
      0.21557895, 0.41663158, 0.277263158, 0.083578947, 0.006947368,
    ]);
  });

  it('rejects unknown names and lengths below 2', () => {
    const hamming = 'hamming' as WindowName;
    expect(() => windowCoefficients(hamming, 8)).toThrow(/^windowCoefficients: unknown window/);
    for (const length of [1, 0, -3, 2.5, NaN]) {
      expect(() => windowCoefficients('hann', length)).toThrow(/^windowCoefficients: length/);
    }
  });
});

describe('windowMetrics', () => {
  // Harris, Proc. IEEE 66(1), 1978, Table 1 (values printed to 2 decimals).
  it('Hann: coherent gain 0.50, ENBW 1.50 bins, scallop loss 1.42 dB (Harris 1978)', () => {
    const m = windowMetrics(windowCoefficients('hann', 4096));
    expect(m.coherentGain).toBeCloseTo(0.5, 12);
    expect(m.enbwBins).toBeCloseTo(1.5, 12);
    expect(m.halfBinResponseDb).toBeCloseTo(-1.42, 2);
  });

  it('4-term Blackman–Harris: CG 0.36, ENBW 2.00 bins, scallop loss 0.83 dB (Harris 1978)', () => {
    const m = windowMetrics(windowCoefficients('blackmanharris', 4096));
    expect(m.coherentGain).toBeCloseTo(0.36, 2);
    expect(m.enbwBins).toBeCloseTo(2.0, 2);
    expect(m.halfBinResponseDb).toBeCloseTo(-0.83, 2);
  });

  it('flat-top: ENBW 3.77 bins and a half-bin response within 0.01 dB', () => {
    // Reference: SciPy 1.17.1 on get_window('flattop', 1024) gives N·Σw²/(Σw)² = 3.7702 and a
    // half-bin response of −0.0098 dB; the closed form (a₀² + Σa_k²/2)/a₀² = 3.7702 agrees.
    const a = WINDOW_COEFFICIENTS.flattop;
    const closedForm = (a[0] ** 2 + a.slice(1).reduce((s, v) => s + v * v / 2, 0)) / a[0] ** 2;
    const m = windowMetrics(windowCoefficients('flattop', 1024));
    expect(m.enbwBins).toBeCloseTo(3.7702, 4);
    expect(m.enbwBins).toBeCloseTo(closedForm, 10);
    expect(m.halfBinResponseDb).toBeCloseTo(-0.0098, 4);
    expect(m.coherentGain).toBeCloseTo(a[0], 10);
  });

  it('rectangular window: ENBW 1 bin, scallop loss 3.92 dB (Harris 1978)', () => {
    const m = windowMetrics(new Float64Array(1024).fill(1));
    expect(m.enbwBins).toBe(1);
    expect(m.halfBinResponseDb).toBeCloseTo(-3.92, 2);
    expect(m.sumOfSquares).toBe(1024);
  });

  it('rejects empty, non-finite and zero-sum windows and non-arrays', () => {
    expect(() => windowMetrics([])).toThrow(/^windowMetrics: the window is empty/);
    expect(() => windowMetrics([1, NaN])).toThrow(/^windowMetrics: window\[1\] is not finite/);
    expect(() => windowMetrics([1, -1])).toThrow(/^windowMetrics: the window must have a positive/);
    expect(() => windowMetrics(3 as unknown as number[])).toThrow(TypeError);
  });
});
