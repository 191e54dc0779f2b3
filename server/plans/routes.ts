import { Device, RuleSet, TestCase, TestPlan } from '../db/models';
import { route, type RouteDef } from '../http/route';
import { notFound, validationFailed } from '../http/problem';
import { page, readListQuery } from '../http/list-query';
import { createPlanSchema, type CreatePlanBody } from '../../shared/schemas/records';
import { audit } from '../audit/audit';

export function presentTestCase(c: TestCase) {
  return { id: c.id, position: c.position, kind: c.kind, label: c.label, parameters: c.parameters };
}

export async function presentPlan(p: TestPlan, cases?: TestCase[]) {
  const rows = cases ?? (await TestCase.findAll({ where: { planId: p.id }, order: [['position', 'ASC']] }));
  return { id: p.id, name: p.name, deviceId: p.deviceId, ruleSetId: p.ruleSetId, ruleSet: p.ruleSetSnapshot, testCases: rows.map(presentTestCase), createdAt: p.createdAt.toISOString() };
}

const READ = ['lab-admin', 'engineer', 'reviewer', 'billing'] as const;

export function planRoutes(): RouteDef[] {
  return [
    route({
      method: 'get',
      path: '/plans',
      summary: 'List test plans',
      access: { kind: 'member', roles: READ },
      async handler(ctx) {
        const q = readListQuery(ctx.query, { sortable: ['name', 'createdAt'], filterable: ['deviceId'], defaultSort: '-createdAt' });
        const where = q.filter.deviceId ? { deviceId: q.filter.deviceId } : {};
        const { rows, count } = await TestPlan.findAndCountAll({ where: { ...where, organizationId: ctx.organizationId! }, order: [[q.sort, q.direction]], limit: q.pageSize, offset: (q.page - 1) * q.pageSize });
        return page(rows.map((p) => ({ id: p.id, name: p.name, deviceId: p.deviceId, ruleSetId: p.ruleSetId, ruleSetName: (p.ruleSetSnapshot as { name?: string }).name ?? null, createdAt: p.createdAt.toISOString() })), count, q);
      },
    }),
    route({
      method: 'get',
      path: '/plans/:id',
      summary: 'One test plan with its test cases',
      access: { kind: 'member', roles: READ },
      async handler(ctx) {
        const p = await TestPlan.findByPk(ctx.params.id);
        if (!p) throw notFound('The test plan');
        return presentPlan(p);
      },
    }),
    route<CreatePlanBody>({
      method: 'post',
      path: '/plans',
      summary: 'Build a test plan from a device, a rule set and test points',
      access: { kind: 'member', roles: ['lab-admin', 'engineer'] },
      bodySchema: createPlanSchema,
      async handler(ctx) {
        const b = ctx.body;
        const device = await Device.findByPk(b.deviceId);
        if (!device) throw validationFailed('The device does not exist.', [{ pointer: '/deviceId', message: 'is not one of your devices' }]);
        const ruleSet = await RuleSet.findByPk(b.ruleSetId);
        if (!ruleSet) throw validationFailed('The rule set does not exist.', [{ pointer: '/ruleSetId', message: 'is not an available rule set' }]);
        b.testPoints.forEach((tp, i) => {
          if (tp.frequencyHz < device.frequencyMinHz || tp.frequencyHz > device.frequencyMaxHz) {
            throw validationFailed(`Test point ${i + 1} is outside the device's frequency range.`, [{ pointer: `/testPoints/${i}/frequencyHz`, message: 'is outside the device’s range' }]);
          }
          if (!device.modes.includes(tp.sideband)) {
            throw validationFailed(`Test point ${i + 1} uses ${tp.sideband}, which the device does not have.`, [{ pointer: `/testPoints/${i}/sideband`, message: 'is not a mode of the device' }]);
          }
        });
        // The plan keeps a snapshot: later edits to the rule set never change this plan's limits.
        const plan = await TestPlan.create({
          organizationId: ctx.organizationId!,
          deviceId: device.id,
          ruleSetId: ruleSet.id,
          ruleSetSnapshot: { ...ruleSet.body, name: ruleSet.name, version: ruleSet.version, key: ruleSet.key } as TestPlan['ruleSetSnapshot'],
          name: b.name,
        });
        const cases = await TestCase.bulkCreate(
          b.testPoints.map((tp, i) => ({
            organizationId: ctx.organizationId!,
            planId: plan.id,
            position: i + 1,
            kind: tp.kind,
            label: tp.label,
            parameters: { frequencyHz: tp.frequencyHz, sideband: tp.sideband, powerLevel: tp.powerLevel ?? null },
          })),
          { returning: true },
        );
        await audit(ctx, { action: 'create', entity: 'test-plan', entityId: plan.id, after: { name: plan.name, deviceId: plan.deviceId, ruleSetId: plan.ruleSetId, cases: cases.length } });
        return presentPlan(plan, cases);
      },
    }),
  ];
}
