import { RuleSet } from '../db/models';
import { route, type RouteDef } from '../http/route';
import { notFound } from '../http/problem';

export function presentRuleSet(r: RuleSet) {
  return { id: r.id, key: r.key, version: r.version, name: r.name, service: r.service, isSample: r.isSample, builtIn: r.organizationId === null, body: r.body };
}

const READ = ['lab-admin', 'engineer', 'reviewer', 'billing'] as const;

export function ruleSetRoutes(): RouteDef[] {
  return [
    route({
      method: 'get',
      path: '/rule-sets',
      summary: 'Rule sets: built-in samples and the lab’s own',
      access: { kind: 'member', roles: READ },
      async handler() {
        const rows = await RuleSet.findAll({ order: [['name', 'ASC'], ['version', 'DESC']] });
        return { items: rows.map(presentRuleSet) };
      },
    }),
    route({
      method: 'get',
      path: '/rule-sets/:id',
      summary: 'One rule set',
      access: { kind: 'member', roles: READ },
      async handler(ctx) {
        const r = await RuleSet.findByPk(ctx.params.id);
        if (!r) throw notFound('The rule set');
        return presentRuleSet(r);
      },
    }),
  ];
}
