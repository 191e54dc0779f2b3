import { pdfPageCount, pdfPageTexts, savePdfArtifact } from '../pdf-kit/pdf-inspection';
import { buildSampleReceipt, receiptTotalMinor } from './receipt-document';
import { renderReceiptPdf } from './render-receipt';

jest.setTimeout(60000);
const flat = (s: string) => s.replace(/\s+/g, ' ');

describe('receipt PDF', () => {
  it('prints number, parties, lines and total on one page (read back with pdftotext)', async () => {
    const receipt = buildSampleReceipt({
      lines: [
        { description: 'Report credits, pack of 20', quantity: 1, unitPriceMinor: 290000 },
        { description: 'Report credit', quantity: 2, unitPriceMinor: 18000 },
      ],
    });
    const { pdf, pageCount } = await renderReceiptPdf(receipt);
    const file = savePdfArtifact('receipt-spec-sample', pdf);
    expect(pageCount).toBe(1);
    expect(pdfPageCount(file)).toBe(1); // pdfinfo (poppler), independent of pdfkit
    const text = flat(pdfPageTexts(file)[0]);
    // 2900.00 + 2 x 180.00 = 3260.00 (arithmetic by hand)
    for (const s of [
      'Receipt',
      'KBRTL-R2026-0007',
      'Kestrel Bay Radio Test Laboratory',
      'Halyard Marine Radio Works',
      'Report credits, pack of 20',
      'GBP 2,900.00',
      'GBP 360.00',
      'Total paid: GBP 3,260.00',
      'pi_sample_0001',
      'Page 1 of 1',
      'not a tax invoice',
    ]) {
      expect(text).toContain(s);
    }
  });

  it('totals in whole minor units and refuses lines it cannot total', () => {
    const line = (quantity: number, unitPriceMinor: number) => ({
      description: 'a',
      quantity,
      unitPriceMinor,
    });
    expect(receiptTotalMinor([line(3, 1), line(1, 7)])).toBe(10); // 3 x 1 + 1 x 7 (arithmetic)
    expect(() => receiptTotalMinor([])).toThrow(/^receiptTotalMinor:/);
    expect(() => receiptTotalMinor([line(0.5, 1)])).toThrow(RangeError);
    expect(() => receiptTotalMinor([line(1, -1)])).toThrow(RangeError);
  });

  it('names the failing section when the currency is unknown', async () => {
    await expect(renderReceiptPdf(buildSampleReceipt({ currency: 'XYZ' }))).rejects.toThrow(
      /section "lines" failed: formatMoney: unknown currency/,
    );
  });
});
