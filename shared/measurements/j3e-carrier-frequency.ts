import { requireFinite, requirePositive } from '../units/number-guards';

/** Which sideband the transmitter sends. */
export type Sideband = 'usb' | 'lsb';

/**
 * The (suppressed) carrier frequency of a J3E transmitter inferred from the RF tone produced by
 * a known audio tone: upper sideband f_c = f_RF − f_audio; lower sideband f_c = f_RF + f_audio.
 * A counter cannot read a suppressed carrier directly, so the tone is counted instead.
 *
 * Source: common practice. Any error in the audio generator's frequency enters 1:1.
 * Units: Hz. Domain: rfToneHz finite, audioToneHz > 0; sideband 'usb' or 'lsb'.
 * Bad input: RangeError starting with the function name.
 *
 * @example j3eCarrierFrequencyHz({ rfToneHz: 2_183_000, audioToneHz: 1000, sideband: 'usb' });
 * // 2182000
 */
export function j3eCarrierFrequencyHz(reading: {
  rfToneHz: number;
  audioToneHz: number;
  sideband: Sideband;
}): number {
  const fn = 'j3eCarrierFrequencyHz';
  const rf = requireFinite(fn, 'rfToneHz', reading.rfToneHz);
  const audio = requirePositive(fn, 'audioToneHz', reading.audioToneHz);
  if (reading.sideband === 'usb') return rf - audio;
  if (reading.sideband === 'lsb') return rf + audio;
  throw new RangeError(`${fn}: sideband must be 'usb' or 'lsb', got ${String(reading.sideband)}`);
}
