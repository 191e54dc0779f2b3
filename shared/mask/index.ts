export {
  AVIATION_ASSIGNED_FREQUENCY_OFFSET_HZ,
  AVIATION_SSB_AIRCRAFT_MASK_87_139C,
  aviationAssignedFrequencyHz,
} from './aviation-mask-87-139';
export { checkEmissionMask } from './check-emission-mask';
export type { EmissionMask, MaskProvenance, MaskReference, MaskVertex } from './emission-mask';
export { maritimeMask80211 } from './maritime-mask-80-211';
export type {
  MaskCheckOptions,
  MaskCheckResult,
  MaskSegmentResult,
  MaskTrace,
} from './mask-check-result';
export { maskLimitAtOffset } from './mask-limit-at-offset';
export { noiseBandwidthCorrectionDb } from './noise-bandwidth-correction';
