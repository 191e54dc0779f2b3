/**
 * Compensated (Neumaier) summation: a running sum plus a correction term holding the low-order
 * bits that plain floating-point addition drops. Power sums over long traces (1e5+ bins spanning
 * 100 dB) lose several digits with a naive loop; this keeps the error near one rounding.
 *
 * Source: A. Neumaier, "Rundungsfehleranalyse einiger Verfahren zur Summation endlicher Summen",
 * ZAMM 54 (1974) — the improved Kahan–Babuška algorithm.
 *
 * @example
 * const acc = new CompensatedSum();
 * acc.add(1); acc.add(1e100); acc.add(1); acc.add(-1e100);
 * acc.value; // 2 (a plain loop gives 0)
 */
export class CompensatedSum {
  private sum = 0;
  private correction = 0;

  /** Adds one term. Non-finite terms propagate as in plain addition. */
  add(term: number): void {
    const t = this.sum + term;
    if (Math.abs(this.sum) >= Math.abs(term)) {
      this.correction += this.sum - t + term;
    } else {
      this.correction += term - t + this.sum;
    }
    this.sum = t;
  }

  /** The compensated total so far. */
  get value(): number {
    return this.sum + this.correction;
  }
}

/**
 * Sum of `values` with Neumaier compensation (see {@link CompensatedSum}). An empty input sums
 * to 0. NaN or infinite terms propagate as in plain addition; callers validate first.
 *
 * @example compensatedSum([1, 1e100, 1, -1e100]); // 2
 */
export function compensatedSum(values: ArrayLike<number>): number {
  const acc = new CompensatedSum();
  for (let i = 0; i < values.length; i++) acc.add(values[i]);
  return acc.value;
}
