/** A 1-based line and column in a text. */
export interface TextPosition {
  line: number;
  column: number;
}

/**
 * Converts a 0-based character offset into a 1-based line and column. Lines end at `\n`, `\r\n`
 * or a lone `\r`. Offsets past the end give the position just after the last character.
 *
 * @example lineColumnAt('ab\ncd', 4) // { line: 2, column: 2 }
 */
export function lineColumnAt(text: string, offset: number): TextPosition {
  const end = Math.max(0, Math.min(offset, text.length));
  let line = 1;
  let lineStart = 0;
  for (let k = 0; k < end; k++) {
    const c = text.charCodeAt(k);
    if (c === 10 || (c === 13 && text.charCodeAt(k + 1) !== 10)) {
      line++;
      lineStart = k + 1;
    }
  }
  return { line, column: end - lineStart + 1 };
}

/**
 * The position of a JSON member name (`"key"` followed by a colon), so that a validation message
 * can point at the line a person has to edit. `from` starts the search at a character offset;
 * `occurrence` (0-based) skips earlier matches. Returns undefined if the key does not appear.
 *
 * @example jsonKeyPosition('{\n  "core:sample_rate": -1\n}', 'core:sample_rate')
 * // { line: 2, column: 3, offset: 4 }
 */
export function jsonKeyPosition(
  text: string,
  key: string,
  options: { from?: number; occurrence?: number } = {},
): (TextPosition & { offset: number }) | undefined {
  const escaped = key.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  const pattern = new RegExp(`"${escaped}"\\s*:`, 'g');
  pattern.lastIndex = options.from ?? 0;
  let match: RegExpExecArray | null = null;
  for (let k = 0; k <= (options.occurrence ?? 0); k++) {
    match = pattern.exec(text);
    if (match === null) return undefined;
  }
  return match === null ? undefined : { ...lineColumnAt(text, match.index), offset: match.index };
}
