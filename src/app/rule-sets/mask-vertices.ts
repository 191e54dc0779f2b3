/**
 * The pure side of the emission-mask vertex editor: reading the rows as typed, saying what is
 * wrong with each, sorting them, and the series the plot draws.
 *
 * A vertex is [offsetHz from the assigned frequency (≥ 0), limit dB relative to the mask's
 * reference (≤ 0)]. Offsets must not decrease; two vertices at one offset make a step (as
 * "more than 150 % up to and including 250 %" is written in 47 CFR 80.211(a)); at most two share
 * an offset and there is no step at 0. The same rules as compileEmissionMask in shared/mask and
 * the server's ruleSetBodyProblems, with a message per field for the screen.
 */

/** One row as typed: null where the field is blank or not a number. */
export interface VertexRow {
  offsetHz: number | null;
  relDb: number | null;
}

/** A problem with one field of one row, by row index. */
export interface VertexProblem {
  row: number;
  field: 'offsetHz' | 'relDb' | 'list';
  message: string;
}

/** The rule-set schema's bounds (shared/schemas/rule-set.ts maskVertex, vertices). */
export const MAX_OFFSET_HZ = 1e9;
export const MIN_REL_DB = -300;
export const MIN_VERTICES = 2;
export const MAX_VERTICES = 200;

/**
 * A number from a text field, or null when blank or not a finite number. Accepts a comma as
 * the decimal mark and a leading Unicode minus (U+2212). Never throws.
 * @example parseVertexNumber('−28,5'); // -28.5
 */
export function parseVertexNumber(text: string | number | null | undefined): number | null {
  if (typeof text === 'number') return Number.isFinite(text) ? text : null;
  const cleaned = String(text ?? '').trim().replace(/\u2212/g, '-').replace(',', '.');
  if (cleaned === '' || !/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(cleaned)) return null;
  const n = Number(cleaned);
  return Number.isFinite(n) ? n : null;
}

/**
 * Every problem with the rows, in row order; [] when they make a valid mask. Never throws.
 * @example vertexProblems([{ offsetHz: 1500, relDb: 0 }, { offsetHz: 1000, relDb: -28 }])
 * // [{ row: 1, field: 'offsetHz', message: 'Must not be below the previous offset (1500 Hz).' }]
 */
export function vertexProblems(rows: readonly VertexRow[]): VertexProblem[] {
  const problems: VertexProblem[] = [];
  let previous: number | null = null;
  let atPrevious = 0;
  rows.forEach((r, row) => {
    if (r.offsetHz === null) problems.push({ row, field: 'offsetHz', message: 'Enter the offset in Hz.' });
    else if (r.offsetHz < 0) problems.push({ row, field: 'offsetHz', message: 'Offsets are measured from the assigned frequency: 0 Hz or more.' });
    else if (r.offsetHz > MAX_OFFSET_HZ) problems.push({ row, field: 'offsetHz', message: 'At most 1 GHz.' });
    else if (previous !== null && r.offsetHz < previous) problems.push({ row, field: 'offsetHz', message: `Must not be below the previous offset (${previous} Hz).` });
    else if (previous !== null && r.offsetHz === previous && atPrevious === 2) problems.push({ row, field: 'offsetHz', message: `A third vertex at ${previous} Hz: a step has two.` });
    else if (previous !== null && r.offsetHz === previous && r.offsetHz === 0) problems.push({ row, field: 'offsetHz', message: 'A step at 0 Hz means nothing: start the mask with one vertex there.' });
    if (r.relDb === null) problems.push({ row, field: 'relDb', message: 'Enter the limit in dB.' });
    else if (r.relDb > 0) problems.push({ row, field: 'relDb', message: 'Limits are below the reference: 0 dB or less.' });
    else if (r.relDb < MIN_REL_DB) problems.push({ row, field: 'relDb', message: 'At least −300 dB.' });
    if (r.offsetHz !== null && r.offsetHz >= 0 && (previous === null || r.offsetHz >= previous)) {
      atPrevious = r.offsetHz === previous ? atPrevious + 1 : 1;
      previous = r.offsetHz;
    }
  });
  if (rows.length < MIN_VERTICES) problems.push({ row: rows.length, field: 'list', message: `A mask needs at least ${MIN_VERTICES} vertices.` });
  if (rows.length > MAX_VERTICES) problems.push({ row: MAX_VERTICES, field: 'list', message: `At most ${MAX_VERTICES} vertices.` });
  return problems;
}

/**
 * The indices of the rows in offset order; rows at the same offset keep their order (it says
 * which side of a step is which), and rows without an offset go last. Never throws.
 * @example vertexSortOrder([{ offsetHz: 4500, relDb: -35 }, { offsetHz: 1500, relDb: 0 }]); // [1, 0]
 */
export function vertexSortOrder(rows: readonly VertexRow[]): number[] {
  return rows.map((_, i) => i).sort((a, b) => (rows[a].offsetHz ?? Infinity) - (rows[b].offsetHz ?? Infinity) || a - b);
}

/**
 * The rows themselves in that order, as a new array.
 * @example sortedVertexRows([{ offsetHz: 4500, relDb: -35 }, { offsetHz: 1500, relDb: 0 }])
 * // [{ offsetHz: 1500, relDb: 0 }, { offsetHz: 4500, relDb: -35 }]
 */
export function sortedVertexRows(rows: readonly VertexRow[]): VertexRow[] {
  return vertexSortOrder(rows).map((i) => rows[i]);
}

/**
 * The rows as the rule set stores them, or null while any row has a problem.
 * @example maskVertices([{ offsetHz: 0, relDb: 0 }, { offsetHz: 3000, relDb: -28 }]); // [[0, 0], [3000, -28]]
 */
export function maskVertices(rows: readonly VertexRow[]): [number, number][] | null {
  if (vertexProblems(rows).length) return null;
  return rows.map((r) => [r.offsetHz!, r.relDb!]);
}
