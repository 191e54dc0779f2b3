/**
 * Renders rows of [label, value] as two aligned text columns, for the human-readable output.
 * Numbers are shown with `digits` decimals; null as "n/a" (a quantity the input cannot give).
 *
 * @example formatTable([['PEP', -3.98, 'dBFS']]) // "PEP  -3.98 dBFS\n"
 */
export function formatTable(
  rows: ReadonlyArray<readonly [label: string, value: number | string | null, unit?: string]>,
  digits = 2,
): string {
  const width = Math.max(...rows.map(([label]) => label.length));
  return rows
    .map(([label, value, unit]) => {
      const shown =
        value === null ? 'n/a' : typeof value === 'number' ? formatNumber(value, digits) : value;
      const suffix = unit !== undefined && value !== null ? ` ${unit}` : '';
      return `${label.padEnd(width)}  ${shown}${suffix}`;
    })
    .join('\n')
    .concat('\n');
}

function formatNumber(value: number, digits: number): string {
  if (!Number.isFinite(value)) return String(value);
  return Number.isInteger(value) && Math.abs(value) >= 1000 ? String(value) : value.toFixed(digits);
}

/**
 * JSON.stringify that keeps the output valid JSON for non-finite numbers: NaN becomes null and
 * +/-Infinity become the strings "Infinity"/"-Infinity" (JSON has no such numbers).
 */
export function toJsonLine(value: unknown): string {
  return `${JSON.stringify(value, (_, v: unknown) =>
    typeof v === 'number' && !Number.isFinite(v) ? (Number.isNaN(v) ? null : String(v)) : v,
  )}\n`;
}
