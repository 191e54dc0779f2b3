import fc from 'fast-check';
import { ImportError } from './import-error';
import { parseTraceCsv } from './parse-trace-csv';

function errorOf(text: string): ImportError {
  try {
    parseTraceCsv(text);
  } catch (error) {
    if (error instanceof ImportError) return error;
    throw error;
  }
  throw new Error('expected an ImportError');
}

describe('parseTraceCsv', () => {
  it('reads frequency_hz,level_dbm', () => {
    const trace = parseTraceCsv('frequency_hz,level_dbm\n1000,-20.5\n2000,-30\n3000,1e1\n');
    expect([...trace.frequencyHz]).toEqual([1000, 2000, 3000]);
    expect([...trace.levelDbm]).toEqual([-20.5, -30, 10]);
    expect(trace.rbwHz).toBeUndefined();
  });

  // Unit relations: 1 MHz = 1e6 Hz (SI); 60 dBuV = -46.99 dBm at 50 ohm; 1 W = 30 dBm.
  it('reads columns in either order, semicolons with decimal commas, and converts units', () => {
    const text =
      '# exported trace\n\nLevel (dBµV);Frequency (MHz)\r\n60;2,182\r\n\r\n61,5;2,183\r\n';
    const trace = parseTraceCsv(text);
    expect(trace.frequencyHz[0]).toBeCloseTo(2182000, 6);
    expect(trace.frequencyHz[1]).toBeCloseTo(2183000, 6);
    expect(trace.levelDbm[0]).toBeCloseTo(-46.99, 2);
    expect(trace.levelDbm[1]).toBeCloseTo(-45.49, 2);
    const watts = parseTraceCsv('power_w\tfreq_khz\n1\t1\n0.001\t2\n');
    expect([...watts.levelDbm].map((v) => +v.toFixed(9))).toEqual([30, 0]);
    expect([...watts.frequencyHz]).toEqual([1000, 2000]);
    const dbw = parseTraceCsv('\ufeffHz,dBW,index\n1,-30,7\n2,0,8\n');
    expect([...dbw.levelDbm]).toEqual([0, 30]);
  });

  it('reads the RBW from a constant column or from a comment', () => {
    const column = parseTraceCsv('frequency_hz,level_dbm,rbw_khz\n1,-1,0.3\n2,-2,0.3\n');
    expect(column.rbwHz).toBeCloseTo(300, 9);
    expect(parseTraceCsv('# RBW: 30 Hz\nfrequency_hz,level_dbm\n1,-1\n2,-2\n').rbwHz).toBe(30);
    expect(parseTraceCsv('# rbw_hz=100\nfrequency_hz,level_dbm\n1,-1\n2,-2\n').rbwHz).toBe(100);
    expect(parseTraceCsv('# RBW 3 kHz\nfrequency_hz,level_dbm\n1,-1\n2,-2\n').rbwHz).toBe(3000);
    const varying = errorOf('frequency_hz,level_dbm,rbw_hz\n1,-1,10\n2,-2,30\n');
    expect(varying).toMatchObject({ line: 3, column: 3 });
  });

  it.each([
    ['a bad number', 'frequency_hz,level_dbm\n1,-1\n2,-2x\n', 3, 2, /"-2x" is not a number/],
    ['NaN', 'frequency_hz,level_dbm\n1,-1\n2,NaN\n', 3, 2, /not a number/],
    ['Infinity', 'frequency_hz,level_dbm\n1,-1\nInfinity,-2\n', 3, 1, /not a number/],
    ['an empty field', 'frequency_hz,level_dbm\n1,\n2,-1\n', 2, 2, /"" is not a number/],
    ['a short row', 'frequency_hz,level_dbm\n1,-1\n2\n', 3, 1, /1 field/],
    ['descending frequency', 'level_dbm,frequency_hz\n-1,5\n-2,4\n', 3, 2, /not above/],
    ['a repeated frequency', 'frequency_hz,level_dbm\n5,-1\n5,-2\n', 3, 1, /not above/],
    ['a zero linear power', 'frequency_hz,level_w\n1,1\n2,0\n', 3, 2, /must be > 0/],
    ['a frequency without unit', '# c\nfrequency,level_dbm\n1,2\n', 2, 1, /without a known unit/],
    ['a PSD level', 'frequency_hz,level (dBm/Hz)\n1,2\n', 1, 2, /without a known unit/],
    ['two level columns', 'frequency_hz,level_dbm,peak_dbm\n1,2,3\n', 1, 3, /both look like level/],
    ['no header', '1000,-20\n2000,-30\n', 1, 1, /header row .* is required/],
    ['no level column', 'frequency_hz,index\n1,2\n', 1, 1, /no level column/],
    ['one data row', 'frequency_hz,level_dbm\n1,2\n', 3, undefined, /at least 2/],
  ])('refuses %s, naming line and column', (_, text, line, column, message) => {
    const error = errorOf(text);
    expect(error.message).toMatch(message);
    expect(error.line).toBe(line);
    expect(error.column).toBe(column);
    expect(error.message.startsWith('parseTraceCsv: ')).toBe(true);
  });

  it('refuses an empty file', () => {
    expect(errorOf('\n# only a comment\n').message).toMatch(/no header row/);
  });

  it('round-trips generated traces (property)', () => {
    const rows = fc.array(
      fc.tuple(
        fc.double({ min: 0.001, max: 1000, noNaN: true }),
        fc.double({ min: -200, max: 60, noNaN: true }),
      ),
      { minLength: 2, maxLength: 40 },
    );
    fc.assert(
      fc.property(rows, fc.constantFrom(',', ';'), (pairs, delimiter) => {
        let frequencyHz = 0;
        const expectedHz: number[] = [];
        const lines = pairs.map(([step, level]) => {
          frequencyHz += step;
          expectedHz.push(frequencyHz);
          return `${frequencyHz}${delimiter}${level}`;
        });
        const header = `frequency_hz${delimiter}level_dbm`;
        const trace = parseTraceCsv([header, ...lines].join('\n'));
        expect([...trace.frequencyHz]).toEqual(expectedHz);
        // `${-0}` is "0": compare -0 as 0.
        expect([...trace.levelDbm]).toEqual(pairs.map(([, level]) => level + 0));
      }),
      { seed: 153, numRuns: 200 },
    );
  });

  it('never throws anything but ImportError on arbitrary text (fuzz)', () => {
    const pieces = ['1', '-2.5', ',', ';', '\n', '#', 'e', 'frequency_hz', 'level_dbm', ' ', 'x'];
    const csvish = fc
      .array(fc.constantFrom(...pieces, '\t', 'MHz', '(', ')'), { maxLength: 40 })
      .map((parts) => parts.join(''));
    const headed = csvish.map((t) => 'frequency_hz,level_dbm\n' + t);
    fc.assert(
      fc.property(fc.oneof(fc.string(), csvish, headed), (text) => {
        try {
          const trace = parseTraceCsv(text);
          expect(trace.frequencyHz.length).toBe(trace.levelDbm.length);
        } catch (error) {
          expect(error).toBeInstanceOf(ImportError);
        }
      }),
      { seed: 328, numRuns: 2000 },
    );
  });
});
