import { usageError } from './cli-error';

/** What a command accepts: how many positional arguments, and its named options. */
export interface CommandSyntax {
  command: string;
  positional: string[];
  /** Options that take a value (`--rate 48000` or `--rate=48000`); repeatable ones collect all. */
  valueOptions: string[];
  flagOptions: string[];
}

/** Parsed command line; option names are stored without the leading dashes. */
export interface ParsedArguments {
  positional: string[];
  values: Map<string, string[]>;
  flags: Set<string>;
}

/**
 * Splits a command's arguments into positionals, valued options and flags, strictly: unknown
 * options, a missing value, or the wrong number of positionals are usage errors (exit 2).
 *
 * @example parseCliArguments(['a.csv', '--mask', 'm.json', '--json'], syntax)
 * // { positional: ['a.csv'], values: Map { 'mask' => ['m.json'] }, flags: Set { 'json' } }
 */
export function parseCliArguments(argv: string[], syntax: CommandSyntax): ParsedArguments {
  const parsed: ParsedArguments = { positional: [], values: new Map(), flags: new Set() };
  for (let k = 0; k < argv.length; k++) {
    const argument = argv[k];
    if (!argument.startsWith('--') || argument === '--') {
      parsed.positional.push(argument);
      continue;
    }
    const equals = argument.indexOf('=');
    const name = argument.slice(2, equals < 0 ? undefined : equals);
    if (syntax.flagOptions.includes(name)) {
      if (equals >= 0) throw usageError(`${syntax.command}: --${name} takes no value`);
      parsed.flags.add(name);
    } else if (syntax.valueOptions.includes(name)) {
      const value = equals >= 0 ? argument.slice(equals + 1) : argv[++k];
      if (value === undefined || (equals < 0 && value.startsWith('--'))) {
        throw usageError(`${syntax.command}: --${name} needs a value`);
      }
      parsed.values.set(name, [...(parsed.values.get(name) ?? []), value]);
    } else {
      throw usageError(`${syntax.command}: unknown option --${name} (see --help)`);
    }
  }
  if (parsed.positional.length !== syntax.positional.length) {
    const wanted = syntax.positional.map((p) => p.toUpperCase()).join(' ') || 'no arguments';
    const got = parsed.positional.length;
    throw usageError(`${syntax.command}: expected ${wanted}, got ${got} argument(s)`);
  }
  return parsed;
}

/** The single value of an option, or undefined; giving it twice is a usage error. */
export function stringOption(parsed: ParsedArguments, name: string): string | undefined {
  const values = parsed.values.get(name);
  if (values !== undefined && values.length > 1) throw usageError(`--${name} given more than once`);
  return values?.[0];
}

/**
 * A numeric option: a finite decimal number within [min, max] (and whole when `integer`).
 *
 * @example numberOption(parsed, 'rate', { min: 1 }) // 192000 for --rate 192000
 */
export function numberOption(
  parsed: ParsedArguments,
  name: string,
  bounds: { min?: number; max?: number; integer?: boolean } = {},
): number | undefined {
  const text = stringOption(parsed, name);
  if (text === undefined) return undefined;
  const value = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text.trim()) ? Number(text) : NaN;
  const { min = -Infinity, max = Infinity, integer = false } = bounds;
  const whole = !integer || Number.isInteger(value);
  if (!Number.isFinite(value) || value < min || value > max || !whole) {
    const lower = min > -Infinity ? ` >= ${min}` : '';
    const upper = max < Infinity ? ` <= ${max}` : '';
    const range = `${integer ? 'a whole number' : 'a number'}${lower}${upper}`;
    throw usageError(`--${name} must be ${range}, got "${text}"`);
  }
  return value;
}

/** An option restricted to a list of words. */
export function choiceOption<T extends string>(
  parsed: ParsedArguments,
  name: string,
  choices: readonly T[],
): T | undefined {
  const text = stringOption(parsed, name);
  if (text === undefined) return undefined;
  if (!(choices as readonly string[]).includes(text)) {
    throw usageError(`--${name} must be one of ${choices.join(', ')}, got "${text}"`);
  }
  return text as T;
}
