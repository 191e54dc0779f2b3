/**
 * Hostile and malformed spectrum-trace CSV files, built in memory from one small valid trace
 * (header `frequency_hz,level_dbm`, 161 rows around a 2182 kHz carrier). Each is sent to an
 * emission-mask case with referenceDbm=40, so it reaches the importer.
 */
import type { HostileFile } from './hostile-file';

export const TRACE_CARRIER_HZ = 2_182_000;
const HEADER = 'frequency_hz,level_dbm';

/** Valid rows `frequency,level` from carrier - 8 kHz to carrier + 8 kHz in 100 Hz steps. */
export function validTraceRows(): string[] {
  const rows: string[] = [];
  for (let offset = -8000; offset <= 8000; offset += 100) rows.push(`${TRACE_CARRIER_HZ + offset},${offset === 1000 ? -10 : -90}`);
  return rows;
}

export function validTraceCsv(): string {
  return `# RBW: 30 Hz\n${HEADER}\n${validTraceRows().join('\n')}\n`;
}

/** The valid trace with row `index` (0-based among data rows) replaced by `row`. */
function withRow(index: number, row: string): string {
  const rows = validTraceRows();
  rows[index] = row;
  return `${HEADER}\n${rows.join('\n')}\n`;
}

const MB = 1_000_000;

function trace(label: string, text: string | Buffer, expect: HostileFile['expect'] = 'refuse'): HostileFile {
  return {
    label: `trace: ${label}`,
    group: 'trace-csv',
    file: { bytes: typeof text === 'string' ? Buffer.from(text, 'utf8') : text, name: 'trace.csv', contentType: 'text/csv' },
    fields: { referenceDbm: '40' },
    caseKind: 'emission-mask',
    expect,
  };
}

export function traceCsvCorpus(): HostileFile[] {
  const f = TRACE_CARRIER_HZ;
  const rows = validTraceRows();
  const entries: HostileFile[] = [
    // Numbers that are not finite decimals (parseCsvNumber refuses NaN, Infinity, hex, overflow).
    ...['NaN', 'nan', 'Infinity', '-Infinity', 'inf', '1e999', '-1e999', '0x10', '1_000', '--90', '-9O.5', '', ' ', '"', '"-90', '1e', '.', '-', '+', '١٢٣'].map((bad) =>
      trace(`level ${JSON.stringify(bad)}`, withRow(5, `${f - 7500},${bad}`)),
    ),
    ...['NaN', 'Infinity', '1e999', '-', '2.182e6.0', '2182000Hz', '2 182 000'].map((bad) => trace(`frequency ${JSON.stringify(bad)}`, withRow(7, `${bad},-90`))),
    // Commas in the wrong places.
    trace('thousands separators in the frequency (2,181,000)', `${HEADER}\n2,181,000,-90\n2,181,100,-90\n2,181,200,-90\n`),
    trace('an empty field between frequency and level', withRow(3, `${f - 7700},,-90`)),
    trace('a row with one field', withRow(3, `${f - 7700}`)),
    trace('a row of commas only', withRow(3, ',,,,')),
    trace('a decimal comma with comma delimiters', `${HEADER}\n2181000,-90,5\n2181000,-91,5\n`),
    // Order of the sweep.
    trace('unsorted frequencies', withRow(10, `${f - 8000},-90`)),
    trace('duplicate frequency', withRow(10, rows[9])),
    trace('descending sweep', `${HEADER}\n${[...rows].reverse().join('\n')}\n`),
    // Size and shape.
    trace('empty file', ''),
    trace('only whitespace', ' \n\t\n\r\n'),
    trace('only comments', '# RBW: 30 Hz\n# nothing else\n'),
    trace('header only', `${HEADER}\n`),
    trace('one data row', `${HEADER}\n${f},-90\n`),
    trace('one line without newline', `${f},-90`),
    trace('no header, numbers only', `${rows.join('\n')}\n`),
    trace('header without a level column', `frequency_hz\n${f}\n${f + 100}\n`),
    trace('header without a frequency column', `level_dbm\n-90\n-91\n`),
    trace('a megabyte-long number', `${HEADER}\n${'9'.repeat(MB)},-90\n${f},-90\n`),
    trace('a megabyte line of commas', `${HEADER}\n${','.repeat(MB)}\n${f},-90\n`),
    trace('a megabyte header line', `${'x'.repeat(MB)}\n${rows.join('\n')}\n`),
    trace('a megabyte comment then no data', `#${'c'.repeat(MB)}\n${HEADER}\n`),
    // Encodings and byte-level damage.
    trace('UTF-16LE with BOM', Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(`${HEADER}\n${rows.join('\n')}\n`, 'utf16le')])),
    trace('NUL bytes inside a number', withRow(4, `${f - 7600},-9\u00000`)),
    trace('random binary named .csv', Buffer.from(Array.from({ length: 2048 }, (_, k) => (k * 7919 + 13) % 256))),
    trace('ANSI escape in a level', withRow(4, `${f - 7600},\u001b[31m-90`)),
    // Units that do not fit.
    trace('units written into the values', withRow(2, `${f - 7800} Hz,-90 dBm`)),
    trace('a negative level in watts', `frequency_hz,level_w\n${f},0.001\n${f + 100},-1\n`),
    trace('zero level in milliwatts', `frequency_hz,level_mw\n${f},1\n${f + 100},0\n`),
    trace('RBW changing within the trace', `frequency_hz,level_dbm,rbw_hz\n${f},-90,30\n${f + 100},-90,300\n`),
    trace('an RBW comment of 1e999 Hz', `# RBW: 1e999 Hz\n${HEADER}\n${rows.join('\n')}\n`),
    trace('an RBW comment of 0 Hz', `# RBW: 0 Hz\n${HEADER}\n${rows.join('\n')}\n`),
    trace('an RBW column of 0', `frequency_hz,level_dbm,rbw_hz\n${f},-90,0\n${f + 100},-90,0\n`),
    trace('RBW column not a number', `frequency_hz,level_dbm,rbw_hz\n${f},-90,thirty\n${f + 100},-90,30\n`),
    // Odd but readable: the product may take these.
    trace('a UTF-8 byte-order mark on a valid trace', `\ufeff${validTraceCsv()}`, 'either'),
    // String.prototype.trim removes U+FEFF, so the second mark goes with the first.
    trace('two byte-order marks', `\ufeff\ufeff${HEADER}\n${rows.join('\n')}\n`, 'either'),
    trace('CR-only line ends', validTraceCsv().replace(/\n/g, '\r'), 'either'),
    trace('absurd but finite levels (1e300 dBm)', `${HEADER}\n${f},1e300\n${f + 100},-1e300\n`, 'either'),
    trace('mixed frequency units in two columns', `frequency_mhz,frequency_hz,level_dbm\n2.182,${f},-90\n2.1821,${f + 100},-90\n`, 'either'),
    trace('negative frequencies', `${HEADER}\n-200,-90\n-100,-90\n`, 'either'),
    trace('sixty extra columns', `${HEADER}${',x'.repeat(60)}\n${rows.map((r) => r + ',1'.repeat(60)).join('\n')}\n`, 'either'),
  ];
  return entries;
}
