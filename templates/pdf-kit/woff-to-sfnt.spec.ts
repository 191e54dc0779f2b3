import fs from 'node:fs';
import { robotoWoffPath } from './roboto-fonts';
import { woffToSfnt } from './woff-to-sfnt';

// Reference: fontkit (an independent font parser) reading the original WOFF must see the same
// font as when it reads our unwrapped sfnt.
interface FontkitFont {
  numGlyphs: number;
  unitsPerEm: number;
  postscriptName: string;
  characterSet: number[];
  glyphForCodePoint(cp: number): { id: number; advanceWidth: number; path: { toSVG(): string } };
  layout(text: string): { advanceWidth: number; glyphs: { id: number }[] };
}
// eslint-disable-next-line @typescript-eslint/no-require-imports
const fontkit = require('fontkit') as { create(data: Buffer): FontkitFont };

describe('woffToSfnt', () => {
  it.each([
    400,
    500,
    700,
  ])('unwraps Roboto %p to a TrueType font identical in glyphs, metrics and shaping', (weight) => {
    const woff = fs.readFileSync(robotoWoffPath(weight));
    const sfnt = woffToSfnt(woff);
    expect(sfnt.readUInt32BE(0)).toBe(0x00010000); // TrueType outlines flavor
    const a = fontkit.create(woff);
    const b = fontkit.create(sfnt);
    expect([b.numGlyphs, b.unitsPerEm, b.postscriptName]).toEqual([
      a.numGlyphs,
      a.unitsPerEm,
      a.postscriptName,
    ]);
    expect(b.characterSet).toEqual(a.characterSet);
    for (const cp of a.characterSet) {
      const ga = a.glyphForCodePoint(cp);
      const gb = b.glyphForCodePoint(cp);
      expect([gb.id, gb.advanceWidth]).toEqual([ga.id, ga.advanceWidth]);
    }
    expect(b.glyphForCodePoint(0x42).path.toSVG()).toBe(a.glyphForCodePoint(0x42).path.toSVG());
    const text = 'Office fluff, AV Wa To \u00b11.21 dB';
    expect(b.layout(text).advanceWidth).toBe(a.layout(text).advanceWidth);
  });

  it('refuses WOFF2 and other files', () => {
    const woff2 = fs.readFileSync(robotoWoffPath(400).replace(/\.woff$/, '.woff2'));
    expect(() => woffToSfnt(woff2)).toThrow(/^woffToSfnt: not a WOFF 1.0 file/);
    expect(() => woffToSfnt(Buffer.from('hello'))).toThrow(RangeError);
  });
});
