import { keptFileName } from './file-name';
import { Problem } from '../http/problem';

describe('keptFileName', () => {
  it.each([
    ['Trace #3 (2182 kHz).csv', 'Trace _3 (2182 kHz).csv'],
    ['capture.sigmf-meta', 'capture.sigmf-meta'],
    ['.hidden.csv', 'hidden.csv'],
    ['Zähler µ.csv', 'Z_hler _.csv'],
    ['<script>.csv', '_script_.csv'],
    ['...', 'upload'],
  ])('keeps %j as %j (letters, digits, space and ._()+- only; common practice)', (name, kept) => {
    expect(keptFileName(name, 'file')).toBe(kept);
  });

  it('cuts a long name to 200 characters', () => {
    expect(keptFileName(`${'a'.repeat(300)}.csv`, 'file')).toHaveLength(200);
  });

  it.each(['../../etc/passwd', '..', 'C:\\bench\\trace.csv', 'dir/trace.csv', 'trace\u0000.csv', 'line\nbreak.csv'])('refuses %j with a 422 pointing at the part', (name) => {
    let thrown: unknown;
    try {
      keptFileName(name, 'data');
    } catch (error) {
      thrown = error;
    }
    expect(thrown).toBeInstanceOf(Problem);
    expect((thrown as Problem).status).toBe(422);
    expect((thrown as Problem).errors?.[0].pointer).toBe('/data');
  });
});
