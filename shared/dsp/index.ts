export { anyLengthDft } from './any-length-dft';
export { bandPower, tonePowerAt } from './band-power';
export { CACHED_FFT_MAX_SIZE, ComplexFft, complexFftOfSize, isPowerOfTwo } from './fft';
export type { ComplexBuffer } from './fft';
export { createComplexNoise } from './gaussian-noise';
export { analyticSignal, realToIq } from './hilbert';
export type { ComplexSamples } from './hilbert';
export { createMulberry32 } from './mulberry32';
export { peakOffsetBins } from './peak-interpolation';
export type { PeakInterpolation } from './peak-interpolation';
export type { PowerSpectrum } from './power-spectrum';
export type {
  IntermodSpec,
  SpectralLine,
  SsbSignalSpec,
  SsbToneSpec,
  SsbTruth,
} from './ssb-signal-spec';
export { createSsbSignalStream, synthesizeSsb } from './synthesizer';
export type { SsbSignalStream } from './synthesizer';
export { detectTones } from './tone-detect';
export type { DetectedTone, ToneDetectOptions } from './tone-detect';
export { createWelchAccumulator, welchPsd } from './welch';
export type { SampleArray, WelchAccumulator, WelchOptions, WelchResult } from './welch';
export { WINDOW_COEFFICIENTS, windowCoefficients } from './window';
export type { WindowName } from './window';
export { windowMetrics } from './window-metrics';
export type { WindowMetrics } from './window-metrics';
