/** Where in an imported file a problem was found. Lines and columns are 1-based; bytes 0-based. */
export interface ImportErrorLocation {
  line?: number;
  column?: number;
  byteOffset?: number;
}

/**
 * The one error every importer in this folder throws for a bad file (malformed header, lying
 * length fields, truncated data, unparsable numbers). Programming mistakes by the caller (for
 * example a negative sample rate passed as an option) throw RangeError/TypeError instead.
 *
 * The message starts with the importer's name and the location, so it can be shown to a user
 * as is: `parseTraceCsv: line 7, column 2: "-7,5x" is not a number`. A detail longer than 300
 * characters (a quoted megabyte-long field) is cut short with "...".
 *
 * @example
 * try { parseTraceCsv(text); } catch (e) { if (e instanceof ImportError) console.log(e.line); }
 */
export class ImportError extends Error {
  /** 1-based line of a text file, when known. */
  readonly line: number | undefined;
  /** 1-based column (field number for CSV, character for JSON), when known. */
  readonly column: number | undefined;
  /** 0-based byte offset in a binary file, when known. */
  readonly byteOffset: number | undefined;

  constructor(importerName: string, detail: string, location: ImportErrorLocation = {}) {
    super(`${importerName}: ${describeLocation(location)}${shortened(detail)}`);
    this.name = 'ImportError';
    this.line = location.line;
    this.column = location.column;
    this.byteOffset = location.byteOffset;
  }
}

/** Longest detail kept, characters: a quoted field of a hostile file can be megabytes long. */
const MAX_DETAIL_LENGTH = 300;

function shortened(detail: string): string {
  return detail.length <= MAX_DETAIL_LENGTH ? detail : `${detail.slice(0, MAX_DETAIL_LENGTH - 3)}...`;
}

function describeLocation(location: ImportErrorLocation): string {
  const parts: string[] = [];
  if (location.line !== undefined) parts.push(`line ${location.line}`);
  if (location.column !== undefined) parts.push(`column ${location.column}`);
  if (location.byteOffset !== undefined) parts.push(`byte offset ${location.byteOffset}`);
  return parts.length > 0 ? `${parts.join(', ')}: ` : '';
}
