import type { TestKind } from '../rules/test-kind';

/** Values entered or imported for one test case, keyed by field. */
export type ReadingValues = Record<string, number | string | null | undefined>;

export interface ReadingField {
  key: string;
  label: string;
  unit: string;
  optional?: boolean;
  hint?: string;
}

/** The fields a hand-entered reading has, per kind of test; the client builds its forms from this. */
export const READING_FIELDS: Record<TestKind, ReadingField[]> = {
  'carrier-suppression': [
    { key: 'pepDbm', label: 'PEP', unit: 'dBm', hint: 'Peak envelope power, read with the same path as the carrier' },
    { key: 'carrierDbm', label: 'Carrier level', unit: 'dBm', hint: 'Narrow RBW (10-30 Hz) so the tone skirts do not hide it' },
  ],
  'unwanted-sideband': [
    { key: 'wantedToneDbm', label: 'Wanted tone', unit: 'dBm' },
    { key: 'imageToneDbm', label: 'Image at the mirror frequency', unit: 'dBm' },
  ],
  intermodulation: [
    { key: 'toneDbm', label: 'Level of one tone', unit: 'dBm' },
    { key: 'imd3Dbm', label: 'Strongest 3rd-order product', unit: 'dBm' },
    { key: 'imd5Dbm', label: 'Strongest 5th-order product', unit: 'dBm', optional: true },
  ],
  'emission-mask': [],
  spurious: [
    { key: 'meanPowerDbm', label: 'Mean power', unit: 'dBm' },
    { key: 'worstSpuriousDbm', label: 'Strongest spurious emission', unit: 'dBm' },
  ],
  'occupied-bandwidth': [{ key: 'occupiedBandwidthHz', label: 'Occupied bandwidth (99 %)', unit: 'Hz' }],
  'frequency-tolerance': [
    { key: 'nominalHz', label: 'Nominal carrier frequency', unit: 'Hz' },
    { key: 'measuredHz', label: 'Measured carrier frequency', unit: 'Hz' },
  ],
  'audio-response': [],
};
