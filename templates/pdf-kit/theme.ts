/**
 * Printed as the look of every Sidecheck PDF: A4 geometry, margins, type sizes and the colour set.
 *
 * One accent colour (a deep teal) carries headings, rules and the trace in plots; everything
 * else is greys, so the page stays quiet. Verdict colours only reinforce the verdict word, they
 * never replace it. Lengths are PDF points (1/72 inch).
 */

/** A4 in points: 210 mm x 297 mm (ISO 216), 1 mm = 72 / 25.4 pt. */
export const A4_SIZE_PT = { widthPt: 595.28, heightPt: 841.89 } as const;

/** The three registered font roles; {@link registerRobotoFonts} binds them to Roboto weights. */
export type FontRole = 'regular' | 'medium' | 'bold';

export interface Theme {
  /** Page margins around the content frame; the header and footer sit inside these margins. */
  marginsPt: { top: number; right: number; bottom: number; left: number };
  colors: {
    accent: string;
    accentTint: string;
    text: string;
    muted: string;
    rule: string;
    limit: string;
    pass: string;
    conditional: string;
    fail: string;
  };
  /** Font sizes in points. */
  sizesPt: {
    title: number;
    heading: number;
    subheading: number;
    body: number;
    small: number;
    tiny: number;
  };
  /** Extra space between lines of body text, in points. */
  lineGapPt: number;
}

/** The default look: deep teal accent, 20 mm side margins, 9.5 pt body text. */
export const DEFAULT_THEME: Theme = {
  marginsPt: { top: 72, right: 57, bottom: 64, left: 57 },
  colors: {
    accent: '#0b5d63',
    accentTint: '#e7f1f1',
    text: '#1f2328',
    muted: '#5d6670',
    rule: '#c9d0d6',
    limit: '#a3312a',
    pass: '#0b5d63',
    conditional: '#8a5a00',
    fail: '#a3312a',
  },
  sizesPt: { title: 20, heading: 12.5, subheading: 10.5, body: 9.5, small: 8, tiny: 7 },
  lineGapPt: 1.5,
};
