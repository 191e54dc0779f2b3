import { uploadChartData } from './upload-chart-data';
import type { MaskFigures, UploadAnalysis } from './uploads-api';

const trace = (x: (number | null)[], y: (number | null)[]): UploadAnalysis => ({
  source: 'trace',
  pointCount: x.length,
  startHz: 0,
  stopHz: 0,
  rbwHz: 300,
  carrierHz: 2_182_000,
  sideband: 'usb',
  peak: { frequencyHz: 2_182_000, levelDbm: 40 },
  plot: { x, y },
});

// 47 CFR 80.211(a), 3 kHz authorized bandwidth, 100 W mean (50 dBm): 28 dB down from 1.5 to 4.5 kHz
// (offsets from memory); the mask sits about the assigned frequency.
const mask: MaskFigures = {
  assignedHz: 2_183_400,
  referenceDbm: 50,
  exemptWithinOffsetHz: 1500,
  reference: 'mean',
  segments: [{ fromOffsetHz: 1500, toOffsetHz: 4500, fromRelDb: -28, toRelDb: -28 }],
  worstFrequencyHz: 2_185_500,
  worstOffsetHz: 2100,
  worstMarginDb: 1.5,
  pointCount: 3,
};

describe('uploadChartData', () => {
  it('inserts the exact worst point in frequency order, rings it and evaluates the mask at every point', () => {
    const d = uploadChartData(trace([2_184_000, 2_185_000, 2_186_000], [10, 18, 12]), mask, 20.5);
    expect(Array.from(d.frequencyHz)).toEqual([2_184_000, 2_185_000, 2_185_500, 2_186_000]);
    expect(d.levelDb).toEqual([10, 18, 20.5, 12]);
    expect(d.worstIndex).toBe(2);
    // 2 184 000 is 600 Hz from the assigned frequency: inside the exempt band, no limit. The rest: 50 − 28 = 22 dBm.
    expect(d.limitDb).toEqual([null, 22, 22, 22]);
    expect(d.originHz).toBe(2_183_400);
    expect(d.levelUnit).toBe('dBm');
  });

  it('replaces the level of a plotted point that is the worst point, and drops points with no frequency', () => {
    const d = uploadChartData(trace([2_185_000, null, 2_185_500], [18, 5, 19]), mask, 20.5);
    expect(Array.from(d.frequencyHz)).toEqual([2_185_000, 2_185_500]);
    expect(d.levelDb).toEqual([18, 20.5]);
    expect(d.worstIndex).toBe(1);
  });

  it('draws a trace without a mask about its carrier, and a PSD in dBFS/Hz about 0 Hz with no limit', () => {
    const plain = uploadChartData(trace([1, 2], [3, null]));
    expect(plain).toMatchObject({ limitDb: null, worstIndex: null, originHz: 2_182_000, levelDb: [3, null] });
    const psd = uploadChartData({ source: 'iq', format: 'wav', datatype: 'ri16_le', sampleRateHz: 48_000, sampleCount: 48_000, centerHz: null, figures: {} as never, plot: { x: [-1000, 0, 1000], y: [-120, -60, -20] } });
    expect(psd).toMatchObject({ levelUnit: 'dBFS/Hz', originHz: 0, limitDb: null, worstIndex: null });
  });
});
