import { Op } from 'sequelize';
import { Client } from '../db/models';
import { route, type RouteDef } from '../http/route';
import { notFound } from '../http/problem';
import { page, readListQuery } from '../http/list-query';
import { createClientSchema, type CreateClientBody } from '../../shared/schemas/records';
import { audit } from '../audit/audit';

export function presentClient(c: Client) {
  return {
    id: c.id,
    name: c.name,
    addressLines: c.addressLines,
    contactName: c.contactName,
    contactEmail: c.contactEmail,
    invoiceLater: c.invoiceLater,
    clientOrganizationId: c.clientOrganizationId,
    createdAt: c.createdAt.toISOString(),
  };
}

const READ = ['lab-admin', 'engineer', 'reviewer', 'billing'] as const;

export function clientRoutes(): RouteDef[] {
  return [
    route({
      method: 'get',
      path: '/clients',
      summary: 'List the lab’s clients',
      access: { kind: 'member', roles: READ },
      async handler(ctx) {
        const q = readListQuery(ctx.query, { sortable: ['name', 'createdAt'], filterable: ['search'], defaultSort: 'name' });
        const where = q.filter.search ? { name: { [Op.iLike]: `%${q.filter.search.replace(/[%_\\]/g, '\\$&')}%` } } : {};
        const { rows, count } = await Client.findAndCountAll({ where: { ...where, organizationId: ctx.organizationId! }, order: [[q.sort, q.direction]], limit: q.pageSize, offset: (q.page - 1) * q.pageSize });
        return page(rows.map(presentClient), count, q);
      },
    }),
    route({
      method: 'get',
      path: '/clients/:id',
      summary: 'One client',
      access: { kind: 'member', roles: READ },
      async handler(ctx) {
        const c = await Client.findByPk(ctx.params.id);
        if (!c) throw notFound('The client');
        return presentClient(c);
      },
    }),
    route<CreateClientBody>({
      method: 'post',
      path: '/clients',
      summary: 'Add a client',
      access: { kind: 'member', roles: ['lab-admin', 'engineer'] },
      bodySchema: createClientSchema,
      async handler(ctx) {
        const c = await Client.create({ ...ctx.body, organizationId: ctx.organizationId! });
        await audit(ctx, { action: 'create', entity: 'client', entityId: c.id, after: presentClient(c) });
        return presentClient(c);
      },
    }),
    route<CreateClientBody>({
      method: 'put',
      path: '/clients/:id',
      summary: 'Replace a client record; audited with before and after (issued reports keep the details they were issued with)',
      access: { kind: 'member', roles: ['lab-admin', 'engineer'] },
      bodySchema: createClientSchema,
      async handler(ctx) {
        const c = await Client.findByPk(ctx.params.id);
        if (!c) throw notFound('The client');
        const before = presentClient(c);
        // invoiceLater is optional in the body; leaving it out keeps the lab's billing choice as it was.
        await c.update({ ...ctx.body, invoiceLater: ctx.body.invoiceLater ?? c.invoiceLater });
        await audit(ctx, { action: 'update', entity: 'client', entityId: c.id, before, after: presentClient(c) });
        return presentClient(c);
      },
    }),
  ];
}
