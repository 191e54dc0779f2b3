import { evaluateTestCase, EvaluationError } from './evaluate-test-case';
import { SAMPLE_RULE_SETS } from '../rules/sample-rule-sets';
import type { RuleSetBody } from '../rules/rule-set';

const maritime = SAMPLE_RULE_SETS.find((r) => r.key === 'us-maritime-hf-ssb')!.body;
/** A rule set with the GUM worked budget (u_c 0.607 dB, U 1.21 dB; common practice, worked by hand). */
const workedBudget = (decisionRule: RuleSetBody['decisionRule']): RuleSetBody => ({
  ...maritime,
  decisionRule,
  uncertainty: {
    ...maritime.uncertainty,
    relative: [
      { name: 'SA', distribution: 'rectangular', value: 1.0 },
      { name: 'mismatch', distribution: 'normal', value: 0.122, coverageFactor: 1 },
      { name: 'cal', distribution: 'normal', value: 0.2, coverageFactor: 2 },
      { name: 'repeatability', distribution: 'normal', value: 0.1, coverageFactor: 1 },
    ],
  },
});

describe('evaluateTestCase', () => {
  it('carrier suppression: PEP 50 dBm, carrier 10 dBm -> 40 dB below PEP, at the 47 CFR 80.207(c) limit of 40 dB', () => {
    const r = evaluateTestCase({ kind: 'carrier-suppression', readings: { pepDbm: 50, carrierDbm: 10 }, rules: workedBudget({ kind: 'simple-acceptance' }) });
    expect(r.value).toBeCloseTo(40, 12);
    expect(r.limit).toBe(40);
    expect(r.margin).toBeCloseTo(0, 12);
    expect(r.uncertainty.expanded).toBeCloseTo(1.21, 2); // GUM worked check (common practice)
    expect(r.verdict).toBe('pass'); // simple acceptance: on the limit passes (ILAC-G8:09/2019)
  });

  // ILAC-G8:09/2019 worked cases with TL 40 dB, U 1.21 dB (values 41.0/39.5/38.5/41.5 dB):
  // simple P/F/F/P; binary guard band w = U F/F/F/P; non-binary CP/CF/F/P.
  it.each([
    [{ kind: 'simple-acceptance' as const }, ['pass', 'fail', 'fail', 'pass']],
    [{ kind: 'binary-guard-band' as const, guardBand: 'expanded-uncertainty' as const }, ['fail', 'fail', 'fail', 'pass']],
    [{ kind: 'non-binary' as const, guardBand: 'expanded-uncertainty' as const }, ['conditional-pass', 'conditional-fail', 'fail', 'pass']],
  ])('applies the decision rule %j to the ILAC-G8 cases', (rule, expected) => {
    const verdicts = [41.0, 39.5, 38.5, 41.5].map(
      (suppression) => evaluateTestCase({ kind: 'carrier-suppression', readings: { pepDbm: 50, carrierDbm: 50 - suppression }, rules: workedBudget(rule) }).verdict,
    );
    expect(verdicts).toEqual(expected);
  });

  it('intermodulation: a product 25 dB below one tone is 31.02 dB below PEP (two-tone relation, -6.02 dB)', () => {
    const r = evaluateTestCase({ kind: 'intermodulation', readings: { toneDbm: 40, imd3Dbm: 15, imd5Dbm: null }, rules: maritime });
    expect(r.value).toBeCloseTo(31.02, 2);
    expect(r.detail.decidingOrder).toBe(3);
  });

  it('intermodulation: the weaker-suppressed order decides', () => {
    const r = evaluateTestCase({ kind: 'intermodulation', readings: { toneDbm: 40, imd3Dbm: 5, imd5Dbm: 12 }, rules: maritime });
    expect(r.detail.decidingOrder).toBe(5);
    expect(r.value).toBeCloseTo(40 - 12 + 20 * Math.log10(2), 10);
  });

  it('spurious: 100 W mean (50 dBm) needs 63 dB (43 + 10 log10 100, 47 CFR 80.211); -13 dBm is exactly on it', () => {
    const r = evaluateTestCase({ kind: 'spurious', readings: { meanPowerDbm: 50, worstSpuriousDbm: -13 }, rules: workedBudget({ kind: 'simple-acceptance' }) });
    expect(r.limit).toBeCloseTo(63, 10);
    expect(r.value).toBeCloseTo(63, 10);
  });

  it('frequency tolerance: 20 Hz at 16.42 MHz is 1.218 ppm (common practice); 25 Hz off fails a 20 Hz tolerance', () => {
    const ok = evaluateTestCase({ kind: 'frequency-tolerance', readings: { nominalHz: 16_420_000, measuredHz: 16_420_020 }, rules: maritime });
    expect(ok.detail.errorPpm).toBeCloseTo(1.218, 3);
    expect(ok.unit).toBe('Hz');
    const bad = evaluateTestCase({ kind: 'frequency-tolerance', readings: { nominalHz: 16_420_000, measuredHz: 16_419_975 }, rules: maritime });
    expect(bad.value).toBe(25);
    expect(bad.verdict).toBe('fail');
  });

  it('unwanted sideband: wanted 40 dBm, image -2 dBm -> 42 dB', () => {
    const r = evaluateTestCase({ kind: 'unwanted-sideband', readings: { wantedToneDbm: 40, imageToneDbm: -2 }, rules: maritime });
    expect(r.value).toBe(42);
    expect(r.direction).toBe('at-least');
  });

  it('occupied bandwidth is an upper limit in Hz', () => {
    const r = evaluateTestCase({ kind: 'occupied-bandwidth', readings: { occupiedBandwidthHz: 2376 }, rules: maritime });
    expect(r.direction).toBe('at-most');
    expect(r.margin).toBe(3000 - 2376);
  });

  it.each([
    [{ pepDbm: 50 }, /Carrier level is required/],
    [{ pepDbm: 50, carrierDbm: Number.NaN }, /Carrier level is required/],
    [{ pepDbm: Infinity, carrierDbm: 1 }, /PEP is required/],
    [{ pepDbm: '50', carrierDbm: 1 }, /PEP is required/],
  ])('refuses incomplete or non-finite readings %j with a message for the bench', (readings, message) => {
    expect(() => evaluateTestCase({ kind: 'carrier-suppression', readings, rules: maritime })).toThrow(EvaluationError);
    expect(() => evaluateTestCase({ kind: 'carrier-suppression', readings, rules: maritime })).toThrow(message);
  });

  it('says when the rule set lacks the limit', () => {
    const amateur = SAMPLE_RULE_SETS.find((r) => r.key === 'us-amateur-hf')!.body;
    expect(() => evaluateTestCase({ kind: 'unwanted-sideband', readings: { wantedToneDbm: 1, imageToneDbm: 0 }, rules: amateur })).toThrow(/no unwanted-sideband limit/);
  });

  it('trace-based measurements are not evaluated from hand readings', () => {
    expect(() => evaluateTestCase({ kind: 'emission-mask', readings: {}, rules: maritime })).toThrow(/imported trace/);
  });
});
