import { editedBody, ruleSetForm } from './rule-set-form';
import { SAMPLE_RULE_SETS } from '../../../shared/rules/sample-rule-sets';
import { ruleSetBodyProblems } from '../../../shared/schemas/rule-set';

const sample = SAMPLE_RULE_SETS.find((s) => s.key === 'us-maritime-hf-ssb')!;

describe('the rule-set editor form', () => {
  it('gives back the body unchanged when nothing was edited', () => {
    const { form } = ruleSetForm(sample.name, sample.body);
    expect(editedBody(sample.body, form)).toEqual(sample.body);
  });

  it('writes an edited vertex, decision rule and limit into the body and keeps the rest', () => {
    const { form, groups, hasMask } = ruleSetForm(sample.name, sample.body);
    expect(hasMask).toBe(true);
    expect(groups.map((g) => g.limit)).toContain('carrierSuppression');
    // 47 CFR 80.211(a) for equipment installed before 1 Feb 1992: 25 dB instead of 28 dB in the first region.
    form.controls.vertices.at(1).controls.relDb.setValue('-25');
    form.controls.vertices.at(2).controls.relDb.setValue('-25');
    form.controls.decisionKind.setValue('non-binary');
    form.controls.guardBandMode.setValue('fixed');
    form.controls.guardBandDb.setValue(1.2);
    form.controls.values.controls['carrierSuppression/minDbBelowPep'].setValue(45);
    const body = editedBody(sample.body, form)!;
    expect(body.limits.emissionMask!.vertices.slice(0, 3)).toEqual([[1500, 0], [1500, -25], [4500, -25]]);
    expect(body.decisionRule).toEqual({ kind: 'non-binary', guardBand: 1.2 });
    expect(body.limits.carrierSuppression!.minDbBelowPep).toBe(45);
    expect(body.uncertainty).toEqual(sample.body.uncertainty);
    expect(body.references).toEqual(sample.body.references);
    expect(ruleSetBodyProblems(body)).toEqual([]);
  });

  it('gives null while a vertex has a problem, so nothing invalid is sent', () => {
    const { form } = ruleSetForm(sample.name, sample.body);
    form.controls.vertices.at(3).controls.offsetHz.setValue('4000');
    expect(editedBody(sample.body, form)).toBeNull();
  });
});
