/**
 * The equipment register (ISO/IEC 17025:2017 6.4.13, from memory): each instrument with its calibration dates,
 * certificate and the uncertainty contributions it brings to a measurement. Lab admins and
 * engineers keep it; every lab role reads it.
 */
import { Op, UniqueConstraintError, type WhereOptions } from 'sequelize';
import { Instrument } from '../db/models';
import { route, type RouteDef } from '../http/route';
import { badRequest, conflict, notFound } from '../http/problem';
import { page, readListQuery } from '../http/list-query';
import { CALIBRATION_STATUSES, instrumentSchema, type CalibrationStatus, type InstrumentBody } from '../../shared/schemas/instruments';
import { audit } from '../audit/audit';
import { addDaysIso, CALIBRATION_DUE_SOON_DAYS, todayIso } from './calibration-status';
import { checkInstrument } from './instrument-checks';
import { auditedInstrument, presentInstrument } from './instrument-presenter';

const READ = ['lab-admin', 'engineer', 'reviewer', 'billing'] as const;
const WRITE = ['lab-admin', 'engineer'] as const;

/** The calibration_due range each status covers on `today` (see calibration-status.ts). */
function statusWhere(status: CalibrationStatus, today: string): WhereOptions {
  const soon = addDaysIso(today, CALIBRATION_DUE_SOON_DAYS);
  if (status === 'overdue') return { calibrationDue: { [Op.lt]: today } };
  if (status === 'due-soon') return { calibrationDue: { [Op.gte]: today, [Op.lte]: soon } };
  return { calibrationDue: { [Op.gt]: soon } };
}

async function saveInstrument(write: () => Promise<Instrument>, body: InstrumentBody): Promise<Instrument> {
  try {
    return await write();
  } catch (error) {
    if (error instanceof UniqueConstraintError) {
      throw conflict(`The register already holds a ${body.model} with serial number ${body.serialNumber}.`, { code: 'instrument-exists' });
    }
    throw error;
  }
}

async function loadInstrument(id: string): Promise<Instrument> {
  const i = await Instrument.findByPk(id);
  if (!i) throw notFound('The instrument');
  return i;
}

export function instrumentRoutes(): RouteDef[] {
  return [
    route({
      method: 'get',
      path: '/instruments',
      summary: 'The equipment register with calibration status (valid, due-soon, overdue), paginated, sortable and filterable',
      access: { kind: 'member', roles: READ },
      async handler(ctx) {
        const q = readListQuery(ctx.query, { sortable: ['name', 'model', 'serialNumber', 'calibratedOn', 'calibrationDue', 'createdAt'], filterable: ['status', 'search'], defaultSort: 'calibrationDue' });
        const statuses = q.filter.status?.split(',') ?? [];
        const unknown = statuses.find((s) => !(CALIBRATION_STATUSES as readonly string[]).includes(s));
        if (unknown !== undefined) throw badRequest(`Unknown calibration status "${unknown}". Use ${CALIBRATION_STATUSES.join(', ')}.`);
        const today = todayIso();
        // organization_id is named as well as enforced by row-level security, so the planner can use the index that leads with it.
        const and: WhereOptions[] = [{ organizationId: ctx.organizationId! }];
        if (statuses.length) and.push({ [Op.or]: statuses.map((s) => statusWhere(s as CalibrationStatus, today)) });
        if (q.filter.search) {
          const like = `%${q.filter.search.replace(/[%_\\]/g, '\\$&')}%`;
          and.push({ [Op.or]: [{ name: { [Op.iLike]: like } }, { model: { [Op.iLike]: like } }, { serialNumber: { [Op.iLike]: like } }, { certificateRef: { [Op.iLike]: like } }] });
        }
        const { rows, count } = await Instrument.findAndCountAll({ where: { [Op.and]: and }, order: [[q.sort, q.direction], ['id', 'ASC']], limit: q.pageSize, offset: (q.page - 1) * q.pageSize });
        return page(rows.map((i) => presentInstrument(i, today)), count, q);
      },
    }),
    route({
      method: 'get',
      path: '/instruments/:id',
      summary: 'One instrument of the register',
      access: { kind: 'member', roles: READ },
      async handler(ctx) {
        return presentInstrument(await loadInstrument(ctx.params.id), todayIso());
      },
    }),
    route<InstrumentBody>({
      method: 'post',
      path: '/instruments',
      summary: 'Add an instrument to the register',
      access: { kind: 'member', roles: WRITE },
      bodySchema: instrumentSchema,
      async handler(ctx) {
        const today = todayIso();
        checkInstrument(ctx.body, today);
        const i = await saveInstrument(() => Instrument.create({ ...ctx.body, organizationId: ctx.organizationId! }), ctx.body);
        await audit(ctx, { action: 'create', entity: 'instrument', entityId: i.id, after: auditedInstrument(i) });
        return presentInstrument(i, today);
      },
    }),
    route<InstrumentBody>({
      method: 'put',
      path: '/instruments/:id',
      summary: 'Replace an instrument record (a new calibration, a corrected certificate); audited with before and after',
      access: { kind: 'member', roles: WRITE },
      bodySchema: instrumentSchema,
      async handler(ctx) {
        const today = todayIso();
        const i = await loadInstrument(ctx.params.id);
        checkInstrument(ctx.body, today);
        const before = auditedInstrument(i);
        // Results already stored keep the budget they were computed with; only later evaluations see the change.
        await saveInstrument(() => i.update({ ...ctx.body }), ctx.body);
        await audit(ctx, { action: 'update', entity: 'instrument', entityId: i.id, before, after: auditedInstrument(i) });
        return presentInstrument(i, today);
      },
    }),
  ];
}
