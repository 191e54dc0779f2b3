/**
 * A lab's own rule sets are versioned: an edit is a new row (same key, version + 1) and the old
 * row never changes, so a plan's snapshot and every result computed from it stay as they were
 * (ISO/IEC 17025:2017 7.5 technical records and 7.11 control of data; clause wording from memory).
 * Built-in samples (organization_id NULL) are read-only: a lab copies one to make it its own.
 */
import { UniqueConstraintError } from 'sequelize';
import { RuleSet } from '../db/models';
import { conflict, notFound, validationFailed } from '../http/problem';
import type { RouteContext } from '../http/route';
import type { RuleSetBody } from '../../shared/rules/rule-set';
import { ruleSetBodyProblems } from '../../shared/schemas/rule-set';
import { audit } from '../audit/audit';

export function presentRuleSet(r: RuleSet) {
  return { id: r.id, key: r.key, version: r.version, name: r.name, service: r.service, isSample: r.isSample, builtIn: r.organizationId === null, body: r.body, createdAt: r.createdAt.toISOString() };
}

export async function loadRuleSet(id: string): Promise<RuleSet> {
  const r = await RuleSet.findByPk(id);
  if (!r) throw notFound('The rule set');
  return r;
}

/** Throw a 422 with a pointer per field when the body fails a check the schema cannot express. */
function checkBody(body: RuleSetBody, base: string): void {
  const errors = ruleSetBodyProblems(body, base);
  if (errors.length) throw validationFailed(`The rule set has ${errors.length} problem${errors.length === 1 ? '' : 's'}: ${errors[0].pointer} ${errors[0].message}.`, errors);
}

/** A key for a new lab rule set from its name: lower-case words joined by hyphens, unique in the lab. */
async function freshKey(organizationId: string, name: string): Promise<string> {
  const slug = name.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 50).replace(/-+$/, '') || 'rule-set';
  for (let n = 1; n <= 1000; n++) {
    const key = n === 1 ? slug : `${slug}-${n}`;
    if (!(await RuleSet.findOne({ where: { organizationId, key }, attributes: ['id'] }))) return key;
  }
  throw conflict(`Too many rule sets are named like "${name}"; choose another name.`);
}

/** The lab's own copy of any rule set it can read (a built-in sample or one of its own): version 1. */
export async function copyRuleSet(ctx: RouteContext, source: RuleSet, name: string): Promise<RuleSet> {
  // The copy is no longer a shipped sample; the lab now owns (and must verify) every limit in it.
  const { sampleNotice: _notice, ...body } = source.body;
  const copy = await RuleSet.create({ organizationId: ctx.organizationId!, key: await freshKey(ctx.organizationId!, name), version: 1, name, service: body.service, isSample: false, body });
  await audit(ctx, { action: 'copy', entity: 'rule-set', entityId: copy.id, before: { id: source.id, key: source.key, version: source.version }, after: presentRuleSet(copy) });
  return copy;
}

/** A new version of a lab rule set; `current` must be its latest version. */
export async function newRuleSetVersion(ctx: RouteContext, current: RuleSet, edit: { name?: string; body: RuleSetBody }): Promise<RuleSet> {
  if (current.organizationId === null) {
    throw conflict(`"${current.name}" is a built-in sample and cannot be edited. Copy it to make your own (POST /api/rule-sets/${current.id}/copy).`, { code: 'rule-set-read-only' });
  }
  const latest = (await RuleSet.max('version', { where: { organizationId: current.organizationId, key: current.key } })) as number;
  if (current.version !== latest) {
    throw conflict(`This is version ${current.version} of "${current.name}"; version ${latest} is the latest. Edit the latest version.`, { code: 'rule-set-not-latest' });
  }
  checkBody(edit.body, '/body');
  try {
    const next = await RuleSet.create({ organizationId: current.organizationId, key: current.key, version: current.version + 1, name: edit.name ?? current.name, service: edit.body.service, isSample: false, body: edit.body });
    await audit(ctx, { action: 'new-version', entity: 'rule-set', entityId: next.id, before: presentRuleSet(current), after: presentRuleSet(next) });
    return next;
  } catch (error) {
    // Two edits of the same version at once: the unique (organization_id, key, version) lets one win.
    if (error instanceof UniqueConstraintError) throw conflict(`Someone saved a new version of "${current.name}" at the same time. Reload and edit the latest version.`, { code: 'rule-set-not-latest' });
    throw error;
  }
}
