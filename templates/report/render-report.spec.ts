import QRCode from 'qrcode';
import { execFileSync } from 'node:child_process';
import {
  pdfFonts,
  pdfPageCount,
  pdfPageTexts,
  renderPagesToPng,
  savePdfArtifact,
} from '../pdf-kit/pdf-inspection';
import type { RenderContext } from '../pdf-kit/render-context';
import { renderReportPdf } from './render-report';
import type { ReportDocument } from './report-document';
import { REPORT_SECTIONS } from './report-sections';
import { buildSampleReportDocument } from './sample-report-document';
import { buildSampleResults } from './sample-report-results';

jest.setTimeout(60000);

const flat = (s: string) => s.replace(/\s+/g, ' ');

async function renderToFile(report: ReportDocument, name: string, sections = REPORT_SECTIONS) {
  const { pdf, pageCount } = await renderReportPdf(report, { sections });
  const file = savePdfArtifact(name, pdf);
  return { pdf, pageCount, file, pages: pdfPageTexts(file) };
}

describe('renderReportPdf: the items ISO/IEC 17025:2017 7.8 asks for', () => {
  const results = buildSampleResults();
  results[5] = { ...results[5], externalProvider: 'Brackwater EMC Services' };
  const report = buildSampleReportDocument({
    revision: 1,
    replaces: { reportNumber: 'KRT-2025-0131', reason: 'The serial number was printed wrongly.' },
    deviations: ['Spurious emissions were measured up to 30 MHz only, as agreed with the client.'],
    results,
  });
  let rendered: Awaited<ReturnType<typeof renderToFile>>;
  let all: string;

  beforeAll(async () => {
    rendered = await renderToFile(report, 'report-spec-full');
    all = flat(rendered.pages.join('\n'));
  });

  it('agrees with pdfinfo on the page count and every page renders (pdftoppm)', () => {
    expect(pdfPageCount(rendered.file)).toBe(rendered.pageCount);
    expect(renderPagesToPng(rendered.file, 'report-spec-full')).toHaveLength(rendered.pageCount);
  });

  it('7.8.2.1 d: report number and "Page x of y" on every page, a clear end mark on the last', () => {
    const n = rendered.pageCount;
    expect(rendered.pages).toHaveLength(n);
    rendered.pages.forEach((text, i) => {
      expect(text).toContain(report.reportNumber);
      expect(flat(text)).toContain(`Page ${i + 1} of ${n}`);
      expect(text.includes('End of report')).toBe(i === n - 1);
    });
  });

  it.each([
    ['a) title', () => [report.title]],
    ['b) lab name and address', () => [report.lab.name, ...report.lab.addressLines]],
    ['c) where the work was done', () => [report.testSite]],
    [
      'e) client name and contact',
      () => [
        report.client.name,
        report.client.contactName,
        report.client.contactEmail,
        ...report.client.addressLines,
      ],
    ],
    [
      'f) method: rule set with version',
      () => [report.method.ruleSetName, `version ${report.method.ruleSetVersion}`],
    ],
    [
      'f) method: each referenced document, clause and edition',
      () => report.method.references.flatMap((r) => [r.document, r.edition, r.clause ?? '']),
    ],
    [
      'g) item description, identification and condition',
      () => [
        report.device.manufacturer,
        report.device.model,
        report.device.serialNumber,
        report.device.firmware ?? '',
        report.device.emissionDesignator,
        report.device.condition,
      ],
    ],
    [
      'h, i, j) dates of receipt, testing and issue',
      () => [
        'Date of receipt',
        report.dates.received,
        'Dates of testing',
        `${report.dates.testedFrom} to ${report.dates.testedTo}`,
        'Date of issue',
        report.dates.issued,
      ],
    ],
    ['k) sampling', () => ['Sampling', 'Not applicable']],
    [
      'l) results relate only to the item tested',
      () => ['The results relate only to the item tested'],
    ],
    [
      'm) results with unit, limit, margin, U with k and verdict in words',
      () => [
        'Result',
        'Limit',
        'Margin',
        'U (k)',
        'Verdict',
        '46.31 dB',
        '+6.31 dB',
        '\u00b11.21 dB (k = 2)',
        'Pass',
        'Conditional pass',
        'Not evaluated',
      ],
    ],
    [
      'n) additions, deviations and exclusions',
      () => ['Additions, deviations and exclusions', report.deviations[0]],
    ],
    [
      'o) who tested; who authorized, with role and signature line',
      () => [
        report.testedBy.name,
        report.testedBy.role,
        report.authorizedBy.name,
        report.authorizedBy.role,
        'Authorized on 2025-03-10 14:32 UTC',
        'Signature',
      ],
    ],
    [
      'p) results from an external provider are marked',
      () => ['(external: Brackwater EMC Services)'],
    ],
    [
      '7.8.3.1 test conditions',
      () => report.conditions.flatMap((c) => [c.label, c.value.replace('\u03a9', 'ohm')]),
    ],
    ['7.8.6 decision rule', () => [report.decisionRule, 'Conditional fail']],
    [
      '7.8.8 amendment: what it replaces and why',
      () => [
        'amends and replaces report KRT-2025-0131',
        'The serial number was printed wrongly.',
        'Revision',
      ],
    ],
    [
      'equipment used',
      () => report.equipment.flatMap((e) => [e.name, e.serialNumber, e.calibrationDue]),
    ],
    [
      'RF safety caution',
      () => [
        'Safety caution',
        'burns',
        'expose people to RF fields',
        'high voltage',
        'run hot',
        'local regulations',
        'RF-exposure rules',
        'licensed practice',
      ],
    ],
    [
      'verification address printed beside the QR code',
      () => [report.verificationUrl, 'Verify this report'],
    ],
    ['engine version', () => [`measurement engine ${report.engineVersion}`]],
    ['figures', () => ['Figure 1.', 'Figure 2.', 'Offset from assigned frequency (Hz)']],
  ])('%s', (_item, expected) => {
    for (const text of expected()) expect(all).toContain(flat(text));
  });

  it('draws the verification QR as vectors, embeds only Roboto, and prints no missing-glyph marks', () => {
    const fonts = pdfFonts(rendered.file);
    expect(fonts.length).toBeGreaterThanOrEqual(2);
    for (const f of fonts) {
      expect(f.name).toMatch(/\+Roboto-(Regular|Medium|Bold)$/);
      expect(f.embedded).toBe(true);
    }
    // U+2265 falls back to ">=" (the latin subset lacks it); no "?" stands in for a glyph.
    expect(all).toContain('>= 40 dB below PEP');
    expect(all).not.toContain('\u2265');
    expect(all).not.toMatch(/\?/);
    for (const kept of ['\u00b1', '\u00b0', '\u2212']) expect(all).toContain(kept);
  });
});

describe('renderReportPdf: results table of 120 rows', () => {
  it('breaks across pages with the header row repeated before the rows of each page', async () => {
    const results = buildSampleResults({ count: 120, plotCount: 0 }).map((r, i) => ({
      ...r,
      testPoint: `TP-${String(i + 1).padStart(3, '0')}`,
      note: undefined,
      plot: undefined,
    }));
    const { pages } = await renderToFile(
      buildSampleReportDocument({ results }),
      'report-spec-120-rows',
    );
    const seen: string[] = [];
    let pagesWithRows = 0;
    for (const text of pages) {
      const ids = [...text.matchAll(/TP-(\d{3})/g)];
      if (ids.length === 0) continue;
      pagesWithRows += 1;
      const header = text.search(/Test point\s+Result\s+Limit\s+Margin\s+U \(k\)\s+Verdict/);
      expect(header).toBeGreaterThanOrEqual(0);
      expect(ids[0].index).toBeGreaterThan(header);
      seen.push(...ids.map((m) => m[1]));
    }
    expect(pagesWithRows).toBeGreaterThanOrEqual(3);
    expect(seen).toEqual(results.map((r) => r.testPoint.slice(3)));
  });
});

describe('renderReportPdf: variants and the section list', () => {
  it('prints "None." when there are no deviations, and no amendment notice for a first issue', async () => {
    const { pages } = await renderToFile(buildSampleReportDocument(), 'report-spec-first-issue');
    const all = flat(pages.join('\n'));
    expect(all).toMatch(/Additions, deviations and exclusions None\./);
    expect(all).not.toContain('amends and replaces');
  });

  it('places the lab logo from the document as an image', async () => {
    const logoPng = await QRCode.toBuffer('logo stand-in', { type: 'png', width: 120 });
    const { file } = await renderToFile(
      buildSampleReportDocument({ lab: { ...buildSampleReportDocument().lab, logoPng } }),
      'report-spec-logo',
    );
    const listing = execFileSync('pdfimages', ['-list', file], { encoding: 'utf8' }).split('\n');
    const images = listing.slice(2).filter((l) => l.trim());
    expect(images.length).toBeGreaterThanOrEqual(1);
  });

  it('renders a section added to the list without changing the generator', async () => {
    const extra = {
      id: 'lab-remark',
      render: (ctx: RenderContext) => ctx.paragraph('Remark added by a custom section.'),
    };
    const { pages } = await renderToFile(
      buildSampleReportDocument(),
      'report-spec-extra-section',
      [...REPORT_SECTIONS.slice(0, -1), extra, REPORT_SECTIONS[REPORT_SECTIONS.length - 1]],
    );
    expect(flat(pages.join('\n'))).toContain('Remark added by a custom section.');
  });

  it('refuses duplicate section ids and names a failing section', async () => {
    const twice = [REPORT_SECTIONS[0], REPORT_SECTIONS[0]];
    await expect(renderReportPdf(buildSampleReportDocument(), { sections: twice })).rejects.toThrow(
      /duplicate section id "title-block"/,
    );
    const broken = {
      id: 'broken',
      render: () => {
        throw new Error('boom');
      },
    };
    const sample = buildSampleReportDocument();
    await expect(renderReportPdf(sample, { sections: [broken] })).rejects.toThrow(
      /section "broken" failed: boom/,
    );
  });

  it('refuses an unknown verdict instead of printing a blank', async () => {
    const results = buildSampleResults();
    results[0] = { ...results[0], verdict: 'maybe' as unknown as 'pass' };
    await expect(renderReportPdf(buildSampleReportDocument({ results }))).rejects.toThrow(
      /verdictLabel: unknown verdict "maybe"/,
    );
  });
});
