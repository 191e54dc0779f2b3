import fs from 'node:fs';
import {
  COVERED_ABOVE_LATIN1,
  GLYPH_FALLBACKS,
  isPrintableCodePoint,
  toPrintableText,
} from './printable-text';
import { robotoWoffPath } from './roboto-fonts';

// fontkit (the font parser pdfkit itself uses, a separate npm package) reads the cmap of the
// very WOFF files we embed: the reference for which glyphs exist.
interface FontkitFont {
  hasGlyphForCodePoint(codePoint: number): boolean;
}
// eslint-disable-next-line @typescript-eslint/no-require-imports
const fontkit = require('fontkit') as { create(data: Buffer): FontkitFont };
const fonts = [
  400,
  500,
  700,
].map((weight) => fontkit.create(fs.readFileSync(robotoWoffPath(weight))));
const inAllWeights = (cp: number) => fonts.every((f) => f.hasGlyphForCodePoint(cp));

describe('toPrintableText against the embedded Roboto latin files', () => {
  it('treats as printable only code points every weight can draw', () => {
    const claimed = [
      ...Array.from({ length: 0x7f - 0x20 }, (_, i) => 0x20 + i),
      ...Array.from({ length: 0x100 - 0xa0 }, (_, i) => 0xa0 + i),
      ...COVERED_ABOVE_LATIN1,
    ];
    const missing = claimed.filter((cp) => !inAllWeights(cp)).map((cp) => cp.toString(16));
    expect(missing).toEqual([]);
  });

  it('has the symbols a report needs: plus-minus, micro, degree, minus, multiplication', () => {
    for (const ch of ['\u00b1', '\u00b5', '\u00b0', '\u2212', '\u00d7']) {
      expect(inAllWeights(ch.codePointAt(0)!)).toBe(true);
      expect(toPrintableText(ch)).toBe(ch);
    }
  });

  it('replaces only symbols the font really lacks, with printable spellings', () => {
    const needless = Object.keys(GLYPH_FALLBACKS).filter(
      (symbol) => inAllWeights(symbol.codePointAt(0)!),
    );
    expect(needless).toEqual([]);
    for (const spelling of Object.values(GLYPH_FALLBACKS)) {
      for (const ch of spelling) expect(isPrintableCodePoint(ch.codePointAt(0)!)).toBe(true);
    }
  });

  it('spells the missing comparison signs in ASCII', () => {
    expect(toPrintableText('\u2265 40 dB')).toBe('>= 40 dB');
    expect(toPrintableText('\u2264 20 Hz')).toBe('<= 20 Hz');
    expect(toPrintableText('50 \u03a9, 3 \u03bcs')).toBe('50 ohm, 3 \u00b5s');
  });

  it('composes accents before checking (NFC), so e + combining acute stays one covered letter', () => {
    expect(toPrintableText('caf' + 'e\u0301')).toBe('caf\u00e9');
  });

  it('never emits a code point the font cannot draw', () => {
    const mixed = 'Z\u00fcrich \u2265 \u4e2d\u6587 \u{1f4e1} \t tab \u2030 \u0416';
    const out = toPrintableText(mixed);
    for (const ch of out) expect(ch === '\n' || inAllWeights(ch.codePointAt(0)!)).toBe(true);
    expect(out).toContain('?');
  });

  it('returns ASCII unchanged and rejects non-strings', () => {
    const ascii = 'Report KRT-2025-0142, page 1 of 3';
    expect(toPrintableText(ascii)).toBe(ascii);
    expect(() => toPrintableText(42 as unknown as string)).toThrow(/^toPrintableText: /);
  });
});
