import { ImportError } from './import-error';
import { parseCsvNumber } from './parse-csv-number';
import { classifyTraceColumn, type TraceColumn } from './trace-column';

const NAME = 'parseTraceCsv';

/** The header row of a trace CSV: what each column holds and the field delimiter. */
export interface TraceHeader {
  columns: TraceColumn[];
  delimiter: string;
  line: number;
}

/**
 * Reads the header row of a trace CSV (see parseTraceCsv). The delimiter is `;` when the row
 * has one, else tab, else `,`. Refuses, with the line and the column: a frequency/level/RBW column
 * without a known unit, two columns of one role, a first row that is data, a missing frequency or
 * level column. Errors are reported as parseTraceCsv's, the importer a user called.
 *
 * @example readTraceHeader('Level (dBm);Frequency (kHz)', 1).delimiter // ';'
 */
export function readTraceHeader(content: string, line: number): TraceHeader {
  const delimiter = content.includes(';') ? ';' : content.includes('\t') ? '\t' : ',';
  const cells = content.split(delimiter);
  const columns = cells.map(classifyTraceColumn);
  const fail = (column: number, detail: string): never => {
    throw new ImportError(NAME, detail, { line, column });
  };
  const unitless = columns.findIndex((c) => c.role === 'unitless');
  if (unitless >= 0) {
    const c = columns[unitless] as { quantity: string };
    const detail =
      `header "${cells[unitless].trim()}" names a ${c.quantity} without a known unit ` +
      '(e.g. frequency_hz, "Level (dBm)")';
    fail(unitless + 1, detail);
  }
  for (const role of ['frequency', 'level', 'rbw'] as const) {
    const at = columns.flatMap((c, index) => (c.role === role ? [index + 1] : []));
    if (at.length > 1) {
      fail(at[1], `columns ${at.join(' and ')} both look like ${role} columns; keep one`);
    }
  }
  if (!Number.isNaN(parseCsvNumber(cells[0], delimiter !== ','))) {
    fail(1, 'the first row is data; a header row such as "frequency_hz,level_dbm" is required');
  }
  if (!columns.some((c) => c.role === 'frequency')) {
    fail(1, 'no frequency column (e.g. frequency_hz)');
  }
  if (!columns.some((c) => c.role === 'level')) fail(1, 'no level column (e.g. level_dbm)');
  return { columns, delimiter, line };
}
