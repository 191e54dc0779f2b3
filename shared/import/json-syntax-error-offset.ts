const WHITESPACE = /[ \t\n\r]*/y;
const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;
const HEX4 = /[0-9a-fA-F]{4}/y;
const ESCAPABLE = '"\\/bfnrt';

/**
 * The 0-based character offset of the first JSON syntax error in `text` (RFC 8259 grammar), or
 * undefined when the text is valid JSON. Exists because V8's JSON.parse messages often omit the
 * position ("Unexpected token '}', ... is not valid JSON"), and an importer must say where the
 * file is broken. Iterative with an explicit stack, so deeply nested input cannot overflow.
 *
 * @example jsonSyntaxErrorOffset('{"a": tru}') // 6
 * @example jsonSyntaxErrorOffset('[1, 2]')     // undefined
 */
export function jsonSyntaxErrorOffset(text: string): number | undefined {
  const n = text.length;
  const stack: Array<'[' | '{'> = [];
  let state: 'value' | 'valueOrClose' | 'key' | 'keyOrClose' | 'colon' | 'after' = 'value';
  let i = 0;
  for (;;) {
    WHITESPACE.lastIndex = i;
    WHITESPACE.test(text);
    i = WHITESPACE.lastIndex;
    const top = stack[stack.length - 1];
    if (state === 'after' && top === undefined) return i === n ? undefined : i;
    if (i >= n) return n;
    const c = text[i];
    if (state === 'after') {
      if (c === ',') state = top === '{' ? 'key' : 'value';
      else if ((c === ']' && top === '[') || (c === '}' && top === '{')) stack.pop();
      else return i;
      i++;
    } else if (state === 'colon') {
      if (c !== ':') return i;
      i++;
      state = 'value';
    } else if ((state === 'keyOrClose' && c === '}') || (state === 'valueOrClose' && c === ']')) {
      stack.pop();
      i++;
      state = 'after';
    } else if (state === 'key' || state === 'keyOrClose') {
      if (c !== '"') return i;
      const end = scanString(text, i);
      if (end < 0) return ~end;
      i = end;
      state = 'colon';
    } else if (c === '{' || c === '[') {
      stack.push(c);
      i++;
      state = c === '{' ? 'keyOrClose' : 'valueOrClose';
    } else if (c === '"') {
      const end = scanString(text, i);
      if (end < 0) return ~end;
      i = end;
      state = 'after';
    } else {
      const literal = ['true', 'false', 'null'].find((word) => text.startsWith(word, i));
      if (literal !== undefined) {
        i += literal.length;
      } else {
        NUMBER.lastIndex = i;
        if (!NUMBER.test(text)) return i;
        i = NUMBER.lastIndex;
      }
      state = 'after';
    }
  }
}

/** Index just past the closing quote of the string opening at `start`, or ~(error offset). */
function scanString(text: string, start: number): number {
  for (let k = start + 1; k < text.length; k++) {
    const code = text.charCodeAt(k);
    if (code === 34) return k + 1;
    if (code < 0x20) return ~k;
    if (code === 92) {
      const next = text[k + 1];
      if (next === 'u') {
        HEX4.lastIndex = k + 2;
        if (!HEX4.test(text)) return ~k;
        k += 5;
      } else if (next !== undefined && ESCAPABLE.includes(next)) {
        k += 1;
      } else {
        return ~k;
      }
    }
  }
  return ~text.length;
}
