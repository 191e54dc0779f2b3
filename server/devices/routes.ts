import { Op } from 'sequelize';
import { Device } from '../db/models';
import { route, type RouteDef } from '../http/route';
import { conflict, notFound } from '../http/problem';
import { page, readListQuery } from '../http/list-query';
import { createDeviceSchema, type CreateDeviceBody } from '../../shared/schemas/records';
import { audit } from '../audit/audit';
import { checkDevice } from './device-checks';
import { issuedReportOfDevice } from './issued-report-of-device';

/** How a report identifies the item tested (ISO/IEC 17025:2017 7.8.2.1 g): fixed once a report is issued. */
const IDENTIFICATION = ['manufacturer', 'model', 'serialNumber'] as const;

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
        const { rows, count } = await Device.findAndCountAll({ where: { ...where, organizationId: ctx.organizationId! }, order: [[q.sort, q.direction]], limit: q.pageSize, offset: (q.page - 1) * q.pageSize });
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
        await checkDevice(b);
        const d = await Device.create({ ...b, firmware: b.firmware ?? null, condition: b.condition || 'As received, no visible damage', organizationId: ctx.organizationId! });
        await audit(ctx, { action: 'create', entity: 'device', entityId: d.id, after: presentDevice(d) });
        return presentDevice(d);
      },
    }),
    route<CreateDeviceBody>({
      method: 'put',
      path: '/devices/:id',
      summary: 'Replace a device record; once a report is issued on it, its manufacturer, model and serial number stay as issued',
      access: { kind: 'member', roles: ['lab-admin', 'engineer'] },
      bodySchema: createDeviceSchema,
      async handler(ctx) {
        const d = await Device.findByPk(ctx.params.id);
        if (!d) throw notFound('The device');
        const b = ctx.body;
        await checkDevice(b);
        const changed = IDENTIFICATION.filter((field) => b[field] !== d[field]);
        if (changed.length) {
          const reportNumber = await issuedReportOfDevice(ctx.organizationId!, d.id);
          if (reportNumber) {
            throw conflict(`Report ${reportNumber} was issued on this device, so its ${changed.join(', ')} must stay as issued. Register the item again if it really is a different one.`, { code: 'device-identification-locked' });
          }
        }
        const before = presentDevice(d);
        await d.update({ ...b, firmware: b.firmware ?? null, condition: b.condition || 'As received, no visible damage' });
        await audit(ctx, { action: 'update', entity: 'device', entityId: d.id, before, after: presentDevice(d) });
        return presentDevice(d);
      },
    }),
  ];
}
