import { analyticSignal, realToIq } from './hilbert';

describe('analyticSignal', () => {
  it('analytic([1, 2, 3, 4]) = [1+1j, 2−1j, 3−1j, 4+1j] (scipy.signal.hilbert docs)', () => {
    const z = analyticSignal([1, 2, 3, 4]);
    expect(Array.from(z.i)).toEqual([1, 2, 3, 4]);
    expect(Array.from(z.q)).toEqual([1, -1, -1, 1].map((v) => expect.closeTo(v, 14)));
  });

  it('matches scipy.signal.hilbert at odd and non-power-of-two lengths (no padding)', () => {
    // SciPy 1.17.1: np.imag(scipy.signal.hilbert(x)) for these inputs.
    const odd = analyticSignal([1, 2, 3, 4, 5]).q;
    const oddRef = [1.7013016167040798, -1.3763819204711736, -0.6498393924658127];
    [...oddRef, -1.3763819204711734, 1.70130161670408].forEach((v, k) =>
      expect(odd[k]).toBeCloseTo(v, 13),
    );
    const even = analyticSignal([0.5, -1, 2, 0, 3, 1]).q;
    const evenRef = [1.1547005383792515, -0.8660254037844385, -0.5773502691896257];
    [...evenRef, -0.5773502691896257, -0.5773502691896257, 1.443375672974064].forEach((v, k) =>
      expect(even[k]).toBeCloseTo(v, 13),
    );
  });

  it('turns cos into sin over whole cycles: H{cos} = sin (ideal Hilbert transformer)', () => {
    for (const n of [48, 100, 1024, 999]) {
      const x = Array.from({ length: n }, (_, k) => Math.cos((2 * Math.PI * 7 * k) / n));
      const z = analyticSignal(x);
      z.q.forEach((v, k) => expect(v).toBeCloseTo(Math.sin((2 * Math.PI * 7 * k) / n), 11));
    }
  });

  it('gives x + 0j for one sample and for a constant', () => {
    expect(Array.from(analyticSignal([2.5]).q)).toEqual([0]);
    analyticSignal([3, 3, 3]).q.forEach((v) => expect(v).toBeCloseTo(0, 14));
  });

  it('rejects empty, non-finite and non-array input, naming the function', () => {
    expect(() => analyticSignal([])).toThrow(/^analyticSignal: x is empty/);
    expect(() => analyticSignal([1, NaN])).toThrow(/^analyticSignal: x\[1\] is not finite/);
    expect(() => analyticSignal([Infinity])).toThrow(/^analyticSignal: x\[0\] is not finite/);
    expect(() => analyticSignal(5 as unknown as number[])).toThrow(TypeError);
  });
});

describe('realToIq', () => {
  it('USB keeps positive frequencies (q = H{x}); LSB mirrors them (q = −H{x})', () => {
    const usb = realToIq([1, 2, 3, 4]);
    const lsb = realToIq([1, 2, 3, 4], 'lsb');
    expect(usb.i).toBeInstanceOf(Float32Array);
    expect(Array.from(usb.q)).toEqual([1, -1, -1, 1]);
    expect(Array.from(lsb.q)).toEqual([-1, 1, 1, -1]);
  });

  it('makes a one-sided tone: cos(ωn) → e^(+jωn) for USB', () => {
    const n = 480;
    const x = Array.from({ length: n }, (_, k) => Math.cos((2 * Math.PI * 1000 * k) / 48000));
    const { i, q } = realToIq(x);
    for (let k = 0; k < n; k++) {
      expect(i[k]).toBeCloseTo(Math.cos((2 * Math.PI * 1000 * k) / 48000), 6);
      expect(q[k]).toBeCloseTo(Math.sin((2 * Math.PI * 1000 * k) / 48000), 6);
    }
  });

  it('rejects a bad sideband and bad samples under its own name', () => {
    expect(() => realToIq([1], 'dsb' as 'usb')).toThrow(/^realToIq: sideband/);
    expect(() => realToIq([])).toThrow(/^realToIq: x is empty/);
  });
});
