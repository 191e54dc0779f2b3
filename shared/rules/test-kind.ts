/** The measurements a test plan can contain, in the order a lab usually runs them. */
export const TEST_KINDS = [
  'carrier-suppression',
  'unwanted-sideband',
  'intermodulation',
  'emission-mask',
  'spurious',
  'occupied-bandwidth',
  'frequency-tolerance',
  'audio-response',
] as const;
export type TestKind = (typeof TEST_KINDS)[number];

export const TEST_KIND_LABELS: Record<TestKind, string> = {
  'carrier-suppression': 'Carrier suppression',
  'unwanted-sideband': 'Unwanted-sideband suppression',
  intermodulation: 'Two-tone intermodulation (IMD)',
  'emission-mask': 'Emission mask',
  spurious: 'Spurious emissions',
  'occupied-bandwidth': 'Occupied bandwidth',
  'frequency-tolerance': 'Frequency tolerance',
  'audio-response': 'Audio frequency response',
};
