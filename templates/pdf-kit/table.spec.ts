import { pdfPageCount, pdfPageTexts, savePdfArtifact } from './pdf-inspection';
import { renderSectionsToPdf } from './render-sections';
import { drawTable } from './table';

const options = {
  metadata: { title: 'Table', author: 'test', subject: 'table' },
  furniture: { headerLeft: 'Lab', headerRight: 'T-1', footerLeft: 'T-1' },
};

const LONG_TEXT = 'A long description that has to wrap onto a second line inside its narrow column';

describe('drawTable', () => {
  jest.setTimeout(20000);

  it('breaks 120 rows across pages, repeats the header on each page and never splits or loses a row', async () => {
    const rows = Array.from({ length: 120 }, (_, i) => [
      `Row ${String(i + 1).padStart(3, '0')}`,
      i % 7 === 0 ? LONG_TEXT : 'Short',
      (i * 1.25).toFixed(2),
    ]);
    let pagesTouched = 0;
    const { pdf, pageCount } = await renderSectionsToPdf(
      {},
      [
        {
          id: 'table',
          render: (ctx) =>
            (pagesTouched = drawTable(ctx, {
              columns: [
                { header: 'Identifier', widthWeight: 1 },
                { header: 'Description', widthWeight: 2 },
                { header: 'Reading', widthWeight: 1, align: 'right' },
              ],
              rows,
            })),
        },
      ],
      options,
    );
    const file = savePdfArtifact('table-spec-120-rows', pdf);
    expect(pdfPageCount(file)).toBe(pageCount);
    expect(pageCount).toBeGreaterThan(1);
    expect(pagesTouched).toBe(pageCount);
    const pages = pdfPageTexts(file);
    const seen: string[] = [];
    pages.forEach((text) => {
      // Header first on every page, before any row.
      const header = text.search(/Identifier\s+Description\s+Reading/);
      expect(header).toBeGreaterThanOrEqual(0);
      const ids = [...text.matchAll(/Row (\d{3})/g)];
      expect(ids.length).toBeGreaterThan(0);
      expect(ids[0].index).toBeGreaterThan(header);
      seen.push(...ids.map((m) => m[1]));
    });
    expect(seen).toEqual(rows.map((r) => r[0].slice(4)));
    // A wrapped description lands whole on one page: both of its lines sit on the page of its row.
    for (const text of pages) {
      const wraps = (text.match(/A long description/g) ?? []).length;
      const ends = (text.match(/narrow column/g) ?? []).length;
      expect(ends).toBe(wraps);
    }
  });

  it('rejects a row whose cell count differs from the columns', async () => {
    await expect(
      renderSectionsToPdf(
        {},
        [
          {
            id: 't',
            render: (ctx) =>
              drawTable(ctx, { columns: [{ header: 'A', widthWeight: 1 }], rows: [['1', '2']] }),
          },
        ],
        options,
      ),
    ).rejects.toThrow(/drawTable: a row has 2 cells for 1 columns/);
  });
});
