import fc from 'fast-check';
import { jsonSyntaxErrorOffset } from './json-syntax-error-offset';

// Grammar: RFC 8259. Reference for validity: the engine's own JSON.parse (an independent parser).
describe('jsonSyntaxErrorOffset', () => {
  it.each([
    ['{"a": tru}', 6],
    ['{"a":}', 5],
    ['[1,]', 3],
    ['{', 1],
    ['', 0],
    ['{"a" 1}', 5],
    ['[01]', 2],
    ['"\\x"', 1],
    ['{"a":1} x', 8],
    ['[1 2]', 3],
    ['{"a":"\u0001"}', 6],
  ])('points into %j at %i', (text, offset) => {
    expect(jsonSyntaxErrorOffset(text)).toBe(offset);
  });

  it.each(['{}', '[]', ' {"a": [1, -2.5e3, true, false, null, "\\u00e9\\n"]} ', '0', '"x"'])(
    'accepts valid JSON %j',
    (text) => {
      expect(jsonSyntaxErrorOffset(text)).toBeUndefined();
    },
  );

  it('survives nesting deeper than any call stack', () => {
    expect(jsonSyntaxErrorOffset('['.repeat(200000))).toBe(200000);
  });

  it('agrees with JSON.parse on generated JSON and on mutated JSON (property)', () => {
    const mutated = fc
      .tuple(fc.json(), fc.nat(), fc.constantFrom('', '}', ']', ',', ':', '"', 'x', '-', ' '))
      .map(([json, at, insert]) => {
        const k = at % (json.length + 1);
        return json.slice(0, k) + insert + json.slice(k + (insert === '' ? 1 : 0));
      });
    fc.assert(
      fc.property(fc.oneof(fc.json(), mutated, fc.string()), (text) => {
        let valid = true;
        try {
          JSON.parse(text);
        } catch {
          valid = false;
        }
        expect(jsonSyntaxErrorOffset(text) === undefined).toBe(valid);
      }),
      { seed: 8259, numRuns: 2000 },
    );
  });
});
