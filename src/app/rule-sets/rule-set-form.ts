import { FormArray, FormControl, FormGroup, Validators } from '@angular/forms';
import type { RuleSetBody } from '../../../shared/rules/rule-set';
import type { DecisionRule } from '../../../shared/uncertainty/decision-rule';
import { presentScalarLimits, withScalarLimits, type ScalarLimit } from './rule-set-limits';
import { maskVertices } from './mask-vertices';
import { vertexGroup, vertexRows, type VertexGroup } from './vertex-form';

type Limits = RuleSetBody['limits'];

/** The limits the editor shows, one group per limit with its source and its numbers. */
export interface LimitGroup {
  limit: keyof Limits;
  defs: ScalarLimit[];
}

/** The reactive form of the rule-set editor, built from a stored body. */
export function ruleSetForm(name: string, body: RuleSetBody) {
  const shown = presentScalarLimits(body);
  const rule = body.decisionRule;
  const mask = body.limits.emissionMask;
  const groups: LimitGroup[] = [];
  for (const s of shown) {
    const group = groups.find((g) => g.limit === s.def.limit);
    if (group) group.defs.push(s.def);
    else groups.push({ limit: s.def.limit, defs: [s.def] });
  }
  const form = new FormGroup({
    name: new FormControl(name, { nonNullable: true, validators: [Validators.required, Validators.maxLength(200), Validators.pattern(/\S/)] }),
    description: new FormControl(body.description, { nonNullable: true, validators: Validators.maxLength(2000) }),
    decisionKind: new FormControl<DecisionRule['kind']>(rule.kind, { nonNullable: true }),
    guardBandMode: new FormControl<'expanded-uncertainty' | 'fixed'>(rule.kind !== 'simple-acceptance' && typeof rule.guardBand === 'number' ? 'fixed' : 'expanded-uncertainty', { nonNullable: true }),
    guardBandDb: new FormControl(rule.kind !== 'simple-acceptance' && typeof rule.guardBand === 'number' ? rule.guardBand : 1, { nonNullable: true, validators: [Validators.min(0), Validators.max(100)] }),
    values: new FormGroup(Object.fromEntries(shown.map((s) => [s.def.id, new FormControl(s.value, { nonNullable: true, validators: [Validators.required, Validators.min(s.def.min), Validators.max(s.def.max)] })])) as Record<string, FormControl<number>>),
    sources: new FormGroup(Object.fromEntries(groups.map((g) => [g.limit, new FormControl((body.limits[g.limit] as { source: string }).source, { nonNullable: true, validators: [Validators.required, Validators.maxLength(500)] })])) as Record<string, FormControl<string>>),
    maskReference: new FormControl<'pep' | 'mean'>(mask?.reference ?? 'pep', { nonNullable: true }),
    maskSource: new FormControl(mask?.source ?? '', { nonNullable: true, validators: mask ? [Validators.required, Validators.maxLength(500)] : [] }),
    vertices: new FormArray<VertexGroup>((mask?.vertices ?? []).map((v) => vertexGroup(v))),
  });
  return { form, groups, hasMask: !!mask };
}

export type RuleSetForm = ReturnType<typeof ruleSetForm>['form'];

/**
 * The edited body: `original` with the form's description, decision rule, numbers, sources and
 * mask written in; everything the editor does not show (references, budgets, other mask fields)
 * kept as it was. Null while the mask's vertices have a problem. Never throws.
 */
export function editedBody(original: RuleSetBody, form: RuleSetForm): RuleSetBody | null {
  const v = form.getRawValue();
  const decisionRule: DecisionRule =
    v.decisionKind === 'simple-acceptance' ? { kind: 'simple-acceptance' } : { kind: v.decisionKind, guardBand: v.guardBandMode === 'fixed' ? Number(v.guardBandDb) : 'expanded-uncertainty' };
  const body = withScalarLimits({ ...original, description: v.description.trim(), decisionRule }, Object.fromEntries(Object.entries(v.values).map(([k, n]) => [k, Number(n)])), v.sources);
  if (!original.limits.emissionMask) return body;
  const vertices = maskVertices(vertexRows(form.controls.vertices.controls));
  if (!vertices) return null;
  return { ...body, limits: { ...body.limits, emissionMask: { ...body.limits.emissionMask!, reference: v.maskReference, source: v.maskSource.trim(), vertices } } };
}
