import { evaluateTrace, type IqEvidence, type TraceEvidence } from './evaluate-trace';
import { EvaluationError } from './evaluate-test-case';
import { SAMPLE_RULE_SETS } from '../rules/sample-rule-sets';
import type { RuleSetBody } from '../rules/rule-set';

const sample = (key: string) => SAMPLE_RULE_SETS.find((r) => r.key === key)!.body;
const maritime = sample('us-maritime-hf-ssb');
const aviation = sample('us-aviation-hf-ssb');
const CARRIER_HZ = 2_182_000;

/** A trace from carrier − 10 kHz to + 10 kHz in 10 Hz steps at a −90 dBm floor, with lines added. */
function trace(lines: [offsetHz: number, levelDbm: number][], extra: Partial<TraceEvidence> = {}): TraceEvidence {
  const frequencyHz: number[] = [];
  const levelDbm: number[] = [];
  for (let k = -1000; k <= 1000; k++) {
    const offset = k * 10;
    frequencyHz.push(CARRIER_HZ + offset);
    levelDbm.push(lines.find(([at]) => at === offset)?.[1] ?? -90);
  }
  return { source: 'trace', frequencyHz, levelDbm, carrierHz: CARRIER_HZ, sideband: 'usb', referenceDbm: 50, rbwHz: 30, ...extra };
}

const iq = (figures: Partial<IqEvidence>): IqEvidence => ({
  source: 'iq',
  carrierSuppressionDb: 45,
  unwantedSidebandSuppressionDb: null,
  imd3Db: null,
  imd5Db: null,
  occupiedBandwidthHz: 2400,
  ...figures,
});

/** The GUM worked budget (u_c 0.607 dB, U 1.21 dB; common practice, worked by hand). */
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

describe('evaluateTrace: emission mask from a trace', () => {
  it('47 CFR 80.211(a): a line exactly at 150 % of 3.0 kHz is judged against 28 dB, not 35 dB ("up to and including")', () => {
    // Mean power 50 dBm (100 W). At 4500 Hz the 28 dB region holds: limit 22 dBm; a 20 dBm line has 2 dB margin.
    const r = evaluateTrace({ kind: 'emission-mask', rules: maritime, evidence: trace([[1100, 47], [4500, 20]]) });
    expect(r.verdict).toBe('pass');
    expect(r.value).toBe(20);
    expect(r.limit).toBeCloseTo(22, 10);
    expect(r.margin).toBeCloseTo(2, 10);
    expect(r.mask?.worstFrequencyHz).toBe(CARRIER_HZ + 4500);
    // The 47 dBm tone at 1100 Hz lies within 50 % of the authorized bandwidth, where the rule sets no limit.
    expect(r.mask?.exemptWithinOffsetHz).toBe(1500);
  });

  it('beyond 250 %: 43 + 10 log10(100 W) = 63 dB below 50 dBm, the absolute level −13 dBm (common practice)', () => {
    const r = evaluateTrace({ kind: 'emission-mask', rules: maritime, evidence: trace([[-8000, -10]]) });
    expect(r.verdict).toBe('fail');
    expect(r.limit).toBeCloseTo(-13, 10);
    expect(r.margin).toBeCloseTo(-3, 10);
    expect(r.detail.worstOffsetHz).toBe(-8000);
  });

  it('aeronautical: the mask is centred on the assigned frequency, carrier + 1400 Hz (USB) or − 1400 Hz (LSB)', () => {
    // 47 CFR 87.139(c) (from memory): 1.5-4.5 kHz from the assigned frequency at least 30 dB below
    // PEP, 4.5-7.5 kHz at least 38 dB. A line 5800 Hz from the carrier on the emission's side is
    // 4400 Hz from the assigned frequency: limit 50 - 30 = 20 dBm, so 19.7 dBm has 0.3 dB margin.
    // Centred on the carrier it would be judged against 38 dB and fail by 7.7 dB.
    // U = 2 * sqrt((0.5/sqrt 3)^2 + 0.1^2 + (0.05/sqrt 3)^2) = 0.614 dB (GUM, sample relative budget):
    // the non-binary rule of the sample gives a conditional pass (ILAC-G8:09/2019).
    const usb = evaluateTrace({ kind: 'emission-mask', rules: aviation, evidence: trace([[5800, 19.7]]) });
    expect(usb.mask?.assignedHz).toBe(CARRIER_HZ + 1400);
    expect(usb.limit).toBeCloseTo(20, 10);
    expect(usb.uncertainty.expanded).toBeCloseTo(0.614, 3);
    expect(usb.verdict).toBe('conditional-pass');
    const lsb = evaluateTrace({ kind: 'emission-mask', rules: aviation, evidence: trace([[-5800, 19.7]], { sideband: 'lsb' }) });
    expect(lsb.mask?.assignedHz).toBe(CARRIER_HZ - 1400);
    expect(lsb.margin).toBeCloseTo(0.3, 10);
    const unmirrored = evaluateTrace({ kind: 'emission-mask', rules: aviation, evidence: trace([[-5800, 19.7]]) });
    expect(unmirrored.verdict).toBe('fail'); // an LSB emission read as USB: 7200 Hz out, 38 dB region
  });

  it('needs the reference level, and a rule set with a mask', () => {
    expect(() => evaluateTrace({ kind: 'emission-mask', rules: maritime, evidence: trace([], { referenceDbm: undefined }) })).toThrow(/mean power in dBm/);
    expect(() => evaluateTrace({ kind: 'emission-mask', rules: sample('us-amateur-hf'), evidence: trace([]) })).toThrow(EvaluationError);
  });
});

describe('evaluateTrace: occupied bandwidth', () => {
  it('a flat band 300-2700 Hz above the carrier occupies 0.99 x 2400 = 2376 Hz (ITU RR 1.153, 99 %)', () => {
    const frequencyHz: number[] = [];
    const levelDbm: number[] = [];
    for (let f = -4999.5; f < 5000; f += 1) {
      frequencyHz.push(CARRIER_HZ + f);
      levelDbm.push(f > 300 && f < 2700 ? -20 : -250);
    }
    const r = evaluateTrace({ kind: 'occupied-bandwidth', rules: maritime, evidence: { source: 'trace', frequencyHz, levelDbm, carrierHz: CARRIER_HZ, sideband: 'usb' } });
    expect(r.value).toBeCloseTo(2376, 3);
    expect(r.limit).toBe(3000);
    expect(r.unit).toBe('Hz');
    expect(r.verdict).toBe('pass');
  });

  it('from an I/Q analysis, against the same limit', () => {
    const r = evaluateTrace({ kind: 'occupied-bandwidth', rules: maritime, evidence: iq({ occupiedBandwidthHz: 3100 }) });
    expect(r.margin).toBeCloseTo(-100, 10);
    expect(r.verdict).toBe('fail');
  });
});

describe('evaluateTrace: figures of an I/Q capture', () => {
  it('carrier suppression 45 dB against 47 CFR 80.207(c) (at least 40 dB below PEP): 5 dB margin', () => {
    const r = evaluateTrace({ kind: 'carrier-suppression', rules: maritime, evidence: iq({}) });
    expect([r.value, r.limit, r.verdict]).toEqual([45, 40, 'pass']);
    expect(r.margin).toBeCloseTo(5, 10);
  });

  // ILAC-G8:09/2019 worked cases with TL 40 dB, U 1.21 dB: values 41.0/39.5/38.5/41.5 dB give
  // non-binary CP/CF/F/P, exactly as for hand readings.
  it('applies the decision rule like hand readings (ILAC-G8 worked cases)', () => {
    const rules = workedBudget({ kind: 'non-binary', guardBand: 'expanded-uncertainty' });
    const verdicts = [41.0, 39.5, 38.5, 41.5].map((db) => evaluateTrace({ kind: 'unwanted-sideband', rules, evidence: iq({ unwantedSidebandSuppressionDb: db }) }).verdict);
    expect(verdicts).toEqual(['conditional-pass', 'conditional-fail', 'fail', 'pass']);
  });

  it('a failing unwanted sideband carries the phasing diagnosis: 35.16 dB is what 2° alone gives (cot²(φ/2), published relation)', () => {
    const r = evaluateTrace({ kind: 'unwanted-sideband', rules: maritime, evidence: iq({ unwantedSidebandSuppressionDb: 35.16 }) });
    expect(r.verdict).toBe('fail');
    expect(r.phasing?.phaseErrorAloneDeg).toBeCloseTo(2, 1);
    expect(r.phasing?.meetsRequirement).toBe(false);
    const passing = evaluateTrace({ kind: 'unwanted-sideband', rules: maritime, evidence: iq({ unwantedSidebandSuppressionDb: 45 }) });
    expect(passing.phasing).toBeUndefined();
  });

  it('intermodulation: the weaker-suppressed order decides', () => {
    const r = evaluateTrace({ kind: 'intermodulation', rules: maritime, evidence: iq({ imd3Db: 30, imd5Db: 28 }) });
    expect(r.value).toBe(28);
    expect(r.detail.decidingOrder).toBe(5);
    expect(r.margin).toBeCloseTo(3, 10); // limit 25 dB below PEP in the maritime sample
  });

  it.each([
    ['unwanted-sideband', iq({}), /one audio tone/],
    ['intermodulation', iq({}), /two equal audio tones/],
    ['carrier-suppression', iq({ carrierSuppressionDb: Infinity }), /not measurable/],
    ['emission-mask', iq({}), /spectrum-analyzer trace/],
    ['spurious', iq({}), /cannot be evaluated/],
  ] as const)('%s without what it needs throws EvaluationError', (kind, evidence, message) => {
    expect(() => evaluateTrace({ kind, rules: maritime, evidence })).toThrow(message);
    expect(() => evaluateTrace({ kind, rules: maritime, evidence })).toThrow(EvaluationError);
  });

  it('a trace cannot decide a carrier-suppression case', () => {
    expect(() => evaluateTrace({ kind: 'carrier-suppression', rules: maritime, evidence: trace([]) })).toThrow(/I\/Q capture/);
  });
});
