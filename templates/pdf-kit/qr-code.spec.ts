import QRCode from 'qrcode';
import { renderPageGray, savePdfArtifact } from './pdf-inspection';
import { drawQrCode, QR_QUIET_ZONE_MODULES } from './qr-code';
import type { RenderContext } from './render-context';
import { renderSectionsToPdf } from './render-sections';

const URL_TEXT = 'https://verify.kestrelmoor-rf.example/r/KRT-2025-0142';
const options = {
  metadata: { title: 'QR', author: 'test', subject: 'qr' },
  furniture: { headerLeft: '', headerRight: '', footerLeft: '' },
};

describe('drawQrCode', () => {
  jest.setTimeout(20000);

  it('draws exactly the symbol the qrcode encoder produced, upright, with a white quiet zone', async () => {
    const xPt = 100;
    const yPt = 150;
    const sizePt = 250;
    let count = 0;
    const { pdf } = await renderSectionsToPdf(
      {},
      [{ id: 'qr', render: (ctx) => (count = drawQrCode(ctx, URL_TEXT, xPt, yPt, sizePt)) }],
      options,
    );
    const file = savePdfArtifact('qr-code-spec', pdf);
    // The reference matrix: the qrcode package's own encoding (ISO/IEC 18004) of the same text.
    const { modules } = QRCode.create(URL_TEXT, { errorCorrectionLevel: 'M' });
    expect(count).toBe(modules.size);
    const dpi = 144; // 2 pixels per point
    const image = renderPageGray(file, 1, dpi);
    const modulePt = sizePt / (modules.size + 2 * QR_QUIET_ZONE_MODULES);
    const pixelAt = (row: number, col: number) => {
      const px = Math.round((xPt + (QR_QUIET_ZONE_MODULES + col + 0.5) * modulePt) * (dpi / 72));
      const py = Math.round((yPt + (QR_QUIET_ZONE_MODULES + row + 0.5) * modulePt) * (dpi / 72));
      return image.pixels[py * image.width + px];
    };
    let mismatches = 0;
    for (let r = 0; r < modules.size; r++) {
      for (let c = 0; c < modules.size; c++) {
        if (pixelAt(r, c) < 128 !== Boolean(modules.get(r, c))) mismatches++;
      }
    }
    expect(mismatches).toBe(0);
    for (let i = -QR_QUIET_ZONE_MODULES; i < 0; i++) {
      expect(pixelAt(i, 3)).toBeGreaterThan(200);
      expect(pixelAt(3, i)).toBeGreaterThan(200);
    }
  });

  it('rejects empty text', async () => {
    const section = { id: 'qr', render: (ctx: RenderContext) => drawQrCode(ctx, '', 0, 0, 10) };
    await expect(renderSectionsToPdf({}, [section], options)).rejects.toThrow(/drawQrCode: /);
  });
});
