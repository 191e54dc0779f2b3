export { meanPowerFromEnvelope, pepFromEnvelope } from './envelope-power';
export {
  TWO_TONE_MEAN_ABOVE_TONE_DB,
  TWO_TONE_PEP_ABOVE_TONE_DB,
  equalTonesFromToneDbm,
  toneDbmFromTwoTonePepDbm,
  twoToneFromToneDbm,
} from './equal-tones';
export type { ToneSumLevels } from './equal-tones';
export { pepFromPeakVoltageW } from './pep-from-peak-voltage';
