import path from 'node:path';
import { ImportError } from '../../shared/import/import-error';

/**
 * Errors the command line reports as one line on stderr, without a stack trace. The exit code is
 * part of the contract with bench automation: 2 = the command was called wrongly (usage),
 * 1 = the command was right but its input is not (bad file, failed check of the input).
 */
export class CliError extends Error {
  constructor(
    message: string,
    readonly exitCode: 1 | 2,
  ) {
    super(message);
    this.name = 'CliError';
  }
}

/** A wrong command line: unknown command or option, missing or malformed value. Exit 2. */
export function usageError(message: string): CliError {
  return new CliError(message, 2);
}

/** A bad input file or a value the engine refuses. Exit 1. */
export function inputError(message: string): CliError {
  return new CliError(message, 1);
}

/**
 * Runs an importer on a file's contents and puts the file name in front of its ImportError, so
 * the one-line message says which file is bad: `trace.csv: parseTraceCsv: line 3, column 2: ...`.
 */
export function inFile<T>(file: string, parse: () => T): T {
  try {
    return parse();
  } catch (error) {
    if (error instanceof ImportError) throw inputError(`${path.basename(file)}: ${error.message}`);
    throw error;
  }
}
