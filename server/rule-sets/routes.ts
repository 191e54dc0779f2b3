import { literal, Op, type WhereOptions } from 'sequelize';
import { RuleSet } from '../db/models';
import { route, type RouteDef } from '../http/route';
import { badRequest } from '../http/problem';
import { page, readListQuery } from '../http/list-query';
import { copyRuleSetSchema, editRuleSetSchema, type CopyRuleSetBody, type EditRuleSetBody } from '../../shared/schemas/rule-set';
import { copyRuleSet, loadRuleSet, newRuleSetVersion, presentRuleSet } from './rule-set-versions';

export { presentRuleSet };

const READ = ['lab-admin', 'engineer', 'reviewer', 'billing'] as const;
const WRITE = ['lab-admin', 'engineer'] as const;

/**
 * Ids of the latest version of each (organization, key). DISTINCT ON walks the unique index
 * (organization_id, key, version); row-level security limits it to the samples and the lab's own.
 */
const LATEST_IDS = literal('(SELECT DISTINCT ON (organization_id, key) id FROM rule_sets ORDER BY organization_id, key, version DESC)');

export function ruleSetRoutes(): RouteDef[] {
  return [
    route({
      method: 'get',
      path: '/rule-sets',
      summary: 'Rule sets: built-in samples and the lab’s own (?latest=true for the latest version of each)',
      access: { kind: 'member', roles: READ },
      async handler(ctx) {
        const q = readListQuery(ctx.query, { sortable: ['name', 'key', 'version', 'createdAt'], filterable: ['latest', 'service', 'key', 'search'], defaultSort: 'name' });
        if (q.filter.latest !== undefined && !['true', 'false'].includes(q.filter.latest)) throw badRequest('latest must be true or false.');
        const and: WhereOptions[] = [];
        if (q.filter.latest === 'true') and.push({ id: { [Op.in]: LATEST_IDS } });
        if (q.filter.service) and.push({ service: q.filter.service });
        if (q.filter.key) and.push({ key: q.filter.key });
        if (q.filter.search) and.push({ name: { [Op.iLike]: `%${q.filter.search.replace(/[%_\\]/g, '\\$&')}%` } });
        const { rows, count } = await RuleSet.findAndCountAll({
          where: { [Op.and]: and },
          order: [[q.sort, q.direction], ['version', 'DESC'], ['id', 'ASC']],
          limit: q.pageSize,
          offset: (q.page - 1) * q.pageSize,
        });
        return page(rows.map(presentRuleSet), count, q);
      },
    }),
    route({
      method: 'get',
      path: '/rule-sets/:id',
      summary: 'One rule set',
      access: { kind: 'member', roles: READ },
      async handler(ctx) {
        return presentRuleSet(await loadRuleSet(ctx.params.id));
      },
    }),
    route<CopyRuleSetBody>({
      method: 'post',
      path: '/rule-sets/:id/copy',
      summary: 'Copy a rule set (a built-in sample or one of the lab’s) into a new rule set of the lab, version 1',
      access: { kind: 'member', roles: WRITE },
      bodySchema: copyRuleSetSchema,
      async handler(ctx) {
        return presentRuleSet(await copyRuleSet(ctx, await loadRuleSet(ctx.params.id), ctx.body.name));
      },
    }),
    route<EditRuleSetBody>({
      method: 'put',
      path: '/rule-sets/:id',
      summary: 'Edit a lab rule set: stores a new version (same key, version + 1); earlier versions and plans made from them never change',
      access: { kind: 'member', roles: WRITE },
      bodySchema: editRuleSetSchema,
      async handler(ctx) {
        ctx.status(201);
        return presentRuleSet(await newRuleSetVersion(ctx, await loadRuleSet(ctx.params.id), ctx.body));
      },
    }),
  ];
}
