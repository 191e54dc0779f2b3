import { CliError } from './cli-error';
import { choiceOption, numberOption, parseCliArguments, stringOption } from './parse-cli-arguments';

const SYNTAX = {
  command: 'demo',
  positional: ['file'],
  valueOptions: ['rate', 'tone', 'sideband'],
  flagOptions: ['json'],
};

function usageMessage(action: () => unknown): string {
  try {
    action();
  } catch (error) {
    expect(error).toBeInstanceOf(CliError);
    expect((error as CliError).exitCode).toBe(2);
    return (error as CliError).message;
  }
  throw new Error('expected a usage error');
}

describe('parseCliArguments', () => {
  it('splits positionals, valued options (both spellings, repeatable) and flags', () => {
    const argv = ['a.csv', '--rate=48000', '--tone', '1:2', '--tone', '3:4', '--json'];
    const parsed = parseCliArguments(argv, SYNTAX);
    expect(parsed.positional).toEqual(['a.csv']);
    expect(parsed.values.get('tone')).toEqual(['1:2', '3:4']);
    expect(numberOption(parsed, 'rate', { min: 1 })).toBe(48000);
    expect(parsed.flags.has('json')).toBe(true);
  });

  it('takes negative numbers as values', () => {
    const parsed = parseCliArguments(['f', '--rate', '-12.5e1'], SYNTAX);
    expect(numberOption(parsed, 'rate')).toBe(-125);
  });

  it.each([
    [['f', '--bogus'], /unknown option --bogus/],
    [['f', '--rate'], /--rate needs a value/],
    [['f', '--rate', '--json'], /--rate needs a value/],
    [['f', '--json=1'], /takes no value/],
    [[], /expected FILE, got 0/],
    [['f', 'g'], /expected FILE, got 2/],
  ])('refuses %j', (argv, message) => {
    expect(usageMessage(() => parseCliArguments(argv, SYNTAX))).toMatch(message);
  });

  it('checks numbers, choices and single use', () => {
    const parse = (...argv: string[]) => parseCliArguments(['f', ...argv], SYNTAX);
    expect(usageMessage(() => numberOption(parse('--rate', '0x10'), 'rate'))).toMatch(/a number/);
    const rate = (...values: string[]) => parse(...values.flatMap((v) => ['--rate', v]));
    expect(usageMessage(() => numberOption(rate('0'), 'rate', { min: 1 }))).toMatch(/>= 1/);
    const whole = usageMessage(() => numberOption(rate('1.5'), 'rate', { integer: true }));
    expect(whole).toMatch(/whole number/);
    expect(usageMessage(() => stringOption(rate('1', '2'), 'rate'))).toMatch(/more than once/);
    const sideband = parse('--sideband', 'dsb');
    const choice = usageMessage(() => choiceOption(sideband, 'sideband', ['usb', 'lsb']));
    expect(choice).toMatch(/one of usb, lsb/);
    expect(choiceOption(parse('--sideband', 'lsb'), 'sideband', ['usb', 'lsb'])).toBe('lsb');
    expect(numberOption(parse(), 'rate')).toBeUndefined();
  });
});
