import { maskVertices, parseVertexNumber, sortedVertexRows, vertexProblems, vertexSortOrder, type VertexRow } from './mask-vertices';
import { compileEmissionMask } from '../../../shared/mask/compiled-mask';

const rows = (...v: [number | null, number | null][]): VertexRow[] => v.map(([offsetHz, relDb]) => ({ offsetHz, relDb }));

// 47 CFR 80.211(a) with an authorized bandwidth of 3.0 kHz [pub rule; offsets from memory]: 28 dB
// over 1.5-4.5 kHz, 35 dB over 4.5-7.5 kHz, 43 + 10 log10(100 W) = 63 dB beyond, written as steps.
const MARITIME = rows([1500, 0], [1500, -28], [4500, -28], [4500, -35], [7500, -35], [7500, -63]);

describe('parseVertexNumber', () => {
  it.each([
    ['1500', 1500],
    [' -28 ', -28],
    ['\u221228,5', -28.5],
    ['1e3', 1000],
    ['.5', 0.5],
    [42, 42],
    ['', null],
    ['abc', null],
    ['12abc', null],
    ['1,2,3', null],
    [NaN, null],
    [Infinity, null],
    [null, null],
  ])('%j → %j', (text, expected) => {
    expect(parseVertexNumber(text as string)).toBe(expected);
  });
});

describe('vertexProblems', () => {
  it('accepts the maritime mask with its steps', () => {
    expect(vertexProblems(MARITIME)).toEqual([]);
    expect(maskVertices(MARITIME)).toEqual([[1500, 0], [1500, -28], [4500, -28], [4500, -35], [7500, -35], [7500, -63]]);
  });

  it.each<[string, VertexRow[], { row: number; field: string; message: RegExp }]>([
    ['a blank offset', rows([null, 0], [3000, -28]), { row: 0, field: 'offsetHz', message: /Enter the offset/ }],
    ['a negative offset', rows([-1, 0], [3000, -28]), { row: 0, field: 'offsetHz', message: /0 Hz or more/ }],
    ['an offset going back', rows([1500, 0], [1000, -28]), { row: 1, field: 'offsetHz', message: /previous offset \(1500 Hz\)/ }],
    ['three vertices at one offset', rows([1500, 0], [1500, -28], [1500, -35]), { row: 2, field: 'offsetHz', message: /third vertex/ }],
    ['a step at 0 Hz', rows([0, 0], [0, -28], [3000, -35]), { row: 1, field: 'offsetHz', message: /step at 0 Hz/ }],
    ['a limit above the reference', rows([0, 1], [3000, -28]), { row: 0, field: 'relDb', message: /0 dB or less/ }],
    ['a limit beyond the schema bound', rows([0, 0], [3000, -301]), { row: 1, field: 'relDb', message: /−300/ }],
    ['a blank limit', rows([0, 0], [3000, null]), { row: 1, field: 'relDb', message: /Enter the limit/ }],
    ['a single vertex', rows([0, 0]), { row: 1, field: 'list', message: /at least 2/ }],
  ])('names %s', (_what, input, expected) => {
    const problems = vertexProblems(input);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatchObject({ row: expected.row, field: expected.field });
    expect(problems[0].message).toMatch(expected.message);
    expect(maskVertices(input)).toBeNull();
  });

  // Two independent paths agree: our per-field checks and shared/mask's compileEmissionMask (the
  // engine that evaluates the mask) accept and refuse the same masks. Seeded, so a failure repeats.
  it('agrees with the engine on 2000 random masks', () => {
    let seed = 12345;
    const random = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    const pick = <T>(values: T[]) => values[Math.floor(random() * values.length)];
    for (let n = 0; n < 2000; n++) {
      const input = Array.from({ length: 2 + Math.floor(random() * 5) }, () => ({ offsetHz: pick([0, 0, 1500, 1500, 3000, 4500, -10]), relDb: pick([0, -28, -35, 5]) }));
      const ours = vertexProblems(input).length === 0;
      let engine = true;
      try {
        compileEmissionMask('test', { reference: 'mean', vertices: input.map((r) => [r.offsetHz, r.relDb] as const) });
      } catch {
        engine = false;
      }
      expect({ input, ours }).toEqual({ input, ours: engine });
    }
  });
});

describe('sortedVertexRows', () => {
  it('orders by offset, keeps the order inside a step and puts blank offsets last', () => {
    const input = rows([4500, -28], [1500, 0], [null, -3], [1500, -28], [4500, -35]);
    expect(sortedVertexRows(input)).toEqual(rows([1500, 0], [1500, -28], [4500, -28], [4500, -35], [null, -3]));
    expect(input[0]).toEqual({ offsetHz: 4500, relDb: -28 });
  });
});

describe('vertexSortOrder', () => {
  it('gives the indices the editor moves its rows by', () => {
    expect(vertexSortOrder(rows([4500, -28], [1500, 0], [null, -3], [1500, -28]))).toEqual([1, 3, 0, 2]);
    expect(vertexSortOrder([])).toEqual([]);
  });
});
