import FFT from 'fft.js';

/** An interleaved complex buffer [re₀, im₀, re₁, im₁, …]. */
export type ComplexBuffer = number[] | Float64Array;

/** The one-point DFT is the identity. */
function copyPair(input: ComplexBuffer, output: ComplexBuffer): void {
  output[0] = input[0];
  output[1] = input[1];
}

/**
 * Complex forward and inverse discrete Fourier transforms of power-of-two size, a typed wrapper
 * on the radix-4 npm package fft.js. The twiddle and bit-reversal tables are built once per size
 * (see {@link complexFftOfSize}) and every transform writes into a caller-provided buffer, so a
 * hot loop such as a Welch average allocates nothing.
 *
 *   forward: X[k] = Σₙ x[n]·e^(−j2πkn/N)        inverse: x[n] = (1/N)·Σₖ X[k]·e^(+j2πkn/N)
 *
 * Source: the DFT definition (as numpy.fft and scipy.fft: no scaling forward, 1/N inverse).
 * Layout: "interleaved" buffers hold [re₀, im₀, re₁, im₁, …] (length 2N); "split" buffers hold
 * real and imaginary parts in two arrays of length N. Interleaved buffers may be Float64Arrays or
 * plain number arrays; plain arrays from {@link ComplexFft.createBuffer} are the fastest here
 * (fft.js is tuned for them: a 16384-point Welch loop measured ~10 % faster than on
 * Float64Arrays), and one process should stick to one kind so V8 keeps the code monomorphic.
 * Domain: N a power of two, 1 ≤ N ≤ 2³⁰. Bad input: a size that is not a power of two, or buffers
 * of the wrong length, or the same buffer as input and output, throw a RangeError starting with
 * the method's name. Non-finite samples propagate as NaN (no check in the hot path).
 *
 * @example
 * const fft = new ComplexFft(4);
 * const out = new Float64Array(8);
 * fft.forward(Float64Array.of(1, 0, 2, 0, 3, 0, 4, 0), out);
 * // out = [10, 0, -2, 2, -2, 0, -2, -2]
 */
export class ComplexFft {
  readonly size: number;
  private readonly engine: FFT | null;
  private split: { input: number[]; output: number[] } | null = null;

  constructor(size: number) {
    if (!isPowerOfTwo(size)) {
      throw new RangeError(`ComplexFft: size must be a power of two from 1 to 2^30, got ${size}`);
    }
    this.size = size;
    // fft.js rejects size 1; the one-point DFT is the identity.
    this.engine = size > 1 ? new FFT(size) : null;
  }

  /** A zeroed interleaved buffer of length 2N, as a plain array of numbers (fast to make). */
  createBuffer(): number[] {
    return new Array<number>(2 * this.size).fill(0);
  }

  /** Forward transform of interleaved `input` into interleaved `output` (both length 2N). */
  forward(input: ComplexBuffer, output: ComplexBuffer): void {
    this.check('forward', input, output);
    if (this.engine === null) copyPair(input, output);
    else this.engine.transform(output, input);
  }

  /** Inverse transform (with the 1/N factor) of interleaved `input` into `output`. */
  inverse(input: ComplexBuffer, output: ComplexBuffer): void {
    this.check('inverse', input, output);
    if (this.engine === null) copyPair(input, output);
    else this.engine.inverseTransform(output, input);
  }

  /**
   * Forward transform of split data: (re, im) of length N into (outRe, outIm) of length N.
   * Uses two internal interleaved buffers, made on first use (JavaScript is single-threaded,
   * so sharing the instance is safe).
   */
  forwardSplit(
    re: ArrayLike<number>,
    im: ArrayLike<number>,
    outRe: Float64Array,
    outIm: Float64Array,
  ): void {
    const n = this.size;
    if (re.length !== n || im.length !== n || outRe.length !== n || outIm.length !== n) {
      throw new RangeError(`ComplexFft.forwardSplit: every array must have length ${n}`);
    }
    this.split ??= { input: this.createBuffer(), output: this.createBuffer() };
    const a = this.split.input;
    const b = this.split.output;
    for (let k = 0; k < n; k++) {
      a[2 * k] = re[k];
      a[2 * k + 1] = im[k];
    }
    this.forward(a, b);
    for (let k = 0; k < n; k++) {
      outRe[k] = b[2 * k];
      outIm[k] = b[2 * k + 1];
    }
  }

  private check(method: string, input: ComplexBuffer, output: ComplexBuffer): void {
    const len = 2 * this.size;
    if (input.length !== len || output.length !== len) {
      throw new RangeError(`ComplexFft.${method}: buffers must have length ${len} (2 × size)`);
    }
    if (input === output) {
      throw new RangeError(`ComplexFft.${method}: input and output must be different buffers`);
    }
  }
}

/** True for 1, 2, 4, … 2³⁰. */
export function isPowerOfTwo(n: number): boolean {
  return Number.isInteger(n) && n >= 1 && n <= 2 ** 30 && (n & (n - 1)) === 0;
}

const cache = new Map<number, ComplexFft>();

/** Sizes up to this are kept once built (Welch segment lengths); larger ones are not. */
export const CACHED_FFT_MAX_SIZE = 2 ** 17;

/**
 * The shared {@link ComplexFft} of a size, built on first use and kept, so the tables are
 * reused across calls (a 16384-point table is 256 kB; a process uses only a few sizes). Sizes
 * above {@link CACHED_FFT_MAX_SIZE} (one-off whole-record transforms, whose tables run to tens
 * of megabytes) are built fresh each call and left to the garbage collector.
 * Bad input: as the ComplexFft constructor.
 * @example complexFftOfSize(1024) === complexFftOfSize(1024); // true
 */
export function complexFftOfSize(size: number): ComplexFft {
  let fft = cache.get(size);
  if (fft === undefined) {
    fft = new ComplexFft(size);
    if (size <= CACHED_FFT_MAX_SIZE) cache.set(size, fft);
  }
  return fft;
}
