import { pdfPageTexts, savePdfArtifact, uncompressedPdf } from './pdf-inspection';
import { drawPlot } from './plot';
import type { PlotSpec } from './plot-spec';
import { renderSectionsToPdf } from './render-sections';
import { execFileSync } from 'node:child_process';

const options = {
  metadata: { title: 'Plot', author: 'test', subject: 'plot' },
  furniture: { headerLeft: '', headerRight: '', footerLeft: '' },
};

function countOperator(pdfText: string, op: 'l' | 'm'): number {
  return (pdfText.match(new RegExp(`\\s${op}\\n`, 'g')) ?? []).length;
}

async function renderPlot(spec: PlotSpec, name: string): Promise<string> {
  const { pdf } = await renderSectionsToPdf(
    {},
    [
      {
        id: 'plot',
        render: (ctx) => {
          const { leftPt, widthPt } = ctx.frame;
          drawPlot(ctx, spec, { xPt: leftPt, yPt: ctx.y, widthPt, heightPt: 280 });
        },
      },
    ],
    options,
  );
  return savePdfArtifact(name, pdf);
}

describe('drawPlot', () => {
  jest.setTimeout(20000);
  const n = 1000;
  const x = Array.from({ length: n }, (_, i) => -10000 + (20000 * i) / (n - 1));
  const y = x.map((v) => (Math.abs(v) < 1500 ? -3 : -60));
  const spec: PlotSpec = {
    title: 'Emission mask test plot',
    xLabel: 'Offset from carrier (Hz)',
    yLabel: 'Level (dB)',
    series: [
      { name: 'Trace', x, y, role: 'trace' },
      {
        name: 'Mask',
        x: [-10000, -1500, -1500, 1500, 1500, 10000],
        y: [-43, -43, 0, 0, -43, -43],
        role: 'limit',
      },
    ],
    marker: { x: 1500, y: -3, label: 'Worst point' },
  };

  it('draws the trace as vector line segments, one per point, and no images', async () => {
    const file = await renderPlot(spec, 'plot-spec-trace');
    const text = uncompressedPdf(file);
    // 999 segments of the trace + 5 of the limit + grid, ticks and legend lines.
    expect(countOperator(text, 'l')).toBeGreaterThanOrEqual(999 + 5);
    const listing = execFileSync('pdfimages', ['-list', file], { encoding: 'utf8' }).split('\n');
    expect(listing.slice(2).filter((l) => l.trim()).length).toBe(0);
  });

  it('prints the title, legend, axis captions, tick labels and the marker label', async () => {
    const file = await renderPlot(spec, 'plot-spec-labels');
    const page = pdfPageTexts(file)[0];
    const expected = ['Emission mask test plot', 'Trace', 'Mask', 'Offset from carrier (Hz)'];
    expected.push('Worst point', '\u221210000', '10000', '\u221260');
    for (const s of expected) expect(page).toContain(s);
    // The y caption is rotated; pdftotext may break it, so look for its words.
    expect(page.replace(/\s+/g, ' ')).toMatch(/Level|\(dB\)/);
  });

  it('draws IMD products as stems (one vertical segment per product)', async () => {
    const products: PlotSpec = {
      title: 'IMD',
      xLabel: 'Frequency (Hz)',
      yLabel: 'Level (dB)',
      series: [
        { name: 'Products', x: [-1000, 400, 1800, 3200], y: [-32, -6, -6, -33], role: 'products' },
      ],
    };
    const file = await renderPlot(products, 'plot-spec-stems');
    const text = uncompressedPdf(file);
    // Each stem is "x y0 m x y1 l" with the same x: find moveTo/lineTo pairs with equal x.
    const stems = [...text.matchAll(/([\d.]+) ([\d.]+) m\n([\d.]+) ([\d.]+) l\n/g)].filter(
      (m) => m[1] === m[3] && m[2] !== m[4],
    );
    expect(stems.length).toBeGreaterThanOrEqual(4);
  });

  it('shows "No data" for an empty plot and rejects unequal series', async () => {
    const empty = await renderPlot(
      {
        title: 'Empty',
        xLabel: 'x',
        yLabel: 'y',
        series: [{ name: 's', x: [], y: [], role: 'trace' }],
      },
      'plot-spec-empty',
    );
    expect(pdfPageTexts(empty)[0]).toContain('No data');
    await expect(
      renderPlot(
        {
          title: 'Bad',
          xLabel: 'x',
          yLabel: 'y',
          series: [{ name: 's', x: [1, 2], y: [1], role: 'trace' }],
        },
        'plot-spec-bad',
      ),
    ).rejects.toThrow(
      /drawPlot: series "s"/,
    );
  });
});
