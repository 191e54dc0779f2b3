import { CliError, usageError } from './cli-error';
import { USAGE } from './usage';
import { analyzeIqCommand } from './analyze-iq-command';
import { analyzeTraceCommand } from './analyze-trace-command';
import { synthesizeCommand } from './synthesize-command';
import { selfValidateCommand } from './self-validate-command';
import { ImportError } from '../../shared/import/import-error';

/** Where a command writes; the process streams in normal use. */
export interface CliOutput {
  stdout(text: string): void;
  stderr(text: string): void;
}

type Command = (argv: string[], output: CliOutput) => Promise<number>;

const COMMANDS: Record<string, Command> = {
  'analyze-iq': analyzeIqCommand,
  'analyze-trace': analyzeTraceCommand,
  synthesize: synthesizeCommand,
  'self-validate': selfValidateCommand,
};

/**
 * Runs one `sidecheck` command and resolves to its exit code. Expected failures (CliError,
 * ImportError, the engine's RangeError/TypeError on input it refuses) become one line on stderr
 * with exit 2 (usage) or 1 (input); no stack traces reach the user.
 */
export async function runCli(argv: string[], output: CliOutput): Promise<number> {
  try {
    const [name, ...rest] = argv;
    if (name === undefined) {
      output.stderr(USAGE);
      return 2;
    }
    if (name === '--help' || name === '-h' || name === 'help') {
      output.stdout(USAGE);
      return 0;
    }
    const command = COMMANDS[name];
    if (command === undefined) throw usageError(`unknown command "${name}" (see sidecheck --help)`);
    return await command(rest, output);
  } catch (error) {
    output.stderr(`sidecheck: ${describe(error)}\n`);
    return error instanceof CliError ? error.exitCode : 1;
  }
}

function describe(error: unknown): string {
  if (error instanceof CliError || error instanceof ImportError) return error.message;
  if (error instanceof RangeError || error instanceof TypeError) return error.message;
  // Node's file errors, also when they come from another realm (a test runner's sandbox), where instanceof Error fails.
  if (typeof error === 'object' && error !== null && 'code' in error && typeof error.code === 'string' && 'message' in error && typeof error.message === 'string') {
    return error.message; // Node file errors: "ENOENT: no such file or directory, open 'x'"
  }
  return `internal error: ${error instanceof Error ? error.message : String(error)}`;
}

/** Entry used by scripts/run-cli.js: sets the exit code and lets stdout drain before exiting. */
export function runFromProcess(argv: string[]): void {
  const output: CliOutput = {
    stdout: (text) => void process.stdout.write(text),
    stderr: (text) => void process.stderr.write(text),
  };
  void runCli(argv, output).then((code) => {
    process.exitCode = code;
  });
}
