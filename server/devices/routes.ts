import { Op } from 'sequelize';
import { Client, Device } from '../db/models';
import { route, type RouteDef } from '../http/route';
import { notFound, validationFailed } from '../http/problem';
import { page, readListQuery } from '../http/list-query';
import { createDeviceSchema, type CreateDeviceBody } from '../../shared/schemas/records';
import { parseEmissionDesignator } from '../../shared/bandwidth/emission-designator';
import { audit } from '../audit/audit';

export function presentDevice(d: Device) {
  return {
    id: d.id,
    clientId: d.clientId,
    manufacturer: d.manufacturer,
    model: d.model,
    serialNumber: d.serialNumber,
    firmware: d.firmware,
    ratedPepW: d.ratedPepW,
    emissionDesignator: d.emissionDesignator,
    frequencyMinHz: d.frequencyMinHz,
    frequencyMaxHz: d.frequencyMaxHz,
    modes: d.modes,
    receivedOn: d.receivedOn,
    condition: d.condition,
    createdAt: d.createdAt.toISOString(),
  };
}

const READ = ['lab-admin', 'engineer', 'reviewer', 'billing'] as const;

export function deviceRoutes(): RouteDef[] {
  return [
    route({
      method: 'get',
      path: '/devices',
      summary: 'List devices under test',
      access: { kind: 'member', roles: READ },
      async handler(ctx) {
        const q = readListQuery(ctx.query, { sortable: ['model', 'manufacturer', 'createdAt', 'receivedOn'], filterable: ['search', 'clientId'], defaultSort: '-createdAt' });
        const where: Record<string | symbol, unknown> = {};
        if (q.filter.clientId) where.clientId = q.filter.clientId;
        if (q.filter.search) {
          const like = `%${q.filter.search.replace(/[%_\\]/g, '\\$&')}%`;
          where[Op.or] = [{ model: { [Op.iLike]: like } }, { manufacturer: { [Op.iLike]: like } }, { serialNumber: { [Op.iLike]: like } }];
        }
        const { rows, count } = await Device.findAndCountAll({ where, order: [[q.sort, q.direction]], limit: q.pageSize, offset: (q.page - 1) * q.pageSize });
        return page(rows.map(presentDevice), count, q);
      },
    }),
    route({
      method: 'get',
      path: '/devices/:id',
      summary: 'One device under test',
      access: { kind: 'member', roles: READ },
      async handler(ctx) {
        const d = await Device.findByPk(ctx.params.id);
        if (!d) throw notFound('The device');
        return presentDevice(d);
      },
    }),
    route<CreateDeviceBody>({
      method: 'post',
      path: '/devices',
      summary: 'Register a device under test',
      access: { kind: 'member', roles: ['lab-admin', 'engineer'] },
      bodySchema: createDeviceSchema,
      async handler(ctx) {
        const b = ctx.body;
        if (b.frequencyMaxHz < b.frequencyMinHz) {
          throw validationFailed('The highest frequency is below the lowest.', [{ pointer: '/frequencyMaxHz', message: 'must be at least the lowest frequency' }]);
        }
        try {
          parseEmissionDesignator(b.emissionDesignator);
        } catch (error) {
          throw validationFailed(`The emission designator is not valid: ${(error as Error).message}`, [{ pointer: '/emissionDesignator', message: 'is not a valid designator such as 2K70J3E' }]);
        }
        if (!(await Client.findByPk(b.clientId))) {
          throw validationFailed('The client does not exist.', [{ pointer: '/clientId', message: 'is not one of your clients' }]);
        }
        const d = await Device.create({ ...b, firmware: b.firmware ?? null, condition: b.condition || 'As received, no visible damage', organizationId: ctx.organizationId! });
        await audit(ctx, { action: 'create', entity: 'device', entityId: d.id, after: presentDevice(d) });
        return presentDevice(d);
      },
    }),
  ];
}
