/**
 * Hostile file names for the upload's `file` part, sent with a valid trace so the name is the
 * only thing wrong. Names with folders or control characters must be refused; odd but plain
 * names (very long, dots, percent signs) may be kept in sanitized form.
 */
import type { HostileFile } from './hostile-file';
import { validTraceCsv } from './trace-csv-files';

const REFUSE = [
  '../../etc/passwd',
  '../../../../../../../../etc/passwd',
  '..\\..\\x',
  '..\\..\\windows\\win.ini',
  '/etc/passwd',
  '/absolute/trace.csv',
  'C:\\bench\\trace.csv',
  '\\\\server\\share\\trace.csv',
  'traces/2182.csv',
  '..',
  '.',
  'trace\u0000.csv',
  'trace.csv\u0000.wav',
  'line\nbreak.csv',
  'tab\there.csv',
  'escape\u001b[31m.csv',
  'trace.csv/',
];

const EITHER = [
  // The multipart client (form-data) normalizes this to a bare name before it is sent.
  './trace.csv',
  `${'a'.repeat(5000)}.csv`,
  `${'ü'.repeat(300)}.csv`,
  '%2e%2e%2fetc%2fpasswd.csv',
  '....csv',
  ' .csv',
  'CON.csv',
  '\u202Evsc.exe',
  "trace'; DROP TABLE uploads; --.csv",
  '$(touch pwned).csv',
];

export function fileNameCorpus(): HostileFile[] {
  const bytes = Buffer.from(validTraceCsv());
  const entry = (name: string, expect: HostileFile['expect']): HostileFile => ({
    label: `file name ${JSON.stringify(name.length > 60 ? `${name.slice(0, 20)}...(${name.length} chars)` : name)}`,
    group: 'file-name',
    file: { bytes, name, contentType: 'text/csv' },
    fields: { referenceDbm: '40' },
    caseKind: 'emission-mask',
    expect,
  });
  return [...REFUSE.map((n) => entry(n, 'refuse')), ...EITHER.map((n) => entry(n, 'either'))];
}
