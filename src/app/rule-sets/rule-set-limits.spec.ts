import { presentScalarLimits, withScalarLimits } from './rule-set-limits';
import { SAMPLE_RULE_SETS } from '../../../shared/rules/sample-rule-sets';
import { ruleSetBodyProblems } from '../../../shared/schemas/rule-set';

const maritime = SAMPLE_RULE_SETS.find((s) => s.key === 'us-maritime-hf-ssb')!.body;

describe('scalar limits of the rule-set editor', () => {
  it('reads the numbers a body has, with their sources', () => {
    const shown = presentScalarLimits(maritime);
    // 47 CFR 80.207(c): the carrier at least 40 dB below PEP; 47 CFR 80.209: 20 Hz for maritime SSB.
    expect(shown.find((s) => s.def.id === 'carrierSuppression/minDbBelowPep')).toMatchObject({ value: 40, source: expect.stringContaining('80.207') });
    expect(shown.find((s) => s.def.id === 'frequencyTolerance/toleranceHz')).toMatchObject({ value: 20 });
    // ITU-R M.1173 §3: 350-2700 Hz, 6 dB.
    expect(shown.filter((s) => s.def.limit === 'audioResponse').map((s) => s.value)).toEqual([350, 2700, 6]);
  });

  it('writes numbers and sources into a copy, leaving the original and absent limits alone', () => {
    const body = { ...maritime, limits: { ...maritime.limits, intermodulation: undefined } };
    const edited = withScalarLimits(body, { 'carrierSuppression/minDbBelowPep': 45, 'intermodulation/minDbBelowPep': 30 }, { carrierSuppression: 'Our procedure QP-7, issue 3' });
    expect(edited.limits.carrierSuppression).toEqual({ minDbBelowPep: 45, source: 'Our procedure QP-7, issue 3' });
    expect(edited.limits.intermodulation).toBeUndefined();
    expect(maritime.limits.carrierSuppression!.minDbBelowPep).toBe(40);
    expect(edited.limits.emissionMask).toEqual(maritime.limits.emissionMask);
    expect(ruleSetBodyProblems(edited)).toEqual([]);
  });

  it('lets the server refuse an audio band whose edges cross (the shared check sees it)', () => {
    const edited = withScalarLimits(maritime, { 'audioResponse/lowHz': 3000 }, {});
    expect(ruleSetBodyProblems(edited, '/body')).toEqual([expect.objectContaining({ pointer: '/body/limits/audioResponse/highHz' })]);
  });
});
