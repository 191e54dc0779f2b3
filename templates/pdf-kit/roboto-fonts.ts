/**
 * Embeds Roboto (latin subset, WOFF) in a PDF under the three font roles of the theme.
 *
 * pdfkit reads TTF and WOFF but not WOFF2, so the .woff files of @fontsource/roboto are used,
 * unwrapped once per process to plain TrueType (see woff-to-sfnt.ts for why). pdfkit subsets the
 * font per document, so only the glyphs actually printed are embedded. The
 * latin subset lacks some symbols (for example U+2265 and U+2264): text goes through
 * {@link toPrintableText} before it is drawn.
 */
import fs from 'node:fs';
import type { FontRole } from './theme';
import { woffToSfnt } from './woff-to-sfnt';

/** Roboto weights per role: 400 regular, 500 medium, 700 bold. */
const WEIGHT_BY_ROLE: Record<FontRole, number> = { regular: 400, medium: 500, bold: 700 };

let cachedFiles: Record<FontRole, Buffer> | undefined;

/** Path of the latin WOFF file for one weight, resolved through the package's exports map. */
export function robotoWoffPath(weight: number): string {
  return require.resolve(`@fontsource/roboto/files/roboto-latin-${weight}-normal.woff`);
}

/** The fonts as TrueType bytes, read and unwrapped once per process, shared by every document. */
export function robotoFontFiles(): Record<FontRole, Buffer> {
  if (!cachedFiles) {
    const read = (role: FontRole) =>
      woffToSfnt(fs.readFileSync(robotoWoffPath(WEIGHT_BY_ROLE[role])));
    cachedFiles = { regular: read('regular'), medium: read('medium'), bold: read('bold') };
  }
  return cachedFiles;
}

/**
 * Registers the three roles on a document and selects the regular face.
 * @example registerRobotoFonts(doc); doc.font('bold');
 */
export function registerRobotoFonts(doc: PDFKit.PDFDocument): void {
  const files = robotoFontFiles();
  for (const role of Object.keys(WEIGHT_BY_ROLE) as FontRole[]) doc.registerFont(role, files[role]);
  doc.font('regular');
}
