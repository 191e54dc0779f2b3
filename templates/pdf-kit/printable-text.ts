/**
 * Printed text is limited to the glyphs of the embedded Roboto latin subset, so no character is
 * drawn as an empty box ("tofu").
 *
 * The latin WOFF files of @fontsource/roboto 5 hold printable ASCII, U+00A0-U+00FF (this covers
 * the plus-minus sign, micro sign, degree sign and multiplication sign) and the few code points
 * listed in {@link COVERED_ABOVE_LATIN1}, among them U+2212 MINUS SIGN. Missing symbols get an
 * ASCII spelling (U+2265 -> ">=", U+2264 -> "<=", U+03A9 -> "ohm"); anything else missing becomes
 * "?". The spec checks this list against the font files themselves.
 */

/** Code points above U+00FF that the Roboto latin subset draws (read from its cmap). */
export const COVERED_ABOVE_LATIN1: ReadonlySet<number> = new Set([
  0x0131, 0x0152, 0x0153, 0x02bc, 0x02c6, 0x02da, 0x02dc, 0x2002, 0x2009, 0x2013, 0x2014, 0x2018,
  0x2019, 0x201a, 0x201c, 0x201d, 0x201e, 0x2022, 0x2026, 0x2032, 0x2033, 0x2039, 0x203a, 0x2044,
  0x20ac, 0x2122, 0x2212,
]);

/** ASCII (or covered) spellings for symbols the subset lacks. */
export const GLYPH_FALLBACKS: Readonly<Record<string, string>> = {
  '\u2265': '>=',
  '\u2264': '<=',
  '\u2260': '!=',
  '\u2248': '~',
  '\u221e': 'inf',
  '\u221a': 'sqrt',
  '\u03bc': '\u00b5', // Greek small mu -> micro sign, which the subset has
  '\u03a9': 'ohm',
  '\u2126': 'ohm',
  '\u0394': 'delta',
  '\u2206': 'delta',
  '\u2192': '->',
  '\u2190': '<-',
  '\u2010': '-',
  '\u2011': '-',
  '\u2012': '\u2013',
  '\u2015': '\u2014',
  '\u202f': '\u00a0',
  '\u2007': ' ',
  '\u2030': ' per mille',
  '\u2713': 'OK',
  '\u2714': 'OK',
  '\u2717': 'X',
};

/** True when the embedded subset has a glyph for the code point (newline counts as layout). */
export function isPrintableCodePoint(codePoint: number): boolean {
  if (codePoint === 0x0a) return true;
  if (codePoint >= 0x20 && codePoint <= 0x7e) return true;
  if (codePoint >= 0xa0 && codePoint <= 0xff) return true;
  return COVERED_ABOVE_LATIN1.has(codePoint);
}

const NEEDS_WORK = /[^\n\x20-\x7e]/;

/**
 * Maps a string onto the glyphs the embedded font can draw.
 *
 * NFC first (a letter plus combining accent becomes one covered letter), then each missing code
 * point is replaced by its fallback, tabs and other controls by a space, and anything else by "?".
 * Pure ASCII returns the same string without allocating. Non-string input throws a TypeError.
 * @example toPrintableText('\u2265 40 dB, \u00b1 1.2 dB') // '>= 40 dB, \u00b1 1.2 dB'
 */
export function toPrintableText(text: string): string {
  if (typeof text !== 'string') {
    throw new TypeError(`toPrintableText: expected a string, got ${typeof text}`);
  }
  if (!NEEDS_WORK.test(text)) return text;
  let out = '';
  for (const ch of text.normalize('NFC')) {
    const codePoint = ch.codePointAt(0) ?? 0x3f;
    if (isPrintableCodePoint(codePoint)) out += ch;
    else if (ch in GLYPH_FALLBACKS) out += GLYPH_FALLBACKS[ch];
    else if (codePoint < 0x20 || (codePoint >= 0x7f && codePoint < 0xa0)) out += ' ';
    else out += '?';
  }
  return out;
}
