/**
 * Test support (not used in production): reads PDFs back with independent tools, Poppler
 * (pdftotext, pdftoppm, pdfinfo, pdffonts, pdfsig) and qpdf, and keeps the files under
 * artifacts/reports/ (git-ignored) so a person can open what the tests saw. pdfsig exits 0 even
 * for a broken signature, so callers must read its text.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

/** artifacts/reports/ at the repository root, created on first use. */
export function reportArtifactsDir(): string {
  const dir = path.resolve(__dirname, '..', '..', 'artifacts', 'reports');
  fs.mkdirSync(path.join(dir, 'png'), { recursive: true });
  return dir;
}

/** Writes the PDF to artifacts/reports/<name>.pdf and returns the path. */
export function savePdfArtifact(name: string, pdf: Buffer): string {
  const file = path.join(reportArtifactsDir(), `${name}.pdf`);
  fs.writeFileSync(file, pdf);
  return file;
}

function run(tool: string, args: string[]): string {
  return execFileSync(tool, args, {
    encoding: 'latin1',
    maxBuffer: 64 * 1024 * 1024,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
}

/**
 * The text of each page, UTF-8, pages split on form feeds. 'raw' (default) keeps content-stream
 * order, so each table cell's text stays together; 'layout' keeps the physical arrangement.
 */
export function pdfPageTexts(file: string, mode: 'raw' | 'layout' = 'raw'): string[] {
  const args = [`-${mode}`, '-enc', 'UTF-8', file, '-'];
  const out = execFileSync('pdftotext', args, { maxBuffer: 64 * 1024 * 1024 }).toString('utf8');
  const pages = out.split('\f');
  if (pages[pages.length - 1].trim() === '') pages.pop();
  return pages;
}

/** Page count as pdfinfo reports it. */
export function pdfPageCount(file: string): number {
  const match = /^Pages:\s+(\d+)/m.exec(run('pdfinfo', [file]));
  if (!match) throw new Error(`pdfPageCount: pdfinfo printed no page count for ${file}`);
  return Number(match[1]);
}

/** Renders every page to artifacts/reports/png/<name>-<n>.png and returns the PNG paths. */
export function renderPagesToPng(file: string, name: string, dpi = 60): string[] {
  const dir = path.join(reportArtifactsDir(), 'png');
  for (const old of fs.readdirSync(dir)) {
    if (old.startsWith(`${name}-`) && old.endsWith('.png')) fs.unlinkSync(path.join(dir, old));
  }
  run('pdftoppm', ['-r', String(dpi), '-png', file, path.join(dir, name)]);
  return fs
    .readdirSync(dir)
    .filter((f) => f.startsWith(`${name}-`) && /-\d+\.png$/.test(f))
    .map((f) => path.join(dir, f));
}

/** pdffonts output rows: font name and whether it is embedded. */
export function pdfFonts(file: string): { name: string; embedded: boolean }[] {
  return run('pdffonts', [file])
    .split('\n')
    .slice(2)
    .filter((line) => line.trim() !== '')
    .map((line) => {
      const cols = line.trim().split(/\s+/);
      // Columns from the right: emb sub uni object-number generation.
      return { name: cols[0], embedded: cols[cols.length - 5] === 'yes' };
    });
}

/** pdfsig's full report for the file. */
export function pdfSignatureReport(file: string): string {
  return run('pdfsig', [file]);
}

/** The PDF with streams uncompressed (qpdf --qdf), for counting drawing operators. */
export function uncompressedPdf(file: string): string {
  const out = `${file}.qdf`;
  try {
    execFileSync('qpdf', ['--qdf', '--object-streams=disable', file, out], { stdio: 'ignore' });
  } catch (error) {
    // qpdf exits 3 for warnings only; the output file is still written.
    if (!fs.existsSync(out)) throw error;
  }
  const text = fs.readFileSync(out, 'latin1');
  fs.unlinkSync(out);
  return text;
}

/** Grey-level raster of one page (pdftoppm -gray, PGM P5): width, height and 0-255 pixels. */
export function renderPageGray(
  file: string,
  page: number,
  dpi: number,
): { width: number; height: number; pixels: Buffer } {
  const args = ['-gray', '-r', String(dpi), '-f', String(page), '-l', String(page), '-singlefile'];
  const data = execFileSync('pdftoppm', [...args, file], { maxBuffer: 256 * 1024 * 1024 });
  const header = /^P5\s+(\d+)\s+(\d+)\s+255\s/.exec(data.subarray(0, 64).toString('latin1'));
  if (!header) throw new Error('renderPageGray: pdftoppm did not return a PGM image');
  const pixels = data.subarray(header[0].length);
  return { width: Number(header[1]), height: Number(header[2]), pixels };
}
