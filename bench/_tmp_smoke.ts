import { createSsbSignalStream, synthesizeSsb } from '../shared/dsp/synthesizer';
import { analyzeIq, createIqAnalyzer } from '../shared/iq/analyze-iq';
const fs = 192000;
let t0 = performance.now();
const s = synthesizeSsb({ sampleRateHz: fs, sampleCount: 1920000, sideband: 'usb',
  tones: [{ audioHz: 1100, levelDbfs: -12 }, { audioHz: 1700, levelDbfs: -12 }],
  amplitudeImbalanceDb: 0.1, phaseErrorDeg: 1, carrierLeakBelowPepDb: 45,
  intermod: [{ order: 3, belowPepDb: 30 }, { order: 5, belowPepDb: 40, side: 'upper' }],
  noise: { powerDbfs: -80, seed: 1 } });
console.log('synth ms', (performance.now() - t0).toFixed(0));
const t = s.truth;
console.log('truth pep', 10*Math.log10(t.pepLinear), 'nominal', 10*Math.log10(t.nominalPepLinear), 'mean', 10*Math.log10(t.meanPowerLinear), 'irr', t.imageRejectionDb);
for (let r = 0; r < 8; r++) {
  t0 = performance.now();
  const a = createIqAnalyzer({ sampleRateHz: fs });
  for (let p = 0; p < s.i.length; p += 65536) a.push(s.i.subarray(p, p + 65536), s.q.subarray(p, p + 65536));
  const res = a.finish();
  const dt = performance.now() - t0;
  if (r === 7) { const { psd, ...rest } = res; console.log(rest); }
  console.log('analysis ms', dt.toFixed(1));
}
