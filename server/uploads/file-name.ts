import { validationFailed } from '../http/problem';

const MAX_NAME_LENGTH = 200;

/**
 * The sender's file name, kept as metadata only (storage keys never contain it). A name with a
 * folder in it (`../../etc/passwd`, `C:\bench\trace.csv`) or control characters is refused:
 * browsers and bench tools send a bare name, so anything else is a mistake or an attack. The
 * kept name has only letters, digits, space and `._()+-` (others become `_`), no leading dot,
 * at most 200 characters.
 *
 * @throws Problem 422 pointing at the part.
 * @example keptFileName('Trace #3 (2182 kHz).csv', 'file') // 'Trace _3 (2182 kHz).csv'
 */
export function keptFileName(originalName: string, part: 'file' | 'data'): string {
  if (/[/\\\u0000-\u001f\u007f]/.test(originalName) || originalName === '..' || originalName === '.') {
    throw validationFailed(`The ${part} name "${printable(originalName)}" has a folder or control characters in it; send the file under a plain name. Nothing was stored.`, [{ pointer: `/${part}`, message: 'must be a plain file name' }]);
  }
  const kept = originalName
    .normalize('NFC')
    .replace(/[^A-Za-z0-9 ._()+-]/g, '_')
    .replace(/^[.\s]+/, '')
    .slice(0, MAX_NAME_LENGTH)
    .trim();
  return kept === '' ? 'upload' : kept;
}

function printable(name: string): string {
  return name.replace(/[\u0000-\u001f\u007f]/g, '?').slice(0, 80);
}
