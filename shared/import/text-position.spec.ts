import { jsonKeyPosition, lineColumnAt } from './text-position';

describe('lineColumnAt', () => {
  it.each([
    ['ab\ncd', 0, 1, 1],
    ['ab\ncd', 4, 2, 2],
    ['a\r\nb', 3, 2, 1],
    ['a\rb', 2, 2, 1],
    ['ab', 99, 1, 3],
  ])('%j at %i is line %i, column %i (LF, CRLF and CR line ends)', (text, offset, line, column) => {
    expect(lineColumnAt(text, offset)).toEqual({ line, column });
  });
});

describe('jsonKeyPosition', () => {
  const text = '{\n  "a": 1,\n  "list": [\n    {"a": 2},\n    {"a": 3}\n  ]\n}';
  it('finds a member name, the nth one, or one after an offset', () => {
    expect(jsonKeyPosition(text, 'a')).toMatchObject({ line: 2, column: 3 });
    expect(jsonKeyPosition(text, 'a', { occurrence: 2 })).toMatchObject({ line: 5, column: 6 });
    const from = jsonKeyPosition(text, 'list')!.offset;
    expect(jsonKeyPosition(text, 'a', { from })).toMatchObject({ line: 4, column: 6 });
    expect(jsonKeyPosition(text, 'missing')).toBeUndefined();
    expect(jsonKeyPosition(text, 'a', { occurrence: 3 })).toBeUndefined();
  });

  it('treats regular-expression characters in keys literally', () => {
    expect(jsonKeyPosition('{"a.b": 1, "axb": 2}', 'a.b')).toMatchObject({ column: 2 });
    expect(jsonKeyPosition('{"axb": 2}', 'a.b')).toBeUndefined();
  });
});
