import Ajv from 'ajv';
import addFormats from 'ajv-formats';
import { SAMPLE_RULE_SETS } from '../rules/sample-rule-sets';
import type { RuleSetBody } from '../rules/rule-set';
import { ruleSetBodyProblems, ruleSetBodySchema } from './rule-set';

// The same options as the server's validator (strict, no coercion, every error).
const ajv = new Ajv({ allErrors: true, strict: true, coerceTypes: false, useDefaults: false });
addFormats(ajv);
const check = ajv.compile(ruleSetBodySchema);
const maritime = SAMPLE_RULE_SETS.find((r) => r.key === 'us-maritime-hf-ssb')!.body;
const withMask = (vertices: [number, number][]): RuleSetBody => ({ ...maritime, limits: { ...maritime.limits, emissionMask: { ...maritime.limits.emissionMask!, vertices } } });
const pointers = (body: unknown) => (check(body) ? [] : check.errors!.map((e) => e.instancePath));

describe('ruleSetBodySchema', () => {
  it.each(SAMPLE_RULE_SETS.map((r) => [r.key, r.body] as const))('accepts the built-in sample %s, with no semantic problem', (_key, body) => {
    expect(pointers(body)).toEqual([]);
    expect(ruleSetBodyProblems(body)).toEqual([]);
  });

  // 47 CFR 80.211(a) masks are written as attenuation below the reference at offsets from the
  // assigned frequency: relative levels are <= 0 dB and offsets >= 0 Hz.
  it.each([
    ['a vertex above the reference', withMask([[1500, 0], [1500, 3]]), '/limits/emissionMask/vertices/1/1'],
    ['a negative offset', withMask([[-10, 0], [1500, -28]]), '/limits/emissionMask/vertices/0/0'],
    ['a vertex of three numbers', { ...withMask([[1500, 0]]), limits: { emissionMask: { reference: 'mean', source: 'x', vertices: [[1500, 0, 1], [4500, -28]] } } }, '/limits/emissionMask/vertices/0'],
    ['an unknown decision rule', { ...maritime, decisionRule: { kind: 'coin-toss' } }, '/decisionRule'],
    ['a guard band without a figure', { ...maritime, decisionRule: { kind: 'binary-guard-band' } }, '/decisionRule'],
    ['a negative guard band', { ...maritime, decisionRule: { kind: 'non-binary', guardBand: -1 } }, '/decisionRule/guardBand'],
    ['a budget row with a zero coverage factor', { ...maritime, uncertainty: { ...maritime.uncertainty, relative: [{ name: 'x', distribution: 'normal', value: 1, coverageFactor: 0 }] } }, '/uncertainty/relative/0/coverageFactor'],
    ['a missing absolute budget', { ...maritime, uncertainty: { relative: [] } }, '/uncertainty'],
    ['a limit without its source', { ...maritime, limits: { carrierSuppression: { minDbBelowPep: 40 } } }, '/limits/carrierSuppression'],
    ['an unknown limit', { ...maritime, limits: { loudness: { source: 'x' } } }, '/limits'],
  ])('refuses %s', (_what, body, pointer) => {
    expect(pointers(body)).toContain(pointer);
  });
});

describe('ruleSetBodyProblems', () => {
  it('accepts equal offsets (a vertical step of the mask) and refuses a decreasing one with its pointer', () => {
    expect(ruleSetBodyProblems(withMask([[1500, 0], [1500, -28], [4500, -28]]))).toEqual([]);
    expect(ruleSetBodyProblems(withMask([[1500, 0], [4500, -28], [4000, -35], [7500, -35], [7000, -43]]), '/body')).toEqual([
      { pointer: '/body/limits/emissionMask/vertices/2/0', message: 'must not be below the previous offset (4500 Hz)' },
      { pointer: '/body/limits/emissionMask/vertices/4/0', message: 'must not be below the previous offset (7500 Hz)' },
    ]);
  });

  it('refuses an audio band whose high edge is not above its low edge, and a cap rule without a cap', () => {
    const body: RuleSetBody = { ...maritime, limits: { audioResponse: { lowHz: 2700, highHz: 350, maxVariationDb: 6, source: 'x' }, spurious: { ...maritime.limits.spurious!, capRule: 'less-stringent' } } };
    expect(ruleSetBodyProblems(body).map((p) => p.pointer)).toEqual(['/limits/audioResponse/highHz', '/limits/spurious/capDbc']);
  });
});
