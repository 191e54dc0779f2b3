/**
 * The demo's invented spectrum trace: a two-tone emission of the demo radio at 2182 kHz as a
 * spectrum analyzer would show it, made from the reference synthesizer (shared/dsp/synthesizer.ts)
 * and a flat-top Welch spectrum (flat-top so tone levels read true). The product levels are chosen
 * against the maritime sample mask (47 CFR 80.211(a), 3.0 kHz authorized bandwidth): the upper
 * 3rd-order product at 1900 Hz sits about 5 dB under the 28 dB limit, so the demo shows a pass
 * with a visible margin. Every number here is invented.
 */
import { createSsbSignalStream } from '../../shared/dsp/synthesizer';
import { welchPsd } from '../../shared/dsp/welch';

const CARRIER_HZ = 2_182_000;
const SPAN_HZ = 12_000;
/** 0 dBFS as dBm at the analyzer input, chosen so two −10 dBFS tones make 150 W PEP (51.76 dBm). */
const FULL_SCALE_DBM = 51.76 + 10 - 20 * Math.log10(2);

/** The trace CSV (`frequency_hz,level_dbm`) and the mean power the mask is referred to (dBm). */
export function demoMaskTrace(): { csv: string; referenceDbm: number; carrierHz: number } {
  const sampleRateHz = 48_000;
  const stream = createSsbSignalStream({
    sampleRateHz,
    sampleCount: 49_152,
    sideband: 'usb',
    // Two tones inside ±1500 Hz, where 80.211(a) sets no limit; their products at 1900 and 2500 Hz do not.
    tones: [{ audioHz: 700, levelDbfs: -10 }, { audioHz: 1300, levelDbfs: -10 }],
    carrierLeakBelowPepDb: 50,
    intermod: [{ order: 3, belowPepDb: 36 }, { order: 5, belowPepDb: 48 }],
    noise: { powerDbfs: -85, seed: 2026 },
  }, { chunkLength: 49_152 });
  const samples = stream.next()!;
  const psd = welchPsd(samples.i, samples.q, { sampleRateHz, segmentLength: 8192, window: 'flattop' });
  const rows = [`# Invented demo trace (Sidecheck demo), flat-top RBW: ${psd.enbwHz.toFixed(1)} Hz`, 'frequency_hz,level_dbm'];
  for (let k = 0; k < psd.frequencyHz.length; k++) {
    const f = psd.frequencyHz[k];
    if (Math.abs(f) > SPAN_HZ) continue;
    // Power in one resolution bandwidth: density x noise bandwidth.
    rows.push(`${(CARRIER_HZ + f).toFixed(2)},${(FULL_SCALE_DBM + 10 * Math.log10(psd.psd[k] * psd.enbwHz)).toFixed(2)}`);
  }
  const referenceDbm = FULL_SCALE_DBM + 10 * Math.log10(stream.truth().meanPowerLinear);
  return { csv: rows.join('\n') + '\n', referenceDbm, carrierHz: CARRIER_HZ };
}
