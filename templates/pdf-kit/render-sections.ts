/**
 * The generator core shared by the report and the certificate: a document is plain data plus an
 * ordered list of section renderers. The core creates the A4 document, embeds Roboto, lets each
 * section draw in turn, stamps header and footer ("Page x of y") on every page and returns the
 * finished bytes. Adding a section means adding one entry to a list, not editing this file.
 */
import PDFDocument from 'pdfkit';
import { stampPageFurniture, type PageFurniture } from './page-furniture';
import { RenderContext } from './render-context';
import { registerRobotoFonts } from './roboto-fonts';
import { DEFAULT_THEME, type Theme } from './theme';

/** One part of a document: an id (unique in its list) and a renderer drawing from the cursor. */
export interface DocumentSection<T> {
  readonly id: string;
  render(ctx: RenderContext, data: T): void;
}

export interface PdfMetadata {
  title: string;
  author: string;
  subject: string;
  keywords?: string;
  /** Defaults to now. */
  creationDate?: Date;
}

export interface RenderedPdf {
  pdf: Buffer;
  pageCount: number;
}

export interface RenderOptions {
  metadata: PdfMetadata;
  furniture: PageFurniture;
  theme?: Theme;
}

/**
 * Renders `data` through `sections` into a PDF. Duplicate section ids throw a RangeError before
 * drawing; an error inside a section is rethrown as an Error naming the section (original as
 * `cause`).
 * @example await renderSectionsToPdf(report, REPORT_SECTIONS, options)
 *   // { pdf: <Buffer 25 50 44 46 ...>, pageCount: 5 }
 */
export async function renderSectionsToPdf<T>(
  data: T,
  sections: readonly DocumentSection<T>[],
  options: RenderOptions,
): Promise<RenderedPdf> {
  const ids = new Set<string>();
  for (const section of sections) {
    if (ids.has(section.id)) {
      throw new RangeError(`renderSectionsToPdf: duplicate section id "${section.id}"`);
    }
    ids.add(section.id);
  }
  const theme = options.theme ?? DEFAULT_THEME;
  const { metadata } = options;
  const doc = new PDFDocument({
    size: 'A4',
    margins: theme.marginsPt,
    bufferPages: true,
    pdfVersion: '1.7',
    lang: 'en-GB',
    displayTitle: true,
    // No default font: pdfkit would otherwise parse the Helvetica metrics for every document.
    font: '',
    info: {
      Title: metadata.title,
      Author: metadata.author,
      Subject: metadata.subject,
      ...(metadata.keywords === undefined ? {} : { Keywords: metadata.keywords }),
      Creator: 'Sidecheck',
      Producer: 'Sidecheck report generator (pdfkit)',
      CreationDate: metadata.creationDate ?? new Date(),
    },
  });
  const chunks: Buffer[] = [];
  const finished = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  registerRobotoFonts(doc);
  const ctx = new RenderContext(doc, theme);
  ctx.y = ctx.frame.topPt;
  for (const section of sections) {
    try {
      section.render(ctx, data);
    } catch (error) {
      doc.end();
      await finished.catch(() => undefined);
      const reason = (error as Error).message;
      throw new Error(`renderSectionsToPdf: section "${section.id}" failed: ${reason}`, {
        cause: error,
      });
    }
  }
  const pageCount = stampPageFurniture(doc, theme, options.furniture);
  doc.end();
  return { pdf: await finished, pageCount };
}
