import { synthesizeSsb } from '../shared/dsp/synthesizer';
import { createWelchAccumulator } from '../shared/dsp/welch';
import { measureIqSpectrum } from '../shared/iq/measure-iq-spectrum';
import { createIqAnalyzer } from '../shared/iq/analyze-iq';
const fs = 192000;
const s = synthesizeSsb({ sampleRateHz: fs, sampleCount: 1920000, sideband: 'usb',
  tones: [{ audioHz: 1100, levelDbfs: -12 }, { audioHz: 1700, levelDbfs: -12 }], noise: { powerDbfs: -80, seed: 1 } });
for (let r = 0; r < 6; r++) {
  let t0 = performance.now();
  const w = createWelchAccumulator({ sampleRateHz: fs, segmentLength: 16384 });
  for (let p = 0; p < s.i.length; p += 65536) w.push(s.i.subarray(p, p + 65536), s.q.subarray(p, p + 65536));
  const tw = performance.now() - t0; t0 = performance.now();
  const res = w.result(); const tr = performance.now() - t0; t0 = performance.now();
  measureIqSpectrum(res, 'auto'); const tm = performance.now() - t0; t0 = performance.now();
  const a = createIqAnalyzer({ sampleRateHz: fs });
  for (let p = 0; p < s.i.length; p += 65536) a.push(s.i.subarray(p, p + 65536), s.q.subarray(p, p + 65536));
  const ta = performance.now() - t0; t0 = performance.now();
  a.finish(); const tf = performance.now() - t0;
  console.log({ welchPush: tw.toFixed(1), result: tr.toFixed(1), measure: tm.toFixed(1), analyzerPush: ta.toFixed(1), finish: tf.toFixed(1) });
}
