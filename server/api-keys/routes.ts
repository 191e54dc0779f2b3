/** A lab's bench-automation API keys: made by a lab administrator, shown once, revocable. */
import { Op } from 'sequelize';
import { ApiKey } from '../db/models';
import { route, type RouteDef } from '../http/route';
import { page, readListQuery } from '../http/list-query';
import { badRequest, notFound } from '../http/problem';
import { audit } from '../audit/audit';
import { createApiKeySchema, type CreateApiKeyBody } from '../../shared/schemas/accounts';
import { isUuid } from '../accounts/is-uuid';
import { generateApiKey } from './api-key-secret';
import { presentApiKey } from './api-key-presenter';

export function apiKeyRoutes(): RouteDef[] {
  return [
    route<CreateApiKeyBody>({
      method: 'post',
      path: '/api-keys',
      summary: 'Make an API key for bench automation; the key is in this answer only',
      access: { kind: 'member', roles: ['lab-admin'] },
      bodySchema: createApiKeySchema,
      async handler(ctx) {
        const { key, prefix, keyHash } = generateApiKey();
        const row = await ApiKey.create({ organizationId: ctx.organizationId!, name: ctx.body.name.trim(), prefix, keyHash, createdBy: ctx.principal!.userId });
        await audit(ctx, { action: 'create', entity: 'api-key', entityId: row.id, after: presentApiKey(row) });
        return { ...presentApiKey(row), key };
      },
    }),
    route({
      method: 'get',
      path: '/api-keys',
      summary: 'The lab’s API keys (prefix, name, last use, revocation), paginated',
      access: { kind: 'member', roles: ['lab-admin'] },
      async handler(ctx) {
        const q = readListQuery(ctx.query, { sortable: ['createdAt', 'name', 'lastUsedAt'], filterable: ['state'], defaultSort: '-createdAt' });
        const state = q.filter.state;
        if (state && state !== 'active' && state !== 'revoked') throw badRequest('state must be "active" or "revoked".');
        const where = state === 'active' ? { revokedAt: { [Op.is]: null } } : state === 'revoked' ? { revokedAt: { [Op.ne]: null } } : {};
        const { rows, count } = await ApiKey.findAndCountAll({
          where: { ...where, organizationId: ctx.organizationId! },
          order: [[q.sort, q.direction], ['id', 'ASC']],
          limit: q.pageSize,
          offset: (q.page - 1) * q.pageSize,
        });
        return page(rows.map(presentApiKey), count, q);
      },
    }),
    route({
      method: 'delete',
      path: '/api-keys/:id',
      summary: 'Revoke an API key (calls with it are refused from now on)',
      access: { kind: 'member', roles: ['lab-admin'] },
      async handler(ctx) {
        const row = isUuid(ctx.params.id) ? await ApiKey.findOne({ where: { id: ctx.params.id, organizationId: ctx.organizationId! } }) : null;
        if (!row) throw notFound('The API key');
        if (!row.revokedAt) {
          const before = presentApiKey(row);
          await row.update({ revokedAt: new Date() });
          await audit(ctx, { action: 'revoke', entity: 'api-key', entityId: row.id, before, after: presentApiKey(row) });
        }
        ctx.status(204);
        return undefined;
      },
    }),
  ];
}
