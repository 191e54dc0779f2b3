/**
 * The printed cells of one result row: test, test point (with note and external-provider marks),
 * measured value with unit, limit, margin, expanded uncertainty with its coverage factor, verdict.
 */
import { defaultDecimals, formatNumber } from '../pdf-kit/format-number';
import type { ReportResult } from './report-document';
import { verdictLabel } from './verdict-label';

/** Column headers matching {@link resultRowCells}. */
export const RESULT_COLUMNS = [
  'Test',
  'Test point',
  'Result',
  'Limit',
  'Margin',
  'U (k)',
  'Verdict',
] as const;

/**
 * Unit of a margin or uncertainty for values in `unit`: a difference of two levels in "dB re X"
 * is plain dB (the reference cancels); other units stay as they are.
 * @example differenceUnit('dB re PEP') // 'dB'
 */
export function differenceUnit(unit: string): string {
  return /^dB\b/.test(unit) ? 'dB' : unit;
}

/** The coverage factor as printed: up to two decimals, no trailing zeros ("2", "1.96"). */
export function formatCoverageFactor(k: number): string {
  return String(Number(k.toFixed(2)));
}

/**
 * Cells for one result. `noteNumber` adds "[n]" to the test point; an external provider adds
 * "(external: name)" (ISO/IEC 17025:2017 7.8.2.1 p). Missing numbers print as an em dash.
 * @example resultRowCells({ value: 46.31, unit: 'dB', margin: 6.31, expandedUncertainty: 1.21,
 *   coverageFactor: 2, verdict: 'pass', ... })
 *   // [..., '46.31 dB', '\u2265 40 dB below PEP', '+6.31 dB', '\u00b11.21 dB (k = 2)', 'Pass']
 */
export function resultRowCells(result: ReportResult, noteNumber?: number): string[] {
  // One decimals count per row (from the value), so value, margin and U line up.
  const reference = result.value ?? result.margin ?? result.expandedUncertainty ?? 0;
  const decimals = result.decimals ?? defaultDecimals(reference);
  const withUnit = (text: string, unit: string) => (unit ? `${text} ${unit}` : text);
  const diffUnit = differenceUnit(result.unit);
  const dash = '\u2014';
  const value =
    result.value === null ? dash : withUnit(formatNumber(result.value, decimals), result.unit);
  const margin =
    result.margin === null
      ? dash
      : withUnit(formatNumber(result.margin, decimals, { signed: true }), diffUnit);
  const u = result.expandedUncertainty;
  const kFactor = result.coverageFactor;
  const k = kFactor === null ? '' : ` (k = ${formatCoverageFactor(kFactor)})`;
  const uncertainty =
    u === null ? dash : `\u00b1${withUnit(formatNumber(u, decimals), diffUnit)}${k}`;
  let testPoint = result.testPoint;
  if (noteNumber !== undefined) testPoint += ` [${noteNumber}]`;
  if (result.externalProvider) testPoint += ` (external: ${result.externalProvider})`;
  const verdict = verdictLabel(result.verdict);
  return [result.testName, testPoint, value, result.limit, margin, uncertainty, verdict];
}
