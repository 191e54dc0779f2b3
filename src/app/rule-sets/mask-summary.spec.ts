import { maskSummary } from './mask-summary';

describe('maskSummary', () => {
  it('reads each vertex and the value beyond the last (common practice for a text alternative, WCAG 2.2 SC 1.1.1)', () => {
    expect(maskSummary([[1500, 0], [1500, -28], [4500, -28]], 'mean power')).toBe(
      'Emission mask relative to mean power: 0 dB at ±1.5 kHz, \u221228 dB at ±1.5 kHz, \u221228 dB at ±4.5 kHz; \u221228 dB beyond ±4.5 kHz.',
    );
    expect(maskSummary([[0, -0.5], [12500, -60.25]], 'PEP')).toBe('Emission mask relative to PEP: \u22120.5 dB at ±0 kHz, \u221260.25 dB at ±12.5 kHz; \u221260.25 dB beyond ±12.5 kHz.');
  });

  it('says when there is nothing to draw', () => {
    expect(maskSummary([], 'PEP')).toBe('Emission mask relative to PEP: no valid vertices yet.');
  });
});
