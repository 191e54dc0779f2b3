import path from 'node:path';
import { ImportError } from '../../shared/import/import-error';
import { CliError } from '../cli/cli-error';
import { analysisFailed, ImportProblem, type ImportLocation } from '../uploads/upload-problems';

/**
 * Turns what the importers and the analyzer throw into the problem the API answers with: an
 * ImportError (or the command-line reader's wrapping of one, whose message starts with the part's
 * name, e.g. `file.sigmf-data: decodeIqSamples: byte offset 4096: ...`) becomes a 422 naming the
 * part and the line, column or byte offset; a RangeError of the analyzer (no signal, too few
 * samples) a 422 'analysis-failed'. Anything else is not about the file and is rethrown.
 */
export function importFailure(error: unknown, defaultPart: 'file' | 'data'): never {
  if (error instanceof ImportError) {
    throw new ImportProblem(error.message, { part: defaultPart, line: error.line, column: error.column, byteOffset: error.byteOffset });
  }
  if (error instanceof CliError) {
    // The reader names the file it was reading first: our own placed names, file.* or file.sigmf-data.
    const named = /^([\w.-]+): (.*)$/s.exec(error.message);
    const part = named && path.extname(named[1]) === '.sigmf-data' ? 'data' : named ? 'file' : defaultPart;
    const message = named ? named[2] : error.message;
    const at = (label: string) => {
      const m = new RegExp(`${label} (\\d+)`).exec(message);
      return m ? Number(m[1]) : undefined;
    };
    const location: ImportLocation = { part, line: at('line'), column: at('column'), byteOffset: at('byte offset') };
    throw new ImportProblem(message, location);
  }
  if (error instanceof RangeError) throw analysisFailed(defaultPart, error.message);
  throw error;
}
