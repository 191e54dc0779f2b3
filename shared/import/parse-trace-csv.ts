import { ImportError } from './import-error';
import { parseCsvNumberAt } from './parse-csv-number';
import { readTraceHeader, type TraceHeader } from './read-trace-header';
import { FREQUENCY_UNIT_HZ, levelToDbm, normalizeUnit, type LevelUnit } from './trace-units';

/** A spectrum trace in SI units, frequencies strictly ascending. */
export interface ImportedTrace {
  frequencyHz: Float64Array;
  levelDbm: Float64Array;
  /** Resolution bandwidth from an `rbw` column (constant) or a `# RBW: 300 Hz` comment. */
  rbwHz?: number;
}

const NAME = 'parseTraceCsv';
// `# RBW: 300 Hz`, `# rbw_hz=300`, `# RBW 3 kHz`: a unit before or after the number.
const RBW_COMMENT = new RegExp(
  '(?:^|[^a-z])rbw(?![a-z])[\\s_]*(hz|khz|mhz)?' + // the word, maybe a unit (rbw_hz)
    '\\s*[:=]?\\s*(\\d*\\.?\\d+(?:e[+-]?\\d+)?)' + // the number
    '\\s*(hz|khz|mhz)?', // maybe a unit after it
  'i',
);

/**
 * Parses a spectrum-analyzer trace exported as CSV with a header row. The header names a
 * frequency column (Hz, kHz, MHz, GHz) and a level column (dBm, dBW, dBuV into 50 ohm, W, mW),
 * in either order, e.g. `frequency_hz,level_dbm` or `Level (dBuV);Frequency (MHz)`; an optional
 * `rbw` column (constant) gives the resolution bandwidth; other columns are ignored. Fields are
 * separated by `,`, `;` or tab (from the header); with `;` or tab a decimal comma is accepted.
 * Lines starting with `#` are comments (`# RBW: 300 Hz` is read), blank lines are skipped.
 *
 * Frequencies must be strictly ascending: a sweep is, and a file that is not has probably been
 * merged or edited, so it is refused rather than silently sorted.
 *
 * @throws ImportError with the 1-based line and column (field number) of the first problem.
 * @example parseTraceCsv('frequency_hz,level_dbm\n1000,-20\n2000,-30\n')
 * // { frequencyHz: Float64Array [1000, 2000], levelDbm: Float64Array [-20, -30] }
 */
export function parseTraceCsv(text: string): ImportedTrace {
  const lines = text.split(/\r\n|\n|\r/);
  let commentRbwHz: number | undefined;
  let header: TraceHeader | undefined;
  const frequencies: number[] = [];
  const levels: number[] = [];
  let rbwHz: number | undefined;
  let freqIndex = -1;
  let levelIndex = -1;
  let rbwIndex = -1;
  let hzPerUnit = 1;
  let levelUnit: LevelUnit = 'dbm';
  let delimiter = ',';
  let decimalComma = false;
  let needed = 0;
  let previous = 0;
  // Where each needed field of the current line starts and ends.
  const starts: number[] = [];
  const ends: number[] = [];
  const fieldNumber = (content: string, index: number, what: string, line: number): number => {
    const value = parseCsvNumberAt(content, starts[index], ends[index], decimalComma);
    if (Number.isNaN(value)) {
      const detail = `${what} "${content.slice(starts[index], ends[index]).trim()}" is not a number`;
      throw new ImportError(NAME, detail, { line, column: index + 1 });
    }
    return value;
  };

  for (let k = 0; k < lines.length; k++) {
    const line = k + 1;
    const content = (k === 0 ? lines[k].replace(/^\ufeff/, '') : lines[k]).trim();
    if (content === '') continue;
    if (content[0] === '#') {
      const rbw = RBW_COMMENT.exec(content);
      if (rbw !== null) {
        const unit = FREQUENCY_UNIT_HZ[normalizeUnit(rbw[1] ?? rbw[3] ?? 'hz')] ?? 1;
        commentRbwHz = Number(rbw[2]) * unit;
        if (!(Number.isFinite(commentRbwHz) && commentRbwHz > 0)) {
          throw new ImportError(NAME, `the RBW comment gives ${rbw[2]}, not a bandwidth above 0 Hz`, { line, column: 1 });
        }
      }
      continue;
    }
    if (header === undefined) {
      header = readTraceHeader(content, line);
      freqIndex = header.columns.findIndex((c) => c.role === 'frequency');
      levelIndex = header.columns.findIndex((c) => c.role === 'level');
      rbwIndex = header.columns.findIndex((c) => c.role === 'rbw');
      const f = header.columns[freqIndex];
      const l = header.columns[levelIndex];
      if (f.role === 'frequency') hzPerUnit = f.hzPerUnit;
      if (l.role === 'level') levelUnit = l.unit;
      delimiter = header.delimiter;
      decimalComma = delimiter !== ',';
      needed = Math.max(freqIndex, levelIndex, rbwIndex) + 1;
      continue;
    }
    // The fields needed, by position in the line, without splitting it (a trace has thousands of rows).
    let count = 0;
    for (let position = 0; count < needed; ) {
      const next = content.indexOf(delimiter, position);
      starts[count] = position;
      ends[count] = next === -1 ? content.length : next;
      count++;
      if (next === -1) break;
      position = next + 1;
    }
    if (count < needed) {
      const detail = `${count} field(s), the header has ${header.columns.length}`;
      throw new ImportError(NAME, detail, { line, column: count });
    }
    const frequencyHz = fieldNumber(content, freqIndex, 'frequency', line) * hzPerUnit;
    const reading = fieldNumber(content, levelIndex, 'level', line);
    const levelDbm = levelToDbm(reading, levelUnit);
    if (Number.isNaN(levelDbm)) {
      const detail = `level ${reading} ${levelUnit} must be > 0 to be expressed in dBm`;
      throw new ImportError(NAME, detail, { line, column: levelIndex + 1 });
    }
    if (frequencies.length > 0 && !(frequencyHz > previous)) {
      const detail =
        `frequency ${frequencyHz} Hz is not above the previous row's ${previous} Hz ` +
        '(rows must ascend in frequency)';
      throw new ImportError(NAME, detail, { line, column: freqIndex + 1 });
    }
    previous = frequencyHz;
    if (rbwIndex >= 0) {
      const rbwColumn = header.columns[rbwIndex] as { hzPerUnit: number };
      const rowRbwHz = fieldNumber(content, rbwIndex, 'RBW', line) * rbwColumn.hzPerUnit;
      if (!(Number.isFinite(rowRbwHz) && rowRbwHz > 0)) {
        throw new ImportError(NAME, `RBW ${rowRbwHz} Hz is not a bandwidth above 0 Hz`, { line, column: rbwIndex + 1 });
      }
      if (rbwHz !== undefined && rowRbwHz !== rbwHz) {
        const detail = `RBW changes from ${rbwHz} Hz to ${rowRbwHz} Hz within the trace`;
        throw new ImportError(NAME, detail, { line, column: rbwIndex + 1 });
      }
      rbwHz = rowRbwHz;
    }
    frequencies.push(frequencyHz);
    levels.push(levelDbm);
  }
  if (header === undefined) {
    // No line held a header: the location is the end of the file.
    throw new ImportError(NAME, 'no header row (expected e.g. "frequency_hz,level_dbm")', { line: lines.length });
  }
  if (frequencies.length < 2) {
    const detail = `${frequencies.length} data row(s); a trace needs at least 2`;
    throw new ImportError(NAME, detail, { line: lines.length });
  }
  const trace: ImportedTrace = {
    frequencyHz: Float64Array.from(frequencies),
    levelDbm: Float64Array.from(levels),
  };
  const traceRbwHz = rbwHz ?? commentRbwHz;
  if (traceRbwHz !== undefined) trace.rbwHz = traceRbwHz;
  return trace;
}
